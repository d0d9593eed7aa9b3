using YieldBench.Core.Lots;
using YieldBench.Core.Review.Strains;
using static System.FormattableString;

namespace YieldBench.Core.Review;

/// <summary>
/// The review at a glance, format-neutral: the headline numbers and plain sentences that the console, the Overview
/// sheet and any other renderer show. It holds numbers, names and sentences only; each renderer formats and lays them
/// out. Built once by <see cref="ReviewRunner"/> from the rest of the result.
/// </summary>
public sealed record ReviewOverview
{
    /// <summary>The report's title, naming the inputs and the seasons.</summary>
    public required string Title { get; init; }

    /// <summary>What was read and what was left out.</summary>
    public required InputsAtAGlance Inputs { get; init; }

    /// <summary>The strains ranked, with the comparison's first sentences.</summary>
    public required StrainsAtAGlance Strains { get; init; }

    /// <summary>The house-factor recommendation, or null when none could be made (see <see cref="NoRecommendation"/>).</summary>
    public HouseFactorAtAGlance? HouseFactor { get; init; }

    /// <summary>Why no house factor is recommended (empty when one is).</summary>
    public IReadOnlyList<string> NoRecommendation { get; init; } = [];

    /// <summary>The house-factor recommendation.</summary>
/// <param name="Candidate">Plain name of the recommended candidate.</param>
/// <param name="Scheme">Plain name of the backtest it was judged by.</param>
/// <param name="Regime">The label regime's name.</param>
/// <param name="Mae">Held-out mean absolute error, % v/v.</param>
/// <param name="ShareWithinTolerance">Share of held-out lots within the label tolerance (0–1).</param>
/// <param name="Band80">The 80 % band of held-out errors, % v/v.</param>
/// <param name="Band95">The 95 % band of held-out errors, % v/v.</param>
/// <param name="Explanation">Why it was chosen, in plain words.</param>
/// <param name="ByStrain">The per-strain choices.</param>
public sealed record HouseFactorAtAGlance(
    string Candidate,
    string Scheme,
    string Regime,
    double Mae,
    double ShareWithinTolerance,
    (double Low, double High) Band80,
    (double Low, double High) Band95,
    string Explanation,
    IReadOnlyList<StrainAdvice> ByStrain);

/// <summary>One strain's house-factor choice.</summary>
/// <param name="Strain">Strain code.</param>
/// <param name="Candidate">Plain name of the chosen candidate.</param>
/// <param name="Mae">Held-out mean absolute error, % v/v.</param>
/// <param name="Lots">Lots scored.</param>
public sealed record StrainAdvice(string Strain, string Candidate, double Mae, int Lots);

/// <summary>The lots to look at.</summary>
    public required LotsToLookAt Lots { get; init; }

    /// <summary>The kinetics in numbers, or null when no log was read.</summary>
    public KineticsAtAGlance? Kinetics { get; init; }

    /// <summary>The cautions every report shows.</summary>
    public required IReadOnlyList<string> Cautions { get; init; }

    /// <summary>The conversion factor to use next harvest, pooled and per strain, with ranges and held-out error; null without a recommendation.</summary>
    public FactorsToUse? Factors { get; init; }

    /// <summary>The planning table (highest picking °Brix per strain for each target and confidence); null without a planner.</summary>
    public PlanningAtAGlance? Planning { get; init; }

    /// <summary>The comparison's plain sentence: how much more alcohol the first-ranked strain makes than the last from the same sugar (null without an adjusted comparison).</summary>
    public string? StrainHeadline { get; init; }

    /// <summary>Per strain with logs, in the review's strain order: days to dry, peak temperature, troubled ferments (empty without logs).</summary>
    public IReadOnlyList<StrainFerments> Ferments { get; init; } = [];

    /// <summary>Rows left out by reason, most rows first.</summary>
    public IReadOnlyList<ReasonCount> LeftOutReasons { get; init; } = [];

    /// <summary>The lots to look at, one entry each: most serious first, then by lot key.</summary>
    public IReadOnlyList<LotReview> FlaggedLots { get; init; } = [];

