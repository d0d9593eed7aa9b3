using System.Text;
using System.Text.Json;
using System.Text.Json.Serialization;
using YieldBench.Core.HouseFactor;

namespace YieldBench.Reports;

/// <summary>What reading a house-factor file gave: the planner's model, or a message saying what is wrong and how to fix it.</summary>
/// <param name="Model">The planning model, when the file could be used.</param>
/// <param name="RegimeName">The label regime the review scored against, when recorded.</param>
/// <param name="Error">Why the file could not be used, or null.</param>
public sealed record HouseFactorFile(PlanningModel? Model, string? RegimeName, string? Error);

/// <summary>
/// Writes and reads <c>data/house-factor.json</c>: the house-factor section of a review, and the planner's model that
/// <c>yieldbench plan --factor-file</c> reads back. Invariant numbers (shortest round-trip form), snake_case names
/// with the unit last, properties in a fixed order, LF line ends, no timestamps: same review, same bytes. Numbers
/// that are not defined (NaN) are written as null.
/// </summary>
public static class HouseFactorJson
{
    /// <summary>File name inside the output's data folder.</summary>
    public const string FileName = "house-factor.json";

    /// <summary>Version of the file's layout; bumped when a field changes meaning.</summary>
    public const int FormatVersion = 5;

    private static readonly JsonSerializerOptions Options = new()
    {
        WriteIndented = true,
        NewLine = "\n",
        PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower,
        DefaultIgnoreCondition = JsonIgnoreCondition.Never,
        Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
    };

    /// <summary>The file's text for a review.</summary>
    public static string Write(HouseFactorReview review)
    {
        using var buffer = new MemoryStream();
        Write(review, buffer);
        return new UTF8Encoding(false).GetString(buffer.GetBuffer(), 0, (int)buffer.Length);
    }

    /// <summary>
    /// Writes the file's bytes (UTF-8, no byte-order mark) straight to <paramref name="stream"/>: at 100,000 lots the
    /// file is about 50 MB, and held as one string (with its copy for the final line end and its bytes) it cost several
    /// hundred MB at the report's busiest moment.
    /// </summary>
    public static void Write(HouseFactorReview review, Stream stream)
    {
        ArgumentNullException.ThrowIfNull(stream);
        JsonSerializer.Serialize(stream, Dto(review), Options);
        stream.WriteByte((byte)'\n');
    }

    private static FileDto Dto(HouseFactorReview review)
    {
        ArgumentNullException.ThrowIfNull(review);
        return new FileDto(
            FormatVersion,
            "house-factor",
            new RegimeDto(review.Regime.Id, review.Regime.Name, review.Regime.ToleranceAtOrBelowSwitch, review.Regime.ToleranceAboveSwitch, N(review.Regime.ToleranceSwitchAbv), N(review.Regime.NoCrossingLineAbv), review.Regime.Source, review.Regime.NoCrossingLineSource),
            review.ThresholdAbv,
            review.LotsUsed,
            review.FlaggedLotsIncluded,
            review.FlaggedLots.Select(Flagged).ToArray(),
            review.Seasons,
            Scheme(review.PrimaryScheme),
            review.Candidates.Select(c => new CandidateDto(c.Id, c.Name, c.Description, c.Complexity, Metrics(c.BySeason), Metrics(c.ByLot), Scheme(c.ByLotScheme),
                c.Importance.Select(i => new ImportanceDto(i.Feature, N(i.MaeIncrease))).ToArray())).ToArray(),
            Recommendation(review.Overall),
            review.ByStrain.Select(r => Recommendation(r)!).ToArray(),
            Planning(review.Planning),
            review.PlannerTable.Select(t => new ThresholdDto(t.Strain, t.TargetAbv, t.Confidence, N(t.HighestBrix), N(t.ErrorAllowance), t.Note)).ToArray(),
            Coverage(review.Coverage),
            review.ImportanceSentence,
            review.Explanation,
            review.Notes,
            review.Cautions,
            review.OtherVersion is { } other ? new OtherVersionDto(
                other.FlaggedLotsIncluded,
                other.LotsUsed,
                Recommendation(other.Overall),
                other.ByStrain.Select(r => Recommendation(r)!).ToArray(),
                Planning(other.Planning),
                other.Explanation) : null);
    }

