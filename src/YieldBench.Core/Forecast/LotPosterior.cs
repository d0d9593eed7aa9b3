namespace YieldBench.Core.Forecast;

/// <summary>
/// One lot's posterior on a grid over (log κ, λ). At every node the sugar readings are linear in the start S0 and the
/// settling point F, and the temperatures linear in the must temperature Ta and the peak P, so those four are
/// integrated in closed form (Gaussian priors; F a two-part mixture: lots that finish and lots that stop short). The
/// grid is laid along the principal axes of the posterior, found in two passes: a coarse grid over the prior, then a
/// fine one over the first pass's posterior. Deterministic: no random draws.
/// </summary>
internal sealed class LotPosterior
{
    private const int CoarseSteps = 2;
    private const double CoarseHalfWidth = 6.0;

    private LotPosterior(LotCourse course, ForecastModel model, RatePrior prior)
    {
        Course = course;
        Model = model;
        Prior = prior;
    }

    public LotCourse Course { get; }

    public ForecastModel Model { get; }

    public RatePrior Prior { get; }

    /// <summary>Prior mean of the lag in the course's own time (from the first reading when no inoculation is recorded).</summary>
    public double LagOffset { get; private set; }

    /// <summary>log of the prior A = S0 − F, linking κ to μm.</summary>
    public double LogA0 { get; private set; }

    public double[] LogKappa { get; private set; } = [];

    public double[] Lag { get; private set; } = [];

    /// <summary>log p(readings | node), S0, F, Ta and P integrated out.</summary>
    public double[] LogLik { get; private set; } = [];

    /// <summary>Parts of the (S0, F) prior at every node: record right or wrong × finishes or stops short.</summary>
    public const int Parts = 4;

    /// <summary>Posterior of (S0, F) per node and part (index node·4 + part).</summary>
    public Gaussian2[] Comp { get; private set; } = [];

    /// <summary>Posterior share of each part at its node (index node·4 + part; the four sum to 1).</summary>
    public double[] CompWeight { get; private set; } = [];

    /// <summary>True for the parts in which the lot stops short of dry.</summary>
    public static bool IsStuckPart(int part) => (part & 1) == 1;

    /// <summary>Parts of the peak prior: the regression's scatter, and a wide part for runaway or held-back ferments.</summary>
    public const int TempParts = 2;

    /// <summary>Posterior of (Ta, P) per node and part (index node·2 + part).</summary>
    public Gaussian2[] Temp { get; private set; } = [];

    /// <summary>Posterior share of each peak part at its node.</summary>
    public double[] TempWeight { get; private set; } = [];

    /// <summary>log of a grid cell's area in (log κ, λ).</summary>
    public double LogCell { get; private set; }

    /// <summary>Extra variance of λ when the origin is the first reading.</summary>
    public double LagExtraVariance { get; private set; }

    public int Nodes => LogKappa.Length;

