using ClosedXML.Excel;
using YieldBench.Core.Lots;
using YieldBench.Intake;

namespace YieldBench.Intake.Tests;

/// <summary>Lab results kept on a sheet or file of their own, joined to the lots by the lot id written alike.</summary>
public sealed class LabResultsJoinTests
{
    [Fact]
    public void Lab_results_on_their_own_sheet_complete_the_lots_whose_ids_are_written_alike()
    {
        // Given the lab's sheet first (Lot, Alc, RS, pH; one result for a lot not in the cellar sheet), then a cellar sheet
        // with lot, yeast, vintage and crush sugar but no final alcohol (one lot the lab has not reported yet)
        using var folder = new TestFolder();
        using (var wb = new XLWorkbook())
        {
            Workbooks.Fill(wb.AddWorksheet("Lab"), ["Lot", "Alc % vol", "RS g/L", "pH"], ["21-CH-01", 13.62, 1.2, 3.31], ["21-PN-03", 14.55, 2.1, 3.62], ["21-SY-09", 14.1, 1.0, 3.7]);
            Workbooks.Fill(wb.AddWorksheet("Cellar"), ["Lot", "Yeast", "Vintage", "Crush Brix", "pH"], ["21-CH-01", "QR-A4", 2021, 23.4, null], ["21-PN-03", "QR-B9", 2021, 25.2, 3.55], ["21-CH-02", "QR-A4", 2021, 22.8, null]);
            wb.SaveAs(folder.PathOf("cellar.xlsx"));
        }

        // When read
        var set = folder.Read("cellar.xlsx");

        // Then the two lots with a result are read with the lab's alcohol and residual sugar; the cellar's own pH stands
        // where it has one, the lab's fills the gap
        Assert.Equal(["21-CH-01", "21-PN-03"], set.Lots.Select(l => l.LotId));
        var ch = set.Lots[0];
        var pn = set.Lots[1];
        Assert.Equal((13.62, 1.2, 3.31, 23.4), (ch.FinalAlcohol.PercentVolume, ch.ResidualSugarGl!.Value, ch.Ph!.Value, ch.StartingSugar.Brix));
        Assert.Equal((14.55, 2.1, 3.55, 2021), (pn.FinalAlcohol.PercentVolume, pn.ResidualSugarGl!.Value, pn.Ph!.Value, pn.Season));
        Assert.Equal(new SourceRef("cellar.xlsx", "Cellar", 3), pn.Source);

        // and the join is said once for the cellar sheet; the lot with no result and the result with no lot are errors
        // at their rows
        var joined = Assert.Single(set.Issues, i => i.Code == IssueCodes.LabResultsJoined);
        Assert.Equal((IssueSeverity.Warning, "Cellar"), (joined.Severity, joined.Sheet));
        Assert.Contains("lab results on cellar.xlsx, sheet \"Lab\"", joined.Message, StringComparison.Ordinal);
        var noResult = Assert.Single(set.Issues, i => i.Code == IssueCodes.NoLabResult);
        Assert.Equal((IssueSeverity.Error, "Cellar", 4, "Lot", "21-CH-02"), (noResult.Severity, noResult.Sheet, noResult.Row!.Value, noResult.Column, noResult.Value));
        Assert.Equal("Lot '21-CH-02' (season 2021) has no final alcohol: its sheet has no final alcohol column and no lab result on cellar.xlsx, sheet \"Lab\" bears its id, so the lot was left out. Add its result to the lab sheet under the same id.", noResult.Message);
        var orphan = Assert.Single(set.Issues, i => i.Code == IssueCodes.LabResultWithoutLot);
        Assert.Equal(("Lab", 4, "21-SY-09"), (orphan.Sheet, orphan.Row!.Value, orphan.Value));
        Assert.DoesNotContain(set.Issues, i => i.Code is IssueCodes.MissingColumn or IssueCodes.LabResultsApart);

        // and every row is accounted for: the lab's two used and one reported, the cellar's two used and one reported
        var lab = set.Accounts.Single(a => a.Sheet == "Lab");
        var cellar = set.Accounts.Single(a => a.Sheet == "Cellar");
        Assert.Equal(("lab results", 2, 1), (lab.Kind, lab.LotsUsed, lab.RowsReported));
        Assert.Equal((2, 1), (cellar.LotsUsed, cellar.RowsReported));
    }