    /// <summary>Writes the file (UTF-8, no byte-order mark).</summary>
    public static void WriteFile(HouseFactorReview review, string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        using var stream = new FileStream(path, FileMode.Create, FileAccess.Write);
        Write(review, stream);
    }

    /// <summary>Reads the planner's model from a file; a missing or unusable file gives a message, not an exception.</summary>
    public static HouseFactorFile ReadFile(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        if (!File.Exists(path))
        {
            return new HouseFactorFile(null, null, $"{path}: no such file. Give the {FileName} written by 'yieldbench review' in its output's data folder.");
        }

        return Read(File.ReadAllText(path, Encoding.UTF8), path);
    }

    /// <summary>Reads the planner's model from the file's text; <paramref name="source"/> names it in messages.</summary>
    public static HouseFactorFile Read(string json, string source)
    {
        ArgumentNullException.ThrowIfNull(json);
        FileDto? dto;
        try
        {
            dto = JsonSerializer.Deserialize<FileDto>(json, Options);
        }
        catch (JsonException e)
        {
            string where = e.LineNumber is { } line ? $" at line {line + 1}" : string.Empty;

            // A value of the wrong kind (a number typed in quotes) names the property, not the reader's type names.
            string why = e.Path is { Length: > 2 } jsonPath && e.Message.StartsWith("The JSON value could not be converted", StringComparison.Ordinal)
                ? $"the value of {jsonPath[2..]} is not of the kind this file holds there"
                : e.Message.Split('.')[0];
            return new HouseFactorFile(null, null, $"{source}: not a readable house-factor file{where} ({why}). Write it again with 'yieldbench review'.");
        }

        if (dto is null || dto.Kind != "house-factor")
        {
            return new HouseFactorFile(null, null, $"{source}: not a house-factor file (its \"kind\" is not \"house-factor\"). Give the {FileName} written by 'yieldbench review'.");
        }

        if (dto.FormatVersion != FormatVersion)
        {
            return new HouseFactorFile(null, null, $"{source}: layout version {dto.FormatVersion} is not the {FormatVersion} this version reads. Write it again with this version's 'yieldbench review'.");
        }

        if (dto.Planning is null)
        {
            string why = dto.Explanation is { Count: > 0 } ex ? " " + ex[^1] : string.Empty;
            return new HouseFactorFile(null, dto.Regime?.Name, $"{source}: the review chose no house factor, so there is nothing to plan with.{why}");
        }

        var bad = new List<string>();
        var pooled = ToLine(dto.Planning.Pooled, "planning.pooled", bad);
        var strains = (dto.Planning.Strains ?? []).Select((s, i) => ToLine(s, $"planning.strains[{i}]", bad)).ToArray();
        if (bad.Count > 0)
        {
            return new HouseFactorFile(null, dto.Regime?.Name, $"{source}: {string.Join("; ", bad)}. Write the file again with 'yieldbench review'.");
        }

        var model = new PlanningModel(pooled!, strains!, dto.Planning.Basis ?? "a house-factor file")
        {
            ReferenceBrix = dto.Planning.ReferenceBrix ?? double.NaN,
            HistoryLowBrix = dto.Planning.HistoryBrixLow ?? double.NaN,
            HistoryHighBrix = dto.Planning.HistoryBrixHigh ?? double.NaN,
        };
        return new HouseFactorFile(model, dto.Regime?.Name, null);
    }

