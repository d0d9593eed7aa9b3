# Reference values for AdjustedComparisonReferenceTests (tests/YieldBench.Core.Tests/Review).
# Produced with Debian 12 r-base-core 4.2.2 and MASS 7.3-58.2 (apt-get install -y r-base-core r-cran-mass):
#   Rscript adjusted-comparison.R
# The adjusted strain comparison of docs/methods.md Part 2 §6: Huber M-regression (MASS rlm defaults, k = 1.345) of
# final alcohol on (starting °Brix - median °Brix), strain and vessel; each strain's predicted alcohol at the median
# °Brix and the lots' vessel mix, divided by the median °Brix, with Student-t 95 % intervals from summary(fit) (stddev^2 * cov.unscaled, method "XtX").
library(MASS)
d <- data.frame(
  strain = rep(c("Y-A", "Y-B", "Y-C"), each = 7),
  vessel = rep(c("tank", "tank", "barrel", "tank", "barrel", "tank", "barrel"), 3),
  brix = c(22.1, 23.4, 24.0, 21.6, 25.2, 23.0, 24.6,
           23.8, 22.7, 25.5, 24.1, 21.9, 26.0, 23.3,
           21.4, 22.8, 23.6, 24.4, 22.2, 25.0, 23.9),
  abv  = c(12.86, 13.70, 14.05, 12.52, 14.80, 13.43, 14.41,
           14.20, 13.49, 15.30, 14.40, 13.05, 15.62, 13.40,
           12.15, 12.98, 13.50, 13.96, 12.64, 14.35, 13.71))
d$strain <- factor(d$strain, levels = c("Y-A", "Y-B", "Y-C"))
d$vessel <- factor(d$vessel, levels = c("barrel", "tank"))
ref <- median(d$brix)
fit <- rlm(abv ~ I(brix - ref) + strain + vessel, data = d)
s <- summary(fit); V <- s$stddev^2 * s$cov.unscaled; b <- coef(fit); n <- nrow(d); p <- length(b)
q <- qt(0.975, n - p); share <- mean(d$vessel == "tank")
L <- rbind("Y-A" = c(1, 0, 0, 0, share), "Y-B" = c(1, 0, 1, 0, share), "Y-C" = c(1, 0, 0, 1, share))
cat(sprintf("reference brix %.15g\n", ref))
for (s in rownames(L)) {
  e <- sum(L[s, ] * b); se <- sqrt(drop(t(L[s, ]) %*% V %*% L[s, ]))
  cat(sprintf("%s predicted %.12f factor %.12f low %.12f high %.12f\n", s, e, e / ref, (e - q * se) / ref, (e + q * se) / ref))
}
pairs <- list(c("Y-A", "Y-B"), c("Y-A", "Y-C"), c("Y-B", "Y-C"))
for (pr in pairs) {
  l <- L[pr[1], ] - L[pr[2], ]; e <- sum(l * b); se <- sqrt(drop(t(l) %*% V %*% l))
  cat(sprintf("%s - %s difference %.12f low %.12f high %.12f\n", pr[1], pr[2], e, e - q * se, e + q * se))
}
