# Recomputes the review's robust group summaries and its strain comparison (docs/methods.md Part 2, sections 2, 3 and
# 6) in R from the per-lot values, not from the tool's code.
# Produced with Debian 12 R 4.2.2 Patched r83330 and robustbase 0.95-0 (apt-get install -y r-base-core r-cran-robustbase),
# from tests/YieldBench.Core.Tests/Fixtures/strain-review-audit:
#   Rscript ../strain-review-audit.R demo-values.csv > demo-expected.csv
#   Rscript ../strain-review-audit.R brackenfold-values.csv > brackenfold-expected.csv
# The values files hold each lot's season, strain, vessel, variety, residual sugar, effective starting °Brix and four
# measures as the review computes them, written to 17 digits by strain-review-values.run.cs (its header gives the
# commands; how each measure is computed is checked on its own in Part 1's tests). Output lines:
# kind,grouping,group,measure,statistic,value. Held to the tool by tests/YieldBench.Cli.Tests/StrainReviewAuditTests.cs.
suppressMessages(library(robustbase))
args <- commandArgs(trailingOnly = TRUE)
d <- read.csv(args[1], stringsAsFactors = FALSE, check.names = FALSE, encoding = "UTF-8")
out <- function(...) cat(paste(..., sep = ","), "\n", sep = "")
num <- function(v) trimws(formatC(v, digits = 15, format = "g"))
K <- 1.482602218505602                  # 1 / qnorm(3/4), the MAD's normal consistency factor
# Qn from its definition (Rousseeuw & Croux 1993): the k-th smallest |xi - xj|, i < j, k = choose(n %/% 2 + 1, 2), times
# 2.21914 and robustbase's small-sample factor. robustbase 0.95-0's Qn() returns that order statistic rounded to single
# precision in some samples (8 of 200 normal samples of 13-80 values here; 0.12927262485027313 for 0.12927262624481628
# on the demo's YB-R12 sugar_gl_per_abv), so both are written: qn (robustbase) and qn_exact (this).
qn_exact <- function(x) {
  n <- length(x); if (n < 2) return(0)
  r <- 2.21914 * sort(as.vector(dist(x)))[choose(n %/% 2 + 1, 2)]
  if (n <= 12) r * c(0.399356, 0.99365, 0.51321, 0.84401, 0.6122, 0.85877, 0.66993, 0.87344, 0.72014, 0.88906, 0.75743)[n - 1]
  else r / robustbase:::Qn.finite.c(n)
}
band <- function(b) ifelse(b < 21, "<21", ifelse(b < 23, "21\u201323", ifelse(b < 25, "23\u201325", ifelse(b < 27, "25\u201327", "\u226527"))))
groupings <- list(
  "strain" = d$strain, "vessel" = d$vessel, "starting sugar band" = band(d$effective_brix), "variety" = d$variety,
  "season" = as.character(d$season), "strain \u00d7 vessel" = paste(d$strain, "\u00d7", d$vessel),
  "strain \u00d7 season" = paste(d$strain, "\u00d7", d$season))
