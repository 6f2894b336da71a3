using System.Collections.Immutable;
using StratLink.Checks;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Tables;

namespace StratLink.Tests.Tables;

/// <summary>Rows that repeat a depth, folded as the core's repeated_depths says (arithmetic checked by hand), and column renaming.</summary>
public sealed class ReplicateCombinerTests : IDisposable
{
    private readonly TempFolder _dir = new();
    private readonly FindingList _problems = [];

    public void Dispose() => _dir.Dispose();

    // Two species at 2 cm and three replicates at 3 cm, one of them missing.
    private const string Replicates = "depth,d18O,d13C\n1,3.0,0.5\n2,3.2,0.1\n2,3.6,0.3\n3,4.0,NA\n3,4.4,0.2\n3,5.0,0.6\n4,3.9,0.4\n";

    private CoreTable? Read(string text, CoreSpec spec) =>
        CoreTableReader.Read(_dir.Write("t.csv", text), spec, DepthUnit.Centimetre, _problems, CancellationToken.None);

    private static CoreSpec Spec(RepeatedDepths how) => new() { Id = "GS-1", Table = "t.csv", RepeatedDepths = how };

    [Fact]
    public void Repeated_depths_are_an_error_by_default_naming_the_line_and_the_key_that_folds_them()
    {
        Assert.Null(Read(Replicates, Spec(RepeatedDepths.Error)));
        var e = _problems.First(p => p.Code == ProjectCodes.TableDepthOrder);
        Assert.Equal(4, e.Line);
        Assert.Contains("repeated_depths", e.Message);
    }

    [Theory]
    // mean: (3.2+3.6)/2 = 3.4, (4.0+4.4+5.0)/3 = 4.4667; d13C at 3 cm leaves NA out: (0.2+0.6)/2 = 0.4
    [InlineData(RepeatedDepths.Mean, 3.4, 4.466666666666667, 0.4)]
    // median: of 3.2, 3.6 the middle two's mean 3.4; of 4.0, 4.4, 5.0 the middle 4.4; d13C of 0.2, 0.6: 0.4
    [InlineData(RepeatedDepths.Median, 3.4, 4.4, 0.4)]
    // first: the first row in file order, its missing value kept missing
    [InlineData(RepeatedDepths.First, 3.2, 4.0, double.NaN)]
    public void Replicates_fold_into_one_sample_per_depth(RepeatedDepths how, double d18OAt2, double d18OAt3, double d13CAt3)
    {
        var t = Read(Replicates, Spec(how));
        Assert.NotNull(t);
        Assert.Equal([1.0, 2, 3, 4], t.Depths);
        Assert.Equal([2, 3, 5, 8], t.SourceLines!);
        Assert.Equal(d18OAt2, t.Signals["d18O"][1], 1e-12);
        Assert.Equal(d18OAt3, t.Signals["d18O"][2], 1e-12);
        Assert.Equal(d13CAt3, t.Signals["d13C"][2], 1e-12);
        Assert.Equal(3.9, t.Signals["d18O"][3]);
        var note = Assert.Single(_problems, p => p.Code == ProjectCodes.TableRepeatsCombined);
        Assert.Equal(Severity.Note, note.Severity);
        Assert.Contains("3 row(s)", note.Message);
    }

    [Fact]
    public void Sorting_brings_scattered_replicates_together_before_they_are_folded()
    {
        var t = Read("depth,x\n2,1\n1,5\n2,3\n", Spec(RepeatedDepths.Mean) with { Sort = true });
        Assert.NotNull(t);
        Assert.Equal([1.0, 2], t.Depths);
        Assert.Equal([5.0, 2], t.Signals["x"]);
    }

    [Fact]
    public void Columns_rename_a_table_column_onto_the_project_signal_name()
    {
        var spec = new CoreSpec
        {
            Id = "GS-2", Table = "t.csv", Signals = ["d18O"],
            Columns = new Dictionary<string, string> { ["o18(o/oo PDB)"] = "d18O" }.ToImmutableDictionary(),
        };
        var t = Read("depth;o18(o/oo PDB);c13\n1;2,5;0,1\n2;2,7;0,2\n", spec);
        Assert.NotNull(t);
        Assert.Equal(["d18O"], t.SignalNames);
        Assert.Equal([2.5, 2.7], t.Signals["d18O"]);
        Assert.Empty(_problems);
    }

    [Fact]
    public void Renaming_a_column_the_table_lacks_is_an_error_listing_the_header()
    {
        var spec = new CoreSpec { Id = "GS-2", Table = "t.csv", Columns = new Dictionary<string, string> { ["d18"] = "d18O" }.ToImmutableDictionary() };
        Assert.Null(Read("depth,d18O\n1,2\n", spec));
        var e = Assert.Single(_problems, p => p.Code == ProjectCodes.TableMissingColumn);
        Assert.Contains("'d18'", e.Message);
        Assert.Contains("depth, d18O", e.Message);
    }
}
