using System.Globalization;
using System.Text;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;
using static YieldBench.Intake.FieldParsers;

namespace YieldBench.Intake;

/// <summary>One lab result read from a sheet of results kept apart from the lots.</summary>
internal sealed record LabResult(string LotId, int? Season, double FinalAbv, double? ResidualSugarGl, double? Ph, double? TaGl, SugarReading? FinalSugar, SourceRef Source)
{
    /// <summary>True once a lot has taken this result.</summary>
    public bool Used { get; set; }
}

/// <summary>
/// Lab results kept on a sheet of their own (lot id, final alcohol, RS, pH…; no strain or starting sugar) joined to the
/// lots sheets that lack a final alcohol column, by the lot id written exactly alike (and the season where the lab
/// sheet says it). Ids written differently (21CH1 and 21-CH-01) are never joined: each side is reported with the other's
/// look-alike, since a join by a guess could give one lot another lot's alcohol.
/// </summary>
internal static class LabJoin
{
    /// <summary>The kind of a lab results sheet's row account.</summary>
    public const string AccountKind = "lab results";

    /// <summary>Reads the rows of a lab results sheet into <see cref="IntakeRun.LabResults"/>.</summary>
    public static void ReadResults(SheetContext ctx)
    {
        var run = ctx.Run;
        run.LabSheets.Add(ctx);
        var rowState = new RowState(ctx);
        var plan = new RowAccounting.Plan(LabJoin.AccountKind, Readings: false, NotesAreRows: true, Usable: true);
        RowAccounting.Read(ctx, plan, r =>
        {
            var st = rowState.Start(r);
            string? id = TextField(st, "lot_id");
            // A lab sheet often gives no season: its results then match a lot by id alone.
            int? season = ctx.Column("season") is not null || ctx.HeadingSeason is not null || ctx.DefaultSeason is not null ? SeasonField(st) : null;
            double? abv = NumberField(st, "final_abv");
            double? rs = NumberField(st, "residual_sugar_gl");
            double? ph = NumberField(st, "ph");
            double? ta = NumberField(st, "ta_gl");
            SugarReading? finalSugar = SugarField(st, "final_sugar");
            if (st.Bad || id is null || abv is null)
            {
                return false;
            }

            if (run.LabResults.FirstOrDefault(l => l.Season == season && string.Equals(l.LotId, id, StringComparison.Ordinal)) is { } first)
            {
                run.Sink.Error(ctx.File, ctx.SheetName, r + 1, ctx.LotColumn!.Header, id, IssueCodes.DuplicateLabResult, IntakeMessages.DuplicateLabResult(id, first.Source.ToString()));
                return false;
            }

            run.LabResults.Add(new LabResult(id, season, abv.Value, rs, ph, ta, finalSugar, new SourceRef(ctx.File, ctx.SheetName, r + 1)));
            return true;
        });
    }

    /// <summary>
    /// The lab result of the lot being read (its row in a lots sheet with no final alcohol column), marked used; null,
    /// with an error naming any look-alike id, when no result bears its id.
    /// </summary>
    public static LabResult? Find(RowState st, string lotId, int season)
    {
        var ctx = st.Ctx;
        var run = ctx.Run;
        LabResult? found = null;
        foreach (var l in run.LabResults)
        {
            if (string.Equals(l.LotId, lotId, StringComparison.Ordinal) && (l.Season == season || (l.Season is null && found is null)))
            {
                found = l;
            }
        }

        if (found is not null)
        {
            found.Used = true;
            return found;
        }

        st.Bad = true;
        run.LotIdsWithoutResult.Add(lotId);
        var alike = LookAlike(lotId, run.LabResults.Select(l => l.LotId));
        run.Sink.Error(ctx.File, ctx.SheetName, st.SheetRow, ctx.LotColumn!.Header, lotId, IssueCodes.NoLabResult, IntakeMessages.NoLabResult(lotId, season, SheetNames(run.LabSheets), alike));
        return null;
    }

    /// <summary>
    /// After every lots sheet was read: each lab result no lot took is an error at its row, naming a look-alike lot id;
    /// a lab sheet with no lots sheet to join to is one error.
    /// </summary>
    public static void ReportUnused(IntakeRun run, bool joined)
    {
        if (!joined)
        {
            foreach (var ctx in run.LabSheets)
            {
                var results = ResultFields(ctx);
                string? firstId = run.LabResults.FirstOrDefault(l => l.Source.File == ctx.File && l.Source.Sheet == ctx.SheetName)?.LotId;
                run.Sink.Error(ctx.File, ctx.SheetName, ctx.FirstData, null, firstId, IssueCodes.LabResultsApart, IntakeMessages.LabResultsApart(results, byLotId: true));
            }

            return;
        }

        var lotIds = run.Lots.Select(l => l.LotId).Concat(run.LotIdsWithoutResult).Distinct(StringComparer.Ordinal).ToList();
        foreach (var l in run.LabResults.Where(l => !l.Used))
        {
            var ctx = run.LabSheets.First(c => c.File == l.Source.File && c.SheetName == l.Source.Sheet);
            run.Sink.Error(l.Source.File, l.Source.Sheet, l.Source.Row, ctx.LotColumn!.Header, l.LotId, IssueCodes.LabResultWithoutLot,
                IntakeMessages.LabResultWithoutLot(l.LotId, l.Season, LookAlike(l.LotId, lotIds)));

            // Its row was counted as used when read; it is reported instead.
            int i = run.Accounts.FindIndex(a => a.File == l.Source.File && a.Sheet == l.Source.Sheet && a.Kind == LabJoin.AccountKind);
            run.Accounts[i] = run.Accounts[i] with { LotsUsed = run.Accounts[i].LotsUsed - 1, RowsReported = run.Accounts[i].RowsReported + 1 };
        }
    }

    /// <summary>The fields a lab sheet holds besides the lot id and season (named in the lab-results-apart error).</summary>
    internal static List<string> ResultFields(SheetContext ctx) =>
        ctx.Columns.Where(c => c.Field.Name is not ("lot_id" or "season")).Select(c => c.Field.Name).Distinct().ToList();

    /// <summary>The first id among <paramref name="ids"/> written differently but alike (same letters and numbers).</summary>
    internal static string? LookAlike(string id, IEnumerable<string> ids)
    {
        string key = Folded(id);
        return ids.FirstOrDefault(o => !string.Equals(o, id, StringComparison.Ordinal) && Folded(o) == key);
    }

    /// <summary>Upper case, letters and digits only, leading zeros of each number dropped: 21-CH-01 and 21ch1 fold alike.</summary>
    internal static string Folded(string id)
    {
        var sb = new StringBuilder(id.Length);
        bool inNumber = false;
        foreach (char ch in id.ToUpperInvariant())
        {
            if (!char.IsLetterOrDigit(ch))
            {
                inNumber = false;
                continue;
            }

            bool digit = char.IsDigit(ch);
            if (digit && !inNumber && ch == '0')
            {
                continue;
            }

            inNumber = digit && (inNumber || ch != '0');
            sb.Append(ch);
        }

        return sb.ToString();
    }

    /// <summary>The lab sheets named for a message: "file, sheet \"name\"" (or the file alone for a CSV), each once.</summary>
    internal static string SheetNames(IEnumerable<SheetContext> sheets) =>
        string.Join(", ", sheets.Select(s => s.SheetName is null ? s.File : $"{s.File}, sheet \"{s.SheetName}\"").Distinct(StringComparer.Ordinal));

    internal static string Year(int? season) => season is { } s ? s.ToString(CultureInfo.InvariantCulture) : "no season";
}
