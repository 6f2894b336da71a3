using StratLink.Alignment;
using StratLink.Compositing;
using StratLink.Export;
using StratLink.Tests.Compositing;
using static StratLink.Tests.Compositing.CompositeFixture;

namespace StratLink.Tests.Export;

public class CompositeTablesTests
{
    private static CompositeResult Build(bool withAges)
    {
        var a = Table("A", Depths(0, 20, 1), ("ms", d => d), ("ca_ti", d => 2 * d));
        var b = Table("B", Depths(0, 20, 1), ("ms", d => d + 1));
        var alignment = Aligned("A", Ensemble(DepthMapping.Identity("A", Cm, 0, 20)),
            Ensemble(Shift("B", 2), Shift("B", 1), Shift("B", 2), Shift("B", 3)));
        return CompositeBuilder.Build(Load(Project("A", 0.5, Spec("A", gaps: [(8, 10)]), Spec("B")), a, b), alignment,
            withAges ? new LinearAgeScale(-68, 10, 20) : null, null, CancellationToken.None);
    }

    private static string[][] Rows(Action<TextWriter> write)
    {
        var sw = new StringWriter();
        write(sw);
        return [.. sw.ToString().TrimEnd('\n').Split('\n').Select(l => l.Split(','))];
    }

    [Fact]
    public void Composite_table_has_the_specified_columns_ascending_rows_and_empty_ages_without_a_model()
    {
        var result = Build(withAges: false);
        var rows = Rows(w => CompositeCsvWriter.Write(result, w));
        Assert.Equal(["composite_depth_cm", "age_median_bp", "age_lo_bp", "age_hi_bp", "source_core",
            "ms_mean", "ms_lo", "ms_hi", "ms_n", "ms_splice", "ca_ti_mean", "ca_ti_lo", "ca_ti_hi", "ca_ti_n", "ca_ti_splice"], rows[0]);
        Assert.Equal(result.Grid.Count + 1, rows.Length);
        var depths = rows.Skip(1).Select(r => double.Parse(r[0], System.Globalization.CultureInfo.InvariantCulture)).ToArray();
        Assert.True(depths.Zip(depths.Skip(1)).All(p => p.Second > p.First));
        Assert.All(rows.Skip(1), r => Assert.Equal(["", "", ""], r[1..4]));
        // Composite 9 cm: A is in its gap, B (2 cm deeper on the composite) gives ms = 7 + 1 from its median member;
        // ca_ti only exists in A, so nothing there.
        var at9 = rows.Single(r => r[0] == "9");
        Assert.Equal("B", at9[4]);
        Assert.Equal("1", at9[8]);
        Assert.Equal("8", at9[9]);
        Assert.Equal("0", at9[13]);
        Assert.Equal("", at9[10]);
    }

    [Fact]
    public void Composite_table_carries_the_age_model()
    {
        var rows = Rows(w => CompositeCsvWriter.Write(Build(withAges: true), w));
        var at5 = rows.Single(r => r[0] == "5");
        Assert.Equal(["-18", "-38", "2"], at5[1..4]);
    }

    [Fact]
    public void Mapping_table_gives_the_ensemble_percentiles_at_every_sample()
    {
        // B's members shift by 1, 2 and 3 cm: R quantile(c(1, 2, 3), c(0.025, 0.975), type = 7) = 1.05, 2.95
        // (Hyndman and Fan 1996 type 7), so at sample depth d the band is d + 1.05 to d + 2.95.
        var result = Build(withAges: false);
        var rows = Rows(w => MappingCsvWriter.Write(result.Mappings.Single(m => m.CoreId == "B"), result.Mappings, w));
        Assert.Equal(["depth_cm", "composite_depth_cm", "composite_depth_lo_cm", "composite_depth_hi_cm", "matched"], rows[0]);
        Assert.Equal(22, rows.Length);
        var row = rows[6].Select(c => double.Parse(c, System.Globalization.CultureInfo.InvariantCulture)).ToArray();
        Assert.Equal(5, row[0]);
        Assert.Equal(7, row[1], 12);
        Assert.Equal(6.05, row[2], 12);
        Assert.Equal(7.95, row[3], 12);
        Assert.Equal("mapping-B.csv", MappingCsvWriter.FileName("B"));
        var all = Rows(w => CompositeOutputs.WriteTable(result, CompositeTableKind.Mappings, w));
        Assert.Equal(["core", "depth_cm", "composite_depth_cm", "composite_depth_lo_cm", "composite_depth_hi_cm", "matched"], all[0]);
        Assert.Equal(1 + 21 + 21, all.Length);
    }

    [Fact]
    public void Mapping_table_of_a_core_with_event_layers_gives_its_event_free_depth()
    {
        // Events at 2-4 and 10-11 cm: event-free depth = depth less the thickness of the events above it, and inside
        // an event the event-free depth of its top (an event takes no time; worked by hand).
        var result = Build(withAges: false);
        var events = new StratLink.AgeModelling.EventFreeScale([2, 10], [4, 11]);
        var rows = Rows(w => MappingCsvWriter.Write(result.Mappings.Single(m => m.CoreId == "B"), result.Mappings, w, TableFormat.Csv, events));
        Assert.Equal("event_free_depth_cm", rows[0][^1]);
        var byDepth = rows.Skip(1).ToDictionary(r => r[0], r => double.Parse(r[^1], System.Globalization.CultureInfo.InvariantCulture));
        Assert.Equal(1, byDepth["1"], 12);
        Assert.Equal(2, byDepth["3"], 12);
        Assert.Equal(3, byDepth["5"], 12);
        Assert.Equal(10, byDepth["13"], 12);
    }

    [Fact]
    public void Splice_table_lists_intervals_in_composite_and_core_depth()
    {
        var result = Build(withAges: false);
        var rows = Rows(w => CompositeOutputs.WriteTable(result, CompositeTableKind.Splice, w));
        Assert.Equal(["composite_depth_from_cm", "composite_depth_to_cm", "core", "core_depth_from_cm", "core_depth_to_cm"], rows[0]);
        Assert.Equal(result.Splice.Pieces.Count + 1, rows.Length);
        // B fills A's gap at 8-10 cm: its interval in B's depths is 2 cm shallower.
        var b = rows.Skip(1).Single(r => r[2] == "B");
        double from = double.Parse(b[0], System.Globalization.CultureInfo.InvariantCulture);
        double coreFrom = double.Parse(b[3], System.Globalization.CultureInfo.InvariantCulture);
        Assert.True(from < 8 && double.Parse(b[1], System.Globalization.CultureInfo.InvariantCulture) > 10);
        Assert.Equal(from - 2, coreFrom, 12);
    }
}