    public static LotPosterior Build(LotCourse course, ForecastModel model, ForecastSettings settings)
    {
        var prior = model.RatePriorFor(course);
        var post = new LotPosterior(course, model, prior);
        post.Prepare();
        post.LogA0 = Math.Log(Math.Max(0.5, course.StartBrix + model.StartOffset.Mean - model.Final.Mean));
        if (!course.FromInoculation)
        {
            post.LagOffset = model.FirstReadingDelay.Median;
            post.LagExtraVariance = model.FirstReadingDelay.Sd * model.FirstReadingDelay.Sd;
        }

        // Prior in grid coordinates with the season shift integrated: log μ + δ and λ·e^(−δ) ≈ λ − λ·δ.
        double tau2 = model.SeasonSpread * model.SeasonSpread;
        double mk = prior.LogMu - post.LogA0, ml = prior.Lag - post.LagOffset;
        double vkk = prior.Vmm + tau2, vkl = prior.Vml - (prior.Lag * tau2), vll = prior.Vll + post.LagExtraVariance + (prior.Lag * prior.Lag * tau2);
        var marginal = new Gaussian2(mk, ml, vkk, vkl, vll);

        // Find the mode: a coarse scan over the prior, then Nelder–Mead in the prior's standardised coordinates.
        var prAx = Axes(marginal, 1.0, 3);
        (double A, double B) ToGrid(double z1, double z2) => (prAx.Ca + (z1 * prAx.Ua) + (z2 * prAx.Va), prAx.Cb + (z1 * prAx.Ub) + (z2 * prAx.Vb));
        double NegLogPost(double z1, double z2)
        {
            var (a, b) = ToGrid(z1, z2);
            return -(post.LogLikAt(a, b, -1) + post.LogPriorAt(a, b, marginal));
        }

        double bz1 = 0, bz2 = 0, bv = double.PositiveInfinity;
        for (int i = -CoarseSteps; i <= CoarseSteps; i++)
        {
            for (int j = -CoarseSteps; j <= CoarseSteps; j++)
            {
                double z1 = i * CoarseHalfWidth / CoarseSteps, z2 = j * CoarseHalfWidth / CoarseSteps;
                double v = NegLogPost(z1, z2);
                if (v < bv)
                {
                    (bz1, bz2, bv) = (z1, z2, v);
                }
            }
        }

        var (mz1, mz2) = CourseFit.NelderMead(NegLogPost, bz1, bz2, 0.5, 0.5, maxIterations: 120, sizeTolerance: 1e-3, valueTolerance: 1e-6);

        // The curvature at the mode (finite differences, the step shrunk until it is small against the spread found).
        var cov = post.Curvature(NegLogPost, mz1, mz2, out bool ok);
        Gaussian2 around;
        if (ok)
        {
            // Back from standardised to grid coordinates: x = c + U·z.
            double a11 = prAx.Ua, a12 = prAx.Va, a21 = prAx.Ub, a22 = prAx.Vb;
            var (ma, mb) = ToGrid(mz1, mz2);
            double vaa = (a11 * a11 * cov.Vaa) + (2 * a11 * a12 * cov.Vab) + (a12 * a12 * cov.Vbb);
            double vab = (a11 * a21 * cov.Vaa) + (((a11 * a22) + (a12 * a21)) * cov.Vab) + (a12 * a22 * cov.Vbb);
            double vbb = (a21 * a21 * cov.Vaa) + (2 * a21 * a22 * cov.Vab) + (a22 * a22 * cov.Vbb);
            around = new Gaussian2(ma, mb, vaa, vab, vbb);
        }
        else
        {
            var (ma, mb) = ToGrid(mz1, mz2);
            around = marginal with { A = ma, B = mb };
        }

        // The grid: ±GridHalfWidth sd of that Gaussian along its axes; widened once when the outer ring holds mass.
        double width = settings.GridHalfWidth;
        for (int attempt = 0; attempt < 2; attempt++)
        {
            double edge = post.Evaluate(Axes(around, width, settings.GridPoints), marginal);
            if (edge < 1e-3)
            {
                break;
            }

            width *= 1.7;
        }

        return post;
    }

    /// <summary>
    /// The covariance −H⁻¹ of a negative log density at its minimum (z coordinates), by central differences; the step
    /// starts at 0.05 and shrinks to a third of the spread found. ok is false when the curvature is not positive.
    /// </summary>
    private Gaussian2 Curvature(Func<double, double, double> f, double z1, double z2, out bool ok)
    {
        double h = 0.05;
        var result = default(Gaussian2);
        ok = false;
        for (int round = 0; round < 4; round++)
        {
            double f0 = f(z1, z2);
            double haa = (f(z1 + h, z2) - (2 * f0) + f(z1 - h, z2)) / (h * h);
            double hbb = (f(z1, z2 + h) - (2 * f0) + f(z1, z2 - h)) / (h * h);
            double hab = (f(z1 + h, z2 + h) - f(z1 + h, z2 - h) - f(z1 - h, z2 + h) + f(z1 - h, z2 - h)) / (4 * h * h);
            double det = (haa * hbb) - (hab * hab);
            if (!(haa > 0 && det > 0) || !double.IsFinite(det))
            {
                return result;
            }

            result = new Gaussian2(z1, z2, hbb / det, -hab / det, haa / det);
            ok = true;
            double smallest = Math.Sqrt(Math.Min(result.Vaa, result.Vbb));
            if (h <= smallest / 3)
            {
                break;
            }

            h = smallest / 3;
        }

        return result;
    }

    /// <summary>The grid's axes: centre, the two principal directions scaled to ±halfWidth sd, and the step count.</summary>
    private readonly record struct GridAxes(double Ca, double Cb, double Ua, double Ub, double Va, double Vb, int Points, double Step);