    /// <summary>
    /// The most lots to look at the printed meeting page lists (the first of <see cref="FlaggedLots"/>, most serious
    /// first): about four printed pages of the table; the rest are counted and pointed to (<see cref="NotPrintedSentence"/>).
    /// A cellar of 10,000 lots has about 190 lots to look at, which printed in full took some 30 pages.
    /// </summary>
    public const int PrintedLotsUpTo = 25;

    /// <summary>How many of <see cref="FlaggedLots"/> the printed page lists.</summary>
    public int PrintedLots => Math.Min(FlaggedLots.Count, PrintedLotsUpTo);

    /// <summary>
    /// What the printed page says of the lots it leaves out, counted by their worst severity and pointed to; null when
    /// it lists them all.
    /// </summary>
    public string? NotPrintedSentence
    {
        get
        {
            if (FlaggedLots.Count <= PrintedLots)
            {
                return null;
            }

            var rest = FlaggedLots.Skip(PrintedLots).GroupBy(l => l.WorstSeverity ?? FlagSeverity.Note).OrderByDescending(g => g.Key)
                .Select(g => Invariant($"{g.Count():N0} {ReviewTexts.Severity(g.Key)}"));
            return Invariant($"Printed here: the {PrintedLots} most serious of the {FlaggedLots.Count:N0} lots to look at. The other {FlaggedLots.Count - PrintedLots:N0} ({string.Join(", ", rest)}) are on this page on screen, in the Follow-up sheet of report.xlsx and in data/follow-up.csv.");
        }
    }

    /// <summary>Builds the overview from the rest of the review (pure).</summary>
    internal static ReviewOverview Build(
        SeasonSet inputs, HouseFactor.HouseFactorSettings settings, StrainReview strains, HouseFactor.HouseFactorReview h, Kinetics.KineticsReview? kineticsReview, IReadOnlyList<LotReview> lotReviews, ReviewFigures figures)
    {
        var c = strains.Comparison;
        var names = h.Candidates.ToDictionary(x => x.Id, x => x.Name, StringComparer.Ordinal);
        string Name(string id) => names.GetValueOrDefault(id, id);

        HouseFactorAtAGlance? house = h.Overall is { } rec
            ? new HouseFactorAtAGlance(
                Name(rec.CandidateId),
                ReviewTexts.Scheme(h.PrimaryScheme),
                h.Regime.Name,
                rec.Metrics.Mae,
                rec.Metrics.ShareWithinTolerance,
                rec.ErrorBand80,
                rec.ErrorBand95,
                rec.Explanation,
                h.ByStrain.Select(s => new StrainAdvice(s.Strain, Name(s.CandidateId), s.Metrics.Mae, s.Lots)).ToArray())
            : null;

        var severities = new[] { FlagSeverity.LikelyError, FlagSeverity.Check, FlagSeverity.Note };
        var worst = lotReviews.Select(l => l.WorstSeverity).Where(s => s is not null).ToArray();
        var lots = new LotsToLookAt(
            worst.Length,
            severities.Select(s => new SeverityCount(s, worst.Count(w => w == s))).ToArray(),
            strains.Flags.Where(f => f.Severity == FlagSeverity.LikelyError).ToArray());

        KineticsAtAGlance? kinetics = kineticsReview is { } k
            ? new KineticsAtAGlance(
                k.Lots.Count,
                k.Lots.Count(x => x.Flagged),
                k.Lots.SelectMany(x => x.Flags).GroupBy(code => code, StringComparer.Ordinal)
                    .OrderByDescending(g => g.Count()).ThenBy(g => g.Key, StringComparer.Ordinal)
                    .Select(g => new CodeCount(g.Key, g.Count())).ToArray())
            : null;

        return new ReviewOverview
        {
            Title = TitleOf(inputs),
            Inputs = new InputsAtAGlance(
                inputs.Files.Count,
                lotReviews.Count,
                RowsLeftOut(inputs),
                inputs.Issues.Count(i => i.Severity == IssueSeverity.Error && i.Row is null),
                inputs.Issues.Count,
                inputs.Seasons,
                inputs.Logs.Count),
            Strains = new StrainsAtAGlance(c.Adjusted.Count > 0, c.ReferenceBrix, c.Measure, figures.Ranking, c.Sentences) { Plain = Plain(figures.Ranking, c), LeftOut = c.LeftOut, MinLots = c.MinLots },
            HouseFactor = house,
            NoRecommendation = house is null ? h.Explanation : [],
            Lots = lots,
            Kinetics = kinetics,
            Cautions = kineticsReview is null ? ReviewTexts.CautionsWithoutLogs : ReviewTexts.Cautions,
            Factors = OverviewDetails.Factors(h, OverviewDetails.ReferenceBrix(c.ReferenceBrix, lotReviews.Select(l => l.Conversion.EffectiveStartingBrix)), figures.StrainOrder, Name),
            Planning = OverviewDetails.Planning(h, settings, figures.StrainOrder),
            StrainHeadline = OverviewDetails.StrainHeadline(c, figures.Ranking),
            Ferments = OverviewDetails.Ferments(kineticsReview, figures.StrainOrder),
            LeftOutReasons = OverviewDetails.LeftOutReasons(inputs),
            FlaggedLots = OverviewDetails.FlaggedLots(lotReviews),
        };
    }

