using StratLink.Alignment;
using StratLink.Compositing;
using StratLink.ProjectIO;
using StratLink.Workflows;
using static StratLink.Tests.Compositing.CompositeFixture;

namespace StratLink.Tests.Compositing;

public class SpliceTests
{
    // Splice conventions (IODP CCSF-D, methods.md section 5): a complete section from intervals of
    // adjacent holes, joined at tie points, skipping coring gaps and disturbance.

    [Fact]
    public void Manual_splice_with_an_overlap_a_hole_and_an_interval_in_a_gap_gives_three_findings_with_lines()
    {
        const string yaml = """
            format: stratlink-project/1
            site: {name: Test Basin}
            depth_unit: cm
            cores:
              - id: A
                table: cores/A.csv
                gaps:
                  - [85, 88]
              - id: B
                table: cores/B.csv
                gaps:
                  - [20, 24]
            alignment:
              reference: A
            composite:
              step: 1
              splice:
                - {core: A, from: 0, to: 30}
                - {core: B, from: 25, to: 50}
                - {core: A, from: 55, to: 80}
                - {core: B, from: 80, to: 100}
            """;
        var doc = ProjectReader.Parse(yaml, "/virtual/test.yaml");
        Assert.False(doc.Problems.HasErrors, string.Join("\n", doc.Problems));
        var project = doc.Project!;
        var loaded = new LoadedProject(doc, project, new Dictionary<string, StratLink.Tables.CoreTable>
        {
            ["A"] = Table("A", Depths(0, 100, 1), ("ms", d => d)),
            ["B"] = Table("B", Depths(0, 100, 1), ("ms", d => d)),
        }, doc.Problems);
        // B sits 5 cm deeper on the composite scale: composite 25-50 cm is B 20-45 cm, through its gap 20-24.
        var alignment = Aligned("A", Ensemble(DepthMapping.Identity("A", Cm, 0, 100)), Ensemble(Shift("B", 5)));

        var result = CompositeBuilder.Build(loaded, alignment, null, null, CancellationToken.None);

        var overlap = Assert.Single(result.Findings, f => f.Code == ManualSplice.Overlap);
        var hole = Assert.Single(result.Findings, f => f.Code == ManualSplice.Hole);
        var gap = Assert.Single(result.Findings, f => f.Code == ManualSplice.InGap);
        Assert.Equal(3, result.Findings.Count);
        Assert.Equal("Splice intervals 0 (A, 0-30 cm) and 1 (B, 25-50 cm) overlap from 25 to 30 cm composite depth; each composite depth must come from one core.", overlap.Message);
        Assert.Equal("No splice interval covers composite depth 50 to 55 cm (between intervals 1 and 2); the splice has a hole there.", hole.Message);
        Assert.Contains("takes core B from 20 to 45 cm core depth, through its gap 20-24 cm", gap.Message);
        // Lines of the offending intervals in the file above (1-based): interval 1 is on line 19, interval 2 on 20.
        Assert.Equal(19, overlap.Line);
        Assert.Equal(20, hole.Line);
        Assert.Equal(19, gap.Line);
        Assert.Equal("/virtual/test.yaml", gap.File);
        Assert.Equal("B", gap.Core);
        Assert.False(result.Splice.Automatic);
        Assert.Equal(["A", "B", "A", "B"], result.Splice.Pieces.Select(p => p.Core));
        // Rows of the hole have no source core; the base of the last interval is still spliced.
        Assert.Null(result.Splice.SourceByRow[52]);
        Assert.Equal("B", result.Splice.SourceByRow[100]);
        // The spliced value takes B's median mapping (composite 90 = B 85 cm).
        Assert.Equal(85, result.Record("ms")!.Spliced[90], 9);
    }