    private static GridAxes Axes(Gaussian2 g, double halfWidth, int points)
    {
        // Eigen-decomposition of the 2×2 covariance.
        double tr = g.Vaa + g.Vbb, det = (g.Vaa * g.Vbb) - (g.Vab * g.Vab);
        double disc = Math.Sqrt(Math.Max(0, (tr * tr / 4) - det));
        double l1 = Math.Max((tr / 2) + disc, 1e-12), l2 = Math.Max((tr / 2) - disc, 1e-12);
        double ex, ey;
        if (Math.Abs(g.Vab) > 1e-300)
        {
            (ex, ey) = (l1 - g.Vbb, g.Vab);
        }
        else
        {
            (ex, ey) = g.Vaa >= g.Vbb ? (1.0, 0.0) : (0.0, 1.0);
        }

        double norm = Math.Sqrt((ex * ex) + (ey * ey));
        (ex, ey) = (ex / norm, ey / norm);
        double s1 = Math.Sqrt(l1), s2 = Math.Sqrt(l2);
        double step = 2.0 * halfWidth / (points - 1);
        return new GridAxes(g.A, g.B, ex * s1, ey * s1, -ey * s2, ex * s2, points, step);
    }

    /// <summary>The posterior moments found on a grid, with each principal variance no smaller than a third of the step squared.</summary>
    private static Gaussian2 Floor(Gaussian2 g, double step)
    {
        var ax = Axes(g, 1, 3);
        double s1 = Math.Sqrt((ax.Ua * ax.Ua) + (ax.Ub * ax.Ub)), s2 = Math.Sqrt((ax.Va * ax.Va) + (ax.Vb * ax.Vb));
        double f1 = Math.Max(s1, step / 3) / s1, f2 = Math.Max(s2, step / 3) / s2;
        double ua = ax.Ua * f1, ub = ax.Ub * f1, va = ax.Va * f2, vb = ax.Vb * f2;
        return new Gaussian2(g.A, g.B, (ua * ua) + (va * va), (ua * ub) + (va * vb), (ub * ub) + (vb * vb));
    }

    /// <summary>Evaluates the lot on a grid and keeps it; returns the posterior share (under the marginal prior) on the grid's outer ring.</summary>
    private double Evaluate(GridAxes ax, Gaussian2 marginal)
    {
        int g = ax.Points, n = g * g;
        LogKappa = new double[n];
        Lag = new double[n];
        LogLik = new double[n];
        Comp = new Gaussian2[n * Parts];
        CompWeight = new double[n * Parts];
        Temp = new Gaussian2[n * TempParts];
        TempWeight = new double[n * TempParts];
        double half = (g - 1) / 2.0;
        var logPost = new double[n];
        double max = double.NegativeInfinity;
        for (int i = 0; i < g; i++)
        {
            for (int j = 0; j < g; j++)
            {
                double zi = (i - half) * ax.Step, zj = (j - half) * ax.Step;
                int k = (i * g) + j;
                LogKappa[k] = ax.Ca + (zi * ax.Ua) + (zj * ax.Va);
                Lag[k] = ax.Cb + (zi * ax.Ub) + (zj * ax.Vb);
                LogLik[k] = LogLikAt(LogKappa[k], Lag[k], k);
                logPost[k] = LogLik[k] + LogPriorAt(LogKappa[k], Lag[k], marginal);
                max = Math.Max(max, logPost[k]);
            }
        }

        // |det| of the map from (zi, zj) to (log κ, λ), times the step squared.
        LogCell = Math.Log(Math.Abs((ax.Ua * ax.Vb) - (ax.Va * ax.Ub)) * ax.Step * ax.Step);
        double total = 0, edge = 0;
        for (int i = 0; i < g; i++)
        {
            for (int j = 0; j < g; j++)
            {
                double w = Math.Exp(logPost[(i * g) + j] - max);
                total += w;
                edge += i == 0 || j == 0 || i == g - 1 || j == g - 1 ? w : 0;
            }
        }

        return edge / total;
    }

    // Per-lot constants of the node evaluation.
    private double _sugarVar, _tempVar, _delay, _peakBase, _peakMust, _peakRate, _peakVar;
    private Gaussian2 _mustPrior;
    private readonly Gaussian2[] _startPriors = new Gaussian2[Parts];
    private readonly double[] _logPartWeight = new double[Parts];

