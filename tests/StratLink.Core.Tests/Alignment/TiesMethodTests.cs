using StratLink.Alignment;
using StratLink.Checks;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Tables;
using StratLink.Workflows;

namespace StratLink.Tests.Alignment;

/// <summary>
/// The <c>ties</c> method: straight lines through marker ties in (core depth, reference depth),
/// extended with the mean rate ratio of all ties (1 with one tie); chains through other cores;
/// identity with a warning when no chain exists. Expected values are worked by hand from those rules.
/// </summary>
public class TiesMethodTests
{
    private static MarkerSpec Marker(string id, params (string Core, double Depth)[] depths) => new()
    {
        Id = id,
        Depths = [.. depths.Select(d => new MarkerDepth(d.Core, CoreDepth.From(d.Depth, DepthUnit.Centimetre)))],
    };

    private static LoadedProject Site(params MarkerSpec[] markers)
    {
        string[] ids = ["A", "B", "C", "D"];
        var depths = Enumerable.Range(0, 101).Select(i => (double)i).ToArray();
        var tables = ids.ToDictionary(id => id, id => new CoreTable(id, DepthUnit.Centimetre, depths, new Dictionary<string, double[]> { ["ms"] = depths.Select(Math.Sin).ToArray() }));
        var project = new Project
        {
            DepthUnit = DepthUnit.Centimetre,
            Cores = [.. ids.Select(id => new CoreSpec { Id = id, Table = id + ".csv" })],
            Markers = [.. markers],
            Alignment = new AlignmentSettings { Reference = "A", Method = AlignmentMethods.Ties },
        };
        var doc = new ProjectDocument("ties.yaml", project, new FindingList(), new SourceMap("ties.yaml"));
        return new LoadedProject(doc, project, tables, new FindingList());
    }

    [Fact]
    public void Ties_chain_and_identity()
    {
        var site = Site(
            Marker("m1", ("A", 10), ("B", 12)),
            Marker("m2", ("A", 50), ("B", 62)),
            Marker("m3", ("B", 30), ("C", 25)));
        var r = CoreAligner.Align(site, null, default);
        Assert.Equal("ties", r.Method);
        const double tol = 1e-12;

        var a = r.Mappings["A"].Median;
        Assert.Equal(37.5, a.ToCompositeValue(37.5), tol);

        // B: through (12, 10) and (62, 50), slope 0.8 beyond them too.
        var b = r.Mappings["B"].Median;
        Assert.Equal(10, b.ToCompositeValue(12), tol);
        Assert.Equal(30, b.ToCompositeValue(37), tol);
        Assert.Equal(10 - 0.8 * 12, b.ToCompositeValue(0), tol);
        Assert.Equal(50 + 0.8 * 38, b.ToCompositeValue(100), tol);
        Assert.Empty(r.Mappings["B"].Members);

        // C: one tie carried through B: 25 in C = 30 in B = 10 + 0.8 * 18 = 24.4 composite; slope 1.
        var c = r.Mappings["C"].Median;
        Assert.Equal(24.4, c.ToCompositeValue(25), tol);
        Assert.Equal(24.4 + 10, c.ToCompositeValue(35), tol);

        // D: no chain: identity, with a warning.
        Assert.Equal(42, r.Mappings["D"].Median.ToCompositeValue(42), tol);
        Assert.Contains(r.Findings, f => f.Code == "alignment.untied" && f.Core == "D");
        Assert.Equal("identity", r.Diagnostics["D"].Method);
    }

    [Fact]
    public void A_crossing_tie_is_left_out_with_a_warning()
    {
        var site = Site(
            Marker("m1", ("A", 10), ("B", 12)),
            Marker("m2", ("A", 50), ("B", 62)),
            Marker("m3", ("A", 40), ("B", 70)));
        var r = CoreAligner.Align(site, null, default);
        Assert.Contains(r.Findings, f => f.Code == "alignment.tie-crossing" && f.Item == "m3");
        Assert.Equal(50, r.Mappings["B"].Median.ToCompositeValue(62), 1e-12);
    }

    [Fact]
    public void Dtw_honours_ties_and_is_reproducible_bit_for_bit()
    {
        var s = SyntheticCores.Make(seed: 5, markers: 3);
        var r1 = CoreAligner.Align(s.Project, null, default);
        var r2 = CoreAligner.Align(s.Project, null, default);
        var m1 = r1.Mappings["CORE"];
        var m2 = r2.Mappings["CORE"];
        Assert.Equal(m1.Members.Count, m2.Members.Count);
        for (int e = 0; e < m1.Members.Count; e++)
        {
            Assert.Equal(m1.Members[e].CoreKnots, m2.Members[e].CoreKnots);
            Assert.Equal(m1.Members[e].CompositeKnots, m2.Members[e].CompositeKnots);
        }
        Assert.Equal(7, r1.Seed);
        // Exact ties (uncertainty 0), snapped to the 1 cm grid: every member passes through every tie.
        foreach (var marker in s.Project.Project.Markers)
        {
            double z = Math.Round(marker.DepthIn("CORE")!.Value.In(DepthUnit.Centimetre), MidpointRounding.AwayFromZero);
            double target = Math.Round(marker.DepthIn("REF")!.Value.In(DepthUnit.Centimetre), MidpointRounding.AwayFromZero);
            foreach (var member in m1.Members) Assert.Equal(target, member.ToCompositeValue(z), 1e-9);
        }
        Assert.Equal(4, r1.Diagnostics["CORE"].Segments);
    }

    [Fact]
    public void Tie_uncertainty_keeps_the_path_inside_its_box()
    {
        var s = SyntheticCores.Make(seed: 5, markers: 2, uncertainty: 3);
        var r = CoreAligner.Align(s.Project, null, default);
        Assert.Equal(1, r.Diagnostics["CORE"].Segments);
        foreach (var marker in s.Project.Project.Markers)
        {
            double z = Math.Round(marker.DepthIn("CORE")!.Value.In(DepthUnit.Centimetre), MidpointRounding.AwayFromZero);
            double target = Math.Round(marker.DepthIn("REF")!.Value.In(DepthUnit.Centimetre), MidpointRounding.AwayFromZero);
            foreach (var member in r.Mappings["CORE"].Members)
                Assert.InRange(member.ToCompositeValue(z), target - 3 - 1e-9, target + 3 + 1e-9);
        }
    }
}