measures <- c("abv_per_brix", "abv_per_brix_fermented", "sugar_gl_per_abv", "gay_lussac_efficiency")
for (g in names(groupings)) for (grp in sort(unique(groupings[[g]]))) for (m in measures) {
  x <- d[[m]][groupings[[g]] == grp]; x <- x[is.finite(x)]
  n <- length(x); if (n == 0) next
  q <- quantile(x, c(0.25, 0.75), type = 7, names = FALSE)
  s <- mad(x, constant = K)
  hub <- if (s == 0) median(x) else huberM(x, k = 1.345, s = s)$mu
  st <- c(n = n, median = median(x), mad = s, qn = if (n > 1) Qn(x) else 0, qn_exact = qn_exact(x), sn = if (n > 1) Sn(x) else 0,
          q1 = q[1], q3 = q[2], iqr = q[2] - q[1], mean = mean(x), sd = if (n > 1) sd(x) else NA,
          trimmed_mean = mean(x, trim = 0.2), huber = hub, min = min(x), max = max(x))
  for (k in names(st)) out("group", g, grp, m, k, num(st[[k]]))
}
# The strain comparison: the factor judged is abv_per_brix for a dry lot (residual sugar <= 4 g/L or not recorded),
# else abv_per_brix_fermented; strains with at least 5 lots with a factor, in ordinal (C locale) order.
f <- ifelse(is.na(d$residual_sugar_gl) | d$residual_sugar_gl <= 4, d$abv_per_brix, d$abv_per_brix_fermented)
ok <- is.finite(f)
strains <- sort(unique(d$strain[ok]), method = "radix")
strains <- strains[sapply(strains, function(s) sum(ok & d$strain == s)) >= 5]
fx <- lapply(strains, function(s) f[ok & d$strain == s])
kw <- kruskal.test(fx)
out("kruskal", "", "", "factor", "H", num(unname(kw$statistic))); out("kruskal", "", "", "factor", "p", num(kw$p.value))
pairs <- list(); p <- c()
for (i in seq_along(strains)) for (j in seq_along(strains)) if (i < j) {
  a <- fx[[i]]; b <- fx[[j]]; n1 <- length(a); n2 <- length(b); N <- n1 + n2
  D <- sort(as.vector(outer(a, b, "-")))
  t <- table(c(a, b)); sigma <- sqrt(n1 * n2 / 12 * ((N + 1) - sum(t^3 - t) / (N * (N - 1))))
  ties <- any(t > 1)
  if (n1 <= 8 && n2 <= 8 && !ties) { qq <- max(1, qwilcox(0.025, n1, n2)) } else { qq <- max(1, ceiling(n1 * n2 / 2 - 0.5 - qnorm(0.975) * sigma)) }
  w <- suppressWarnings(wilcox.test(a, b, exact = (n1 <= 8 && n2 <= 8 && !ties), correct = TRUE))
  pairs[[length(pairs) + 1]] <- c(strains[i], strains[j], median(D), D[qq], D[n1 * n2 + 1 - qq], w$p.value)
  p <- c(p, w$p.value)
}
holm <- p.adjust(p, "holm")
for (k in seq_along(pairs)) {
  r <- pairs[[k]]; key <- paste(r[1], "vs", r[2])
  out("pair", "", key, "factor", "shift", num(as.numeric(r[3]))); out("pair", "", key, "factor", "low", num(as.numeric(r[4])))
  out("pair", "", key, "factor", "high", num(as.numeric(r[5]))); out("pair", "", key, "factor", "p", num(as.numeric(r[6])))
  out("pair", "", key, "factor", "holm", num(holm[k]))
}
# The adjusted comparison (Part 2 §6; MASS rlm defaults, Huber k 1.345, as adjusted-comparison.R): the compared strains'
# dry lots whose factor is within 0.50-0.68 and not above the Gay-Lussac yield; final alcohol on (effective °Brix - their
# median), strain and, when every vessel type has at least 5 of them, vessel (first level in ordinal order the
# baseline) unless it is confounded with strain; each strain at the median sugar and the lots' vessel mix, divided by the median; Student-t 95 % intervals
# from summary(fit) (stddev^2 * cov.unscaled); every pair's difference at the same sugar and vessel mix.
suppressMessages(library(MASS))
dry <- is.na(d$residual_sugar_gl) | d$residual_sugar_gl <= 4
u <- d[ok & dry & d$strain %in% strains & f >= 0.50 & f <= 0.68 & !(d$gay_lussac_efficiency > 1), ]
ref <- median(u$effective_brix)
u$strain <- factor(u$strain, levels = strains)
vessels <- sort(unique(u$vessel), method = "radix")
withVessel <- length(vessels) > 1 && !("(not recorded)" %in% vessels) && all(table(u$vessel) >= 5)
u$vessel <- factor(u$vessel, levels = vessels)
if (withVessel) {  # a vessel confounded with strain (each strain in its own vessels) cannot be told apart: left out
  X <- model.matrix(~ I(effective_brix - ref) + strain + vessel, data = u)
  withVessel <- qr(X)$rank == ncol(X)
}
fit <- if (withVessel) rlm(final_abv ~ I(effective_brix - ref) + strain + vessel, data = u) else rlm(final_abv ~ I(effective_brix - ref) + strain, data = u)
s <- summary(fit); V <- s$stddev^2 * s$cov.unscaled; b <- coef(fit); n <- nrow(u); np <- length(b); q <- qt(0.975, n - np)
share <- if (withVessel) sapply(vessels[-1], function(v) mean(u$vessel == v)) else c()
out("adjusted", "", "", "factor", "reference_brix", num(ref)); out("adjusted", "", "", "factor", "lots", n)
out("adjusted", "", "", "factor", "with_vessel", as.integer(withVessel))
row <- function(i) { l <- c(1, 0, rep(0, length(strains) - 1), share); if (i > 1) l[1 + i] <- 1; l }
for (i in seq_along(strains)) {
  l <- row(i); e <- sum(l * b); se <- sqrt(drop(t(l) %*% V %*% l))
  out("adjusted", "", strains[i], "factor", "predicted", num(e)); out("adjusted", "", strains[i], "factor", "factor", num(e / ref))
  out("adjusted", "", strains[i], "factor", "low", num((e - q * se) / ref)); out("adjusted", "", strains[i], "factor", "high", num((e + q * se) / ref))
}
for (i in seq_along(strains)) for (j in seq_along(strains)) if (i < j) {
  l <- row(i) - row(j); e <- sum(l * b); se <- sqrt(drop(t(l) %*% V %*% l)); key <- paste(strains[i], "-", strains[j])
  out("difference", "", key, "abv", "estimate", num(e)); out("difference", "", key, "abv", "low", num(e - q * se)); out("difference", "", key, "abv", "high", num(e + q * se))
}