    private void Prepare()
    {
        var m = Model;
        var c = Course;
        _sugarVar = SugarVariance(c, m);
        _tempVar = m.TempSd * m.TempSd;
        _delay = m.DelayFor(c);
        var (mt, st) = m.MustTempFor(c);
        _mustPrior = new Gaussian2(mt, 0, st * st, 0, 0);
        _peakBase = m.PeakBase(c);
        _peakMust = m.PeakMustSlope;
        _peakRate = m.PeakRateSlope;
        // The lot's scatter around the peak regression, plus the regression's own uncertainty at the lot's usual must
        // temperature and prior rate (the lot is not one the regression was fitted on).
        _peakVar = m.PeakSdFor(c) * m.PeakSdFor(c) * (1 + m.PeakPredictionShare(c, mt, Prior.LogMu));
        var (off, sd) = m.StartOffsetFor(c);
        double s0 = c.StartBrix + off;
        for (int part = 0; part < Parts; part++)
        {
            bool wrong = part >= 2, stuck = IsStuckPart(part);
            double startVar = wrong ? ForecastModel.WrongStartSd * ForecastModel.WrongStartSd : sd * sd;
            var (fm, fs) = stuck ? m.StuckFinal : m.Final;
            _startPriors[part] = new Gaussian2(s0, fm, startVar, 0, fs * fs);
            _logPartWeight[part] = Math.Log(wrong ? m.WrongStartShare : 1 - m.WrongStartShare) + Math.Log(stuck ? m.StuckShare : 1 - m.StuckShare);
        }
    }

    /// <summary>log p(readings | log κ, λ); with <paramref name="store"/> ≥ 0 the parts' posteriors are kept at that node.</summary>
    private double LogLikAt(double logKappa, double lambda, int store)
    {
        var c = Course;
        var form = Model.Form;
        double kappa = Math.Exp(logKappa);
        var sums = default(LinearSums);
        for (int i = 0; i < c.SugarHours.Length; i++)
        {
            double h = SigmoidShape.Value(form, kappa, lambda, c.SugarHours[i]);
            sums.Add(1.0 - h, h, c.SugarBrix[i]);
        }

        Span<double> logs = stackalloc double[Parts];
        Span<Gaussian2> posts = stackalloc Gaussian2[Parts];
        double top = double.NegativeInfinity;
        for (int part = 0; part < Parts; part++)
        {
            var (post, ev) = sums.Update(_startPriors[part], _sugarVar);
            posts[part] = post;
            logs[part] = _logPartWeight[part] + ev;
            top = Math.Max(top, logs[part]);
        }

        double total = 0;
        for (int part = 0; part < Parts; part++)
        {
            total += Math.Exp(logs[part] - top);
        }

        if (store >= 0)
        {
            for (int part = 0; part < Parts; part++)
            {
                Comp[(store * Parts) + part] = posts[part];
                CompWeight[(store * Parts) + part] = Math.Exp(logs[part] - top) / total;
            }
        }

        double sugarLog = top + Math.Log(total);

        // Temperatures: T = Ta·(1 − s) + P·s with s the rate over its maximum, d hours earlier; P = base + a·Ta + b·log μm + e.
        var finish = posts[0];
        double logMu = logKappa + Math.Log(Math.Max(0.5, finish.A - finish.B));
        double mt = _mustPrior.A, vt = _mustPrior.Vaa, a = _peakMust;
        double c0 = _peakBase + (_peakRate * logMu);
        var tSums = default(LinearSums);
        for (int i = 0; i < c.TempHours.Length; i++)
        {
            double s = SigmoidShape.Slope(form, kappa, lambda, c.TempHours[i] - _delay) / kappa;
            tSums.Add(1.0 - s, s, c.TempC[i]);
        }

        if (tSums.N == 0)
        {
            if (store >= 0)
            {
                for (int part = 0; part < TempParts; part++)
                {
                    double pv = part == 0 ? _peakVar : _peakVar * ForecastModel.WideFactor * ForecastModel.WideFactor;
                    Temp[(store * TempParts) + part] = new Gaussian2(mt, c0 + (a * mt), vt, a * vt, (a * a * vt) + pv);
                    TempWeight[(store * TempParts) + part] = part == 0 ? 1 - Model.PeakOutlierShare : Model.PeakOutlierShare;
                }
            }

            return sugarLog;
        }

        double l0 = 0, l1 = 0;
        for (int part = 0; part < TempParts; part++)
        {
            double pv = part == 0 ? _peakVar : _peakVar * ForecastModel.WideFactor * ForecastModel.WideFactor;
            var (temp, lt) = tSums.Update(new Gaussian2(mt, c0 + (a * mt), vt, a * vt, (a * a * vt) + pv), _tempVar);
            if (store >= 0)
            {
                Temp[(store * TempParts) + part] = temp;
            }

            (l0, l1) = part == 0 ? (lt + Math.Log(1 - Model.PeakOutlierShare), l1) : (l0, lt + Math.Log(Model.PeakOutlierShare));
        }

        double tTop = Math.Max(l0, l1);
        double tTotal = Math.Exp(l0 - tTop) + Math.Exp(l1 - tTop);
        if (store >= 0)
        {
            TempWeight[store * TempParts] = Math.Exp(l0 - tTop) / tTotal;
            TempWeight[(store * TempParts) + 1] = Math.Exp(l1 - tTop) / tTotal;
        }

        return sugarLog + tTop + Math.Log(tTotal);
    }

