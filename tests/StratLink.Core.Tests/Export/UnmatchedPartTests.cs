using System.Globalization;
using StratLink.Alignment;
using StratLink.Compositing;
using StratLink.Demo;
using StratLink.Export;
using StratLink.Tests.Alignment;
using Xunit.Abstractions;

namespace StratLink.Tests.Export;

/// <summary>
/// Parts of a core that no other core reaches, against the generator's hidden truth: on a generated
/// site whose gravity core runs about 300 cm past the reference's base, the samples that
/// <c>mapping-&lt;core&gt;.csv</c> marks <c>matched</c> = 0 must be those whose true composite depth
/// lies outside every other core's true span, except within the alignment's error of a span's end
/// (twice the dtw RMS past the reference, about 9 cm on this site, at most 10 cm here), and the
/// composite must count one core (<c>&lt;signal&gt;_n</c> = 1) wherever it has a value there.
/// </summary>
public class UnmatchedPartTests(ITestOutputHelper output)
{
    private const double EndTolerance = 10;

    private static string[][] Rows(Action<TextWriter> write)
    {
        var sw = new StringWriter();
        write(sw);
        return [.. sw.ToString().TrimEnd('\n').Split('\n').Select(l => l.Split(','))];
    }

    private static double Number(string s) => s.Length == 0 ? double.NaN : double.Parse(s, CultureInfo.InvariantCulture);

    [Fact]
    public void The_part_past_every_other_core_is_marked_unmatched_and_counts_one_core_in_the_composite()
    {
        var site = DemoSiteGenerator.Generate(1, SiteShapeAlignmentTests.DeepCore);
        var loaded = SiteShapeAlignmentTests.Load(site);
        var result = CompositeBuilder.Build(loaded, CoreAligner.Align(loaded, null, default), null, null, default);
        const string deep = "MW19-G3";
        var table = result.Mappings.Single(m => m.CoreId == deep);
        var rows = Rows(w => MappingCsvWriter.Write(table, result.Mappings, w));
        int col = Array.IndexOf(rows[0], "matched");
        Assert.True(col >= 0, "mapping table has no matched column");

        // True spans of the other cores on composite depth (the generator's truth).
        var spans = site.Truth.Where(t => t.Key != deep).Select(t => (Top: t.Value.CompositeDepths.Min(), Base: t.Value.CompositeDepths.Max())).ToArray();
        var truth = site.Truth[deep];
        int unmatched = 0, wrong = 0;
        for (int k = 0; k < truth.Depths.Length; k++)
        {
            var row = rows[k + 1];
            Assert.Equal(truth.Depths[k], Number(row[0]), 1e-9);
            double t = truth.CompositeDepths[k];
            bool expected = spans.Any(s => t >= s.Top && t <= s.Base);
            bool marked = row[col] == "1";
            if (!marked) unmatched++;
            if (marked == expected) continue;
            double toEnd = spans.Min(s => Math.Min(Math.Abs(t - s.Top), Math.Abs(t - s.Base)));
            Assert.True(toEnd <= EndTolerance, $"{deep} at {truth.Depths[k]} cm (true composite {t:0.0}) is marked matched = {row[col]}, {toEnd:0.0} cm from the nearest end of another core");
            wrong++;
        }
        output.WriteLine($"{deep}: {unmatched} of {truth.Depths.Length} samples marked unmatched; {wrong} differ from the truth, all within {EndTolerance} cm of another core's end");
        Assert.True(unmatched > 400, $"only {unmatched} samples marked unmatched; the core runs about 300 cm (600 samples) past the others");

        // The composite rows in the marked part: one core, wherever there is a value at all.
        var matched = MappingCsvWriter.Matched(table, result.Mappings);
        double firstUnmatched = table.Median.Where((_, i) => !matched[i] && table.Median[i] > spans.Max(s => s.Base) - 50).Min();
        var composite = Rows(w => CompositeCsvWriter.Write(result, w));
        var nCols = composite[0].Select((name, i) => (name, i)).Where(c => c.name.EndsWith("_n", StringComparison.Ordinal)).Select(c => c.i).ToArray();
        int checkedRows = 0, single = 0;
        foreach (var row in composite.Skip(1).Where(r => Number(r[0]) >= firstUnmatched))
        {
            foreach (int c in nCols)
            {
                Assert.True(row[c] is "0" or "1", $"composite {row[0]}: {composite[0][c]} = {row[c]} where only {deep} has record");
                if (row[c] == "1") single++;
                Assert.Equal(row[c] == "0", double.IsNaN(Number(row[c - 3])));
            }
            checkedRows++;
        }
        output.WriteLine($"composite below {firstUnmatched:0.0} cm: {checkedRows} rows, {single} signal cells with n = 1, none with more");
        Assert.True(single > checkedRows, "the unmatched part contributes no values to the composite");
    }
}