    private static PlanningLine? ToLine(LineDto? d, string where, List<string> bad)
    {
        if (d is null)
        {
            bad.Add($"{where} is missing");
            return null;
        }

        SugarCurve curve;
        switch (d.Curve)
        {
            case "line":
                curve = SugarCurve.Line;
                if (d.InterceptAbv is null || d.SlopeAbvPerBrix is null || !(d.SlopeAbvPerBrix > 0))
                {
                    bad.Add($"{where} needs intercept_abv and a positive slope_abv_per_brix");
                    return null;
                }

                break;
            case "eu-convention":
                curve = SugarCurve.EuConvention;
                break;
            default:
                bad.Add($"{where}.curve is \"{d.Curve}\"; it must be \"line\" or \"eu-convention\"");
                return null;
        }

        var errors = (d.HeldOutErrors ?? []).ToArray();
        if (errors.Any(e => e is null || e.ErrorAbv is not { } v || !double.IsFinite(v) || e.Strain is null))
        {
            bad.Add($"{where}.held_out_errors holds an entry without a numeric error_abv, a season and a strain");
            return null;
        }

        var seasonErrors = errors.Select(e => new SeasonError(e!.ErrorAbv!.Value, e.Season, e.Strain!)).ToArray();
        return new PlanningLine(d.Strain ?? "*", d.CandidateId ?? "unknown", curve, d.InterceptAbv ?? double.NaN, d.SlopeAbvPerBrix ?? double.NaN, d.Lots, seasonErrors, d.ErrorBasis ?? "held-out errors");
    }

    private static PlanningDto? Planning(PlanningModel? p) => p is null ? null : new(
        N(p.ReferenceBrix),
        N(p.HistoryLowBrix),
        N(p.HistoryHighBrix),
        Line(p.Pooled, p),
        p.Strains.Select(l => Line(l, p)).ToArray(),
        p.Basis);

    private static LineDto Line(PlanningLine l, PlanningModel p)
    {
        var m = l.ErrorModel;
        var b80 = m.Band(0.80);
        var b95 = m.Band(0.95);
        return new(
            l.Strain,
            l.CandidateId,
            l.Curve == SugarCurve.EuConvention ? "eu-convention" : "line",
            N(l.Intercept),
            N(l.SlopePerBrix),
            N(p.FactorOf(l)),
            l.Lots,
            l.ErrorBasis,
            new ErrorModelDto(m.Count, m.Clusters, m.Seasons, N(m.Mean), N(Math.Sqrt(m.WithinVariance)), N(Math.Sqrt(m.BetweenVariance)), N(Math.Sqrt(m.SeasonVariance)), N(m.StandardErrorOfMean), N(m.PredictiveSd), N(m.DegreesOfFreedom), N(b80.Low), N(b80.High), N(b95.Low), N(b95.High)),
            l.Errors.Select(e => new ErrorDto(e.Season, e.Strain, e.Error)).ToArray());
    }

    private static CoverageDto? Coverage(IntervalCoverage? c) => c is null ? null : new(
        c.Method,
        Row(c.Total),
        c.Seasons.Select(Row).ToArray());

    private static CoverageRowDto Row(SeasonCoverageRow r) => new(
        r.Season == 0 ? null : r.Season, r.Lots, N(r.Share80), N(r.Share95), r.OverallLots, N(r.OverallShare80), N(r.OverallShare95));

    private static FlaggedLotDto Flagged(FlaggedLot f) => new(f.Season, f.LotId, f.Strain, f.Codes, f.Reason);

    private static RecommendationDto? Recommendation(Recommendation? r) => r is null ? null : new(
        r.Strain,
        r.Lots,
        r.CandidateId,
        r.BestCandidateId,
        N(r.MaeLimit),
        Metrics(r.Metrics)!,
        N(r.ErrorBand80.Low),
        N(r.ErrorBand80.High),
        N(r.ErrorBand95.Low),
        N(r.ErrorBand95.High),
        N(r.Factor),
        N(r.ReferenceBrix),
        r.Explanation);

    private static MetricsDto? Metrics(BacktestMetrics? m) => m is null ? null : new(
        m.Lots, N(m.Mae), N(m.MaeStandardError), N(m.Bias), N(m.Rmse), N(m.P90AbsoluteError), N(m.ShareWithinTolerance), N(m.ShareWrongSideOfThreshold));

    private static string Scheme(BacktestScheme s) => s switch
    {
        BacktestScheme.LeaveOneSeasonOut => "leave-one-season-out",
        BacktestScheme.LeaveOneLotOut => "leave-one-lot-out",
        _ => "ten-fold-by-lot",
    };

    private static double? N(double v) => double.IsFinite(v) ? v : null;

    private static double? N(double? v) => v is { } d && double.IsFinite(d) ? d : null;