    /// <summary>Reading noise variance for the lot: the dense-log noise when its readings are hours apart at most.</summary>
    public static double SugarVariance(LotCourse c, ForecastModel model)
    {
        double sd = model.SugarSd;
        if (c.SugarHours.Length >= 3)
        {
            var gaps = c.SugarHours.Zip(c.SugarHours.Skip(1), (x, y) => y - x).Order().ToArray();
            if (gaps[gaps.Length / 2] <= 2.0)
            {
                sd = model.DenseSugarSd;
            }
        }

        return sd * sd;
    }

    /// <summary>log density of the node under the lot's prior shifted by the season shift δ (no marginal over δ).</summary>
    public double LogPrior(int k, double delta) => LogPriorAt(k, ShiftedPrior(delta));

    /// <summary>
    /// log prior density of node k: the contaminated normal (1 − ε)·N(m, Σ) + ε·N(m, 16Σ), ε the history's share of
    /// rate and lag outliers.
    /// </summary>
    public double LogPriorAt(int k, Gaussian2 prior) => LogPriorAt(LogKappa[k], Lag[k], prior);

    /// <summary>log prior density at (log κ, λ) under the contaminated normal around <paramref name="prior"/>.</summary>
    public double LogPriorAt(double logKappa, double lambda, Gaussian2 prior) => new PriorDensity(prior, Model.RateOutlierShare).Log(logKappa, lambda);

    /// <summary>The log prior density of every node under <paramref name="prior"/>, into <paramref name="into"/>.</summary>
    public void LogPriors(Gaussian2 prior, Span<double> into)
    {
        var density = new PriorDensity(prior, Model.RateOutlierShare);
        for (int k = 0; k < LogKappa.Length; k++)
        {
            into[k] = density.Log(LogKappa[k], Lag[k]);
        }
    }

    /// <summary>
    /// The contaminated normal (1 − ε)·N(m, Σ) + ε·N(m, 16Σ) with its constants worked out once: log density =
    /// log N(x; m, Σ) + log(1 − ε + (ε/16)·exp(q·(1 − 1/16)/2)), q the Mahalanobis distance squared.
    /// </summary>
    private readonly struct PriorDensity
    {
        private readonly double _ma, _mb, _iaa, _iab, _ibb, _constant, _keep, _wide, _half;

        public PriorDensity(Gaussian2 prior, double eps)
        {
            double f2 = ForecastModel.WideFactor * ForecastModel.WideFactor;
            double det = (prior.Vaa * prior.Vbb) - (prior.Vab * prior.Vab);
            (_ma, _mb) = (prior.A, prior.B);
            (_iaa, _iab, _ibb) = (prior.Vbb / det, -prior.Vab / det, prior.Vaa / det);
            _constant = -Math.Log(2 * Math.PI) - (0.5 * Math.Log(det));
            (_keep, _wide, _half) = (1 - eps, eps / f2, 0.5 * (1 - (1 / f2)));
        }

        public double Log(double x, double y)
        {
            double dx = x - _ma, dy = y - _mb;
            double q = (_iaa * dx * dx) + (2 * _iab * dx * dy) + (_ibb * dy * dy);

            // For large q the wide part dominates: write it in a form that cannot overflow.
            double t = _half * q;
            double mix = t < 600 ? Math.Log(_keep + (_wide * Math.Exp(t))) : Math.Log(_wide) + t + Math.Log(1 + (_keep / _wide * Math.Exp(-t)));
            return _constant - (0.5 * q) + mix;
        }
    }

    /// <summary>The lot's prior in grid coordinates under the season shift δ.</summary>
    public Gaussian2 ShiftedPrior(double delta) =>
        new(Prior.LogMu + delta - LogA0, (Prior.Lag * Math.Exp(-delta)) - LagOffset, Prior.Vmm, Prior.Vml, Prior.Vll + LagExtraVariance);

    public static double LogNormal2(double x, double y, Gaussian2 g)
    {
        double det = (g.Vaa * g.Vbb) - (g.Vab * g.Vab);
        double dx = x - g.A, dy = y - g.B;
        double q = ((g.Vbb * dx * dx) - (2 * g.Vab * dx * dy) + (g.Vaa * dy * dy)) / det;
        return (-0.5 * q) - Math.Log(2 * Math.PI) - (0.5 * Math.Log(det));
    }
}