    /// <summary>"Review of … (seasons …)": the input files by name (their count past four) and the seasons of the lots.</summary>
    private static string TitleOf(SeasonSet inputs)
    {
        var names = inputs.Files.Select(f => Path.GetFileName(f.Path)).ToArray();
        string files = names.Length == 0 ? "no input file"
            : names.Length <= 4 ? string.Join(", ", names)
            : Invariant($"{names.Length} input files");
        var seasons = inputs.Seasons;
        string span = seasons.Count == 0 ? string.Empty : seasons.Count == 1 ? Invariant($" (season {seasons[0]})") : Invariant($" (seasons {seasons[0]}–{seasons[^1]})");
        return $"Review of {files}{span}";
    }

    /// <summary>
    /// The ranking in plain words: the first strain against the last, then each strain against the next. Where three
    /// or more strains in a row are each the same as the next within the noise, one sentence names them together (20
    /// strains gave 19 sentences, most of them "the same within the noise").
    /// </summary>
    private static IReadOnlyList<string> Plain(IReadOnlyList<RankedStrain> ranking, StrainComparison c)
    {
        if (ranking.Count < 2 || c.Adjusted.Count == 0)
        {
            return [];
        }

        AdjustedDifference? Between(string a, string b) =>
            c.AdjustedDifferences.FirstOrDefault(x => (x.First == a && x.Second == b) || (x.First == b && x.Second == a));

        var lines = new List<string>();
        if (Between(ranking[0].Strain, ranking[^1].Strain) is { } ends)
        {
            lines.Add(Comparison.DifferenceSentence(ends));
        }

        var run = new List<AdjustedDifference>();
        void CloseRun()
        {
            if (run.Count == 1)
            {
                lines.Add(Comparison.DifferenceSentence(run[0]));
            }
            else if (run.Count > 1)
            {
                // The run's strains in ranking order: each pair's first strain, then the last pair's other one.
                int start = IndexOf(ranking, run[0].First, run[0].Second);
                var names = ranking.Skip(start).Take(run.Count + 1).Select(r => r.Strain).ToArray();
                var sizes = run.Select(d => Math.Abs(d.AbvDifference)).ToArray();
                lines.Add(Invariant($"{string.Join(", ", names[..^1])} and {names[^1]} make the same alcohol from the same sugar within the noise, each against the next (differences of {Math.Round(sizes.Max(), 2):0.00} % v/v or less)."));
            }

            run.Clear();
        }

        for (int i = 0; ranking.Count > 2 && i + 1 < ranking.Count; i++)
        {
            if (Between(ranking[i].Strain, ranking[i + 1].Strain) is not { } d)
            {
                CloseRun();
                continue;
            }

            if (d.Interval.Contains(0))
            {
                run.Add(d);
                continue;
            }

            CloseRun();
            lines.Add(Comparison.DifferenceSentence(d));
        }

        CloseRun();
        return lines;
    }

    // The position in the ranking of the earlier of two strains.
    private static int IndexOf(IReadOnlyList<RankedStrain> ranking, string a, string b)
    {
        for (int i = 0; i < ranking.Count; i++)
        {
            if (ranking[i].Strain == a || ranking[i].Strain == b)
            {
                return i;
            }
        }

        return 0;
    }