    private sealed record FileDto(
        int FormatVersion,
        string Kind,
        RegimeDto? Regime,
        double ThresholdAbv,
        int LotsUsed,
        bool FlaggedLotsIncluded,
        IReadOnlyList<FlaggedLotDto> FlaggedLots,
        IReadOnlyList<int> Seasons,
        string PrimaryBacktest,
        IReadOnlyList<CandidateDto> Candidates,
        RecommendationDto? Recommendation,
        IReadOnlyList<RecommendationDto> ByStrain,
        PlanningDto? Planning,
        IReadOnlyList<ThresholdDto> PlannerTable,
        CoverageDto? IntervalCoverage,
        string? ImportanceSentence,
        IReadOnlyList<string> Explanation,
        IReadOnlyList<string> Notes,
        IReadOnlyList<string> Cautions,
        OtherVersionDto? OtherVersion);

    private sealed record FlaggedLotDto(int Season, string LotId, string Strain, IReadOnlyList<string> Codes, string Reason);

    private sealed record OtherVersionDto(
        bool FlaggedLotsIncluded,
        int LotsUsed,
        RecommendationDto? Recommendation,
        IReadOnlyList<RecommendationDto> ByStrain,
        PlanningDto? Planning,
        IReadOnlyList<string> Explanation);

    private sealed record RegimeDto(string Id, string Name, double ToleranceAtOrBelowSwitchAbv, double ToleranceAboveSwitchAbv, double? ToleranceSwitchAbv, double? NoCrossingLineAbv, string Source, string NoCrossingLineSource);

    private sealed record MetricsDto(int Lots, double? MaeAbv, double? MaeStandardErrorAbv, double? BiasAbv, double? RmseAbv, double? P90AbsoluteErrorAbv, double? ShareWithinTolerance, double? ShareWrongSideOfThreshold);

    private sealed record ImportanceDto(string Feature, double? MaeIncreaseAbv);

    private sealed record CandidateDto(string Id, string Name, string Description, int Complexity, MetricsDto? BySeason, MetricsDto? ByLot, string ByLotBacktest, IReadOnlyList<ImportanceDto> Importance);

    private sealed record RecommendationDto(
        string Strain,
        int Lots,
        string CandidateId,
        string BestCandidateId,
        double? MaeLimitAbv,
        MetricsDto Metrics,
        double? Error80LowAbv,
        double? Error80HighAbv,
        double? Error95LowAbv,
        double? Error95HighAbv,
        double? FactorAbvPerBrix,
        double? ReferenceBrix,
        string Explanation);

    private sealed record LineDto(
        string Strain,
        string CandidateId,
        string Curve,
        double? InterceptAbv,
        double? SlopeAbvPerBrix,
        double? FactorAbvPerBrix,
        int Lots,
        string ErrorBasis,
        ErrorModelDto? ErrorModel,
        IReadOnlyList<ErrorDto?> HeldOutErrors);

    private sealed record ErrorDto(int Season, string? Strain, double? ErrorAbv);

    private sealed record ErrorModelDto(
        int Errors,
        int Clusters,
        int Seasons,
        double? MeanErrorAbv,
        double? WithinClusterSdAbv,
        double? BetweenClusterSdAbv,
        double? SeasonSdAbv,
        double? MeanStandardErrorAbv,
        double? PredictiveSdAbv,
        double? DegreesOfFreedom,
        double? Error80LowAbv,
        double? Error80HighAbv,
        double? Error95LowAbv,
        double? Error95HighAbv);

    private sealed record CoverageDto(string Method, CoverageRowDto All, IReadOnlyList<CoverageRowDto> Seasons);

    private sealed record CoverageRowDto(int? Season, int Lots, double? Share80, double? Share95, int OverallLots, double? OverallShare80, double? OverallShare95);

    private sealed record PlanningDto(double? ReferenceBrix, double? HistoryBrixLow, double? HistoryBrixHigh, LineDto Pooled, IReadOnlyList<LineDto> Strains, string Basis);

    private sealed record ThresholdDto(string Strain, double TargetAbv, double Confidence, double? HighestBrix, double? ErrorAllowanceAbv, string? Note);
}