    [Fact]
    public void Ids_written_differently_are_not_joined_and_each_side_names_the_look_alike()
    {
        // Given a lots CSV without final alcohol and the lab's CSV under its own ids (21CH1 for 21-CH-01), a season given
        using var folder = new TestFolder();
        folder.Text("lots-2021.csv", "Lot,Yeast,Brix\n21-CH-01,QR-A4,23.4\n");
        folder.Text("lab-2021.csv", "Sample ID,Alcohol % v/v,RS\n21CH1,13.6,1.2\n");

        // When read
        var set = folder.Read("lots-2021.csv", "lab-2021.csv");

        // Then no lot is made of a guess; the lot and the result each name the other's id as a look-alike
        Assert.Empty(set.Lots);
        var noResult = Assert.Single(set.Issues, i => i.Code == IssueCodes.NoLabResult);
        Assert.Contains("The lab sheet has '21CH1', perhaps the same lot written differently", noResult.Message, StringComparison.Ordinal);
        var orphan = Assert.Single(set.Issues, i => i.Code == IssueCodes.LabResultWithoutLot);
        Assert.Equal(("lab-2021.csv", 2, "Sample ID"), (orphan.File, orphan.Row!.Value, orphan.Column));
        Assert.Contains("A lot '21-CH-01' was read, perhaps the same lot written differently", orphan.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("21-CH-01", "21ch1")]
    [InlineData("T 03 / 2024", "t3-2024")]
    [InlineData("B-100", "b100")]
    public void Ids_fold_alike_when_only_case_separators_and_leading_zeros_differ(string a, string b) =>
        Assert.Equal(LabJoin.Folded(a), LabJoin.Folded(b));

    [Theory]
    [InlineData("21-CH-01", "21-CH-10")]
    [InlineData("B-100", "B-10")]
    public void Different_numbers_do_not_fold_alike(string a, string b) =>
        Assert.NotEqual(LabJoin.Folded(a), LabJoin.Folded(b));

    [Fact]
    public void A_lab_sheet_with_no_lot_id_column_is_told_to_map_one()
    {
        using var folder = new TestFolder();
        folder.Text("lots-2021.csv", "Lot,Yeast,Brix\n21-CH-01,QR-A4,23.4\n");
        folder.Text("lab-2021.csv", "Sample,Alcohol % v/v,RS\n21CH1,13.6,1.2\n");

        var set = folder.Read("lots-2021.csv", "lab-2021.csv");

        var apart = Assert.Single(set.Issues, i => i.Code == IssueCodes.LabResultsApart);
        Assert.Equal("lab-2021.csv", apart.File);
        Assert.Contains("but no lot id column, strain or starting sugar", apart.Message, StringComparison.Ordinal);
        Assert.Contains("map it with --column lot_id=HEADER", apart.Message, StringComparison.Ordinal);
        Assert.Empty(set.Lots);
    }

    [Fact]
    public void A_second_result_for_the_same_lot_is_an_error_and_the_first_is_used()
    {
        using var folder = new TestFolder();
        folder.Text("lots-2021.csv", "Lot,Yeast,Brix\n21-CH-01,QR-A4,23.4\n");
        folder.Text("lab-2021.csv", "Lot,Alcohol % v/v\n21-CH-01,13.6\n21-CH-01,13.9\n");

        var set = folder.Read("lots-2021.csv", "lab-2021.csv");

        Assert.Equal(13.6, Assert.Single(set.Lots).FinalAlcohol.PercentVolume);
        var dup = Assert.Single(set.Issues, i => i.Code == IssueCodes.DuplicateLabResult);
        Assert.Equal((IssueSeverity.Error, 3), (dup.Severity, dup.Row!.Value));
    }
}