    /// <summary>
    /// Rows read but not used: the sum of the intake's row accounting when there is one (a sheet refused whole counts
    /// all its rows), else the count of row-level errors.
    /// </summary>
    private static int RowsLeftOut(SeasonSet inputs) =>
        inputs.Accounts.Count > 0
            ? inputs.Accounts.Sum(a => a.RowsReported)
            : inputs.Issues.Count(i => i.Severity == IssueSeverity.Error && i.Row is not null);
}

/// <summary>What was read and what was left out.</summary>
/// <param name="Files">Input files read.</param>
/// <param name="LotsUsed">Lots reviewed.</param>
/// <param name="RowsLeftOut">Rows read but not used (each reported).</param>
/// <param name="FileProblems">Files or sheets refused whole.</param>
/// <param name="Issues">Intake issues in all.</param>
/// <param name="Seasons">Seasons of the lots used.</param>
/// <param name="Logs">Fermentation logs read.</param>
public sealed record InputsAtAGlance(int Files, int LotsUsed, int RowsLeftOut, int FileProblems, int Issues, IReadOnlyList<int> Seasons, int Logs);

/// <summary>The strains ranked.</summary>
/// <param name="Adjusted">True when the ranking is by conversion adjusted for starting sugar; false: by raw median.</param>
/// <param name="ReferenceBrix">Starting sugar the adjusted conversion is taken at, °Brix.</param>
/// <param name="Measure">Data-file name of the factor compared.</param>
/// <param name="Ranking">The compared strains, best first.</param>
/// <param name="Sentences">The comparison's findings in plain words, in reading order.</param>
public sealed record StrainsAtAGlance(bool Adjusted, double ReferenceBrix, string Measure, IReadOnlyList<RankedStrain> Ranking, IReadOnlyList<string> Sentences)
{
    /// <summary>The ranking in plain words: the first strain against the last, then each against the next (empty when not adjusted).</summary>
    public IReadOnlyList<string> Plain { get; init; } = [];

    /// <summary>Strains with too few lots to be compared (fewer than <see cref="MinLots"/>), with their lots; their lots are judged against all lots.</summary>
    public IReadOnlyList<Strains.StrainLots> LeftOut { get; init; } = [];

    /// <summary>The fewest lots a strain needs to be compared.</summary>
    public int MinLots { get; init; }

    /// <summary>
    /// "YB-R31 (1 lot) is left out of the comparison: …", or null when every strain was compared. Words the review's
    /// rule for the console, the workbook and the page.
    /// </summary>
    public string? LeftOutSentence => LeftOut.Count == 0
        ? null
        : string.Join(", ", LeftOut.Select(s => Invariant($"{s.Strain} ({s.Lots} lot{(s.Lots == 1 ? string.Empty : "s")})")))
            + (LeftOut.Count == 1 ? " is" : " are")
            + Invariant($" left out of the comparison: a strain needs at least {MinLots} lots to be compared, and until then its lots are judged against all lots.");
}

/// <summary>The lots to look at.</summary>
/// <param name="Flagged">Lots with a follow-up item (strain review or kinetics).</param>
/// <param name="ByWorstSeverity">Flagged lots by their worst severity, most serious first.</param>
/// <param name="LikelyErrors">The strain review's likely-error flags, in the review's order.</param>
public sealed record LotsToLookAt(int Flagged, IReadOnlyList<SeverityCount> ByWorstSeverity, IReadOnlyList<LotFlag> LikelyErrors);

/// <summary>How many lots have a severity as their worst.</summary>
/// <param name="Severity">The severity.</param>
/// <param name="Lots">Lots.</param>
public sealed record SeverityCount(FlagSeverity Severity, int Lots);

/// <summary>The kinetics in numbers.</summary>
/// <param name="LotsWithLog">Lots with a log.</param>
/// <param name="Flagged">Lots with any kinetics flag.</param>
/// <param name="Flags">Each kinetics flag code with the lots carrying it, most frequent first.</param>
public sealed record KineticsAtAGlance(int LotsWithLog, int Flagged, IReadOnlyList<CodeCount> Flags);

/// <summary>A flag code and how many lots carry it.</summary>
/// <param name="Code">The code.</param>
/// <param name="Lots">Lots.</param>
public sealed record CodeCount(string Code, int Lots);