    [Fact]
    public void Automatic_splice_never_takes_a_core_inside_its_gaps_or_disturbed_intervals()
    {
        // Three cores with overlapping gaps and disturbed tops, offsets of a few cm.
        var specs = new[]
        {
            Spec("A", gaps: [(40, 50), (130, 133)], disturbed: [(0, 4)]),
            Spec("B", gaps: [(70, 75)], disturbed: [(0, 6), (118, 121.5)]),
            Spec("C", gaps: [(28, 31), (100, 112)], disturbed: [(0, 3)]),
        };
        var offsets = new Dictionary<string, double> { ["A"] = 0, ["B"] = 3.5, ["C"] = -2.25 };
        var tables = specs.Select(s => Table(s.Id, Depths(0, 150, 0.5), ("ms", d => Math.Sin(d / 7)))).ToArray();
        var alignment = Aligned("A", [.. specs.Select(s => Ensemble(Shift(s.Id, offsets[s.Id]),
            Shift(s.Id, offsets[s.Id] - 0.3), Shift(s.Id, offsets[s.Id]), Shift(s.Id, offsets[s.Id] + 0.3)))]);
        var loaded = Load(Project("A", 0.5, specs), tables);

        var result = CompositeBuilder.Build(loaded, alignment, null, null, CancellationToken.None);

        Assert.True(result.Splice.Automatic);
        for (int r = 0; r < result.Grid.Count; r++)
        {
            string? core = result.Splice.SourceByRow[r];
            if (core is null) continue;
            double coreDepth = result.Grid.ValueAt(r) - offsets[core];
            Assert.False(specs.First(s => s.Id == core).IsUnusable(coreDepth), $"row {result.Grid.ValueAt(r)} takes {core} at {coreDepth} cm, a gap or disturbed interval");
        }
        foreach (var p in result.Splice.Pieces)
        {
            var spec = specs.First(s => s.Id == p.Core);
            foreach (var iv in spec.Gaps.Concat(spec.Disturbed))
                Assert.False(iv.Top.In(Cm) < p.CoreTo.In(Cm) && iv.Bottom.In(Cm) > p.CoreFrom.In(Cm), $"piece {p} runs through {iv}");
        }
        // Every row some core can supply is spliced: no row lacks a source while a core has usable data there.
        Assert.All(Enumerable.Range(0, result.Grid.Count), r =>
        {
            double z = result.Grid.ValueAt(r);
            bool anyUsable = specs.Any(s => z - offsets[s.Id] >= 0 && z - offsets[s.Id] <= 150 && !s.IsUnusable(z - offsets[s.Id]));
            Assert.Equal(anyUsable, result.Splice.SourceByRow[r] is not null);
        });
        // Pieces are contiguous where both cores overlap, and the reference is preferred: at most two
        // switches per interruption of A (its disturbed top and its two gaps).
        Assert.True(result.Splice.Pieces.Count <= 1 + 2 * 3, $"{result.Splice.Pieces.Count} pieces");
        Assert.Empty(result.Findings);
    }

    [Fact]
    public void Automatic_tie_goes_where_the_mapping_ensemble_is_narrow()
    {
        // B's four members agree above 30 cm and fan out linearly to +-5 cm at 40 cm and below. A's gap at
        // 40-50 forces a switch to B somewhere above 40: the tie should sit near 30 cm where the mapping is
        // tight, not just above the gap where it is 9.6 cm wide.
        static DepthMapping Fan(double s) => new("B", Cm, [0, 30, 40, 100], [0, 30, 40 + 5 * s, 100 + 5 * s]);
        var a = Table("A", Depths(0, 100, 1), ("ms", d => d));
        var b = Table("B", Depths(0, 100, 1), ("ms", d => d));
        var alignment = Aligned("A", Ensemble(DepthMapping.Identity("A", Cm, 0, 100)), Ensemble(Fan(0), Fan(-1), Fan(-0.5), Fan(0.5), Fan(1)));
        var result = CompositeBuilder.Build(Load(Project("A", 1, Spec("A", gaps: [(40, 50)]), Spec("B")), a, b), alignment, null, null, CancellationToken.None);

        var toB = result.Splice.Pieces.First(p => p.Core == "B");
        Assert.InRange(toB.From.In(Cm), 29, 31);
    }
}
