using System.Xml.Linq;
using StratLink.Alignment;
using StratLink.Compositing;
using StratLink.Export;
using StratLink.Model;
using StratLink.Quantities;
using static StratLink.Tests.Compositing.CompositeFixture;

namespace StratLink.Tests.Export;

public class FigureTests
{
    private static readonly XNamespace Svg = "http://www.w3.org/2000/svg";

    private static (StratLink.Workflows.LoadedProject, CompositeResult) Site(bool withAges)
    {
        var a = Table("A", Depths(0, 200, 0.5), ("ms", d => Math.Sin(d / 9)), ("density", d => 1.4 + 0.1 * Math.Cos(d / 13)));
        var b = Table("B", Depths(0, 180, 0.5), ("ms", d => Math.Sin((d + 6) / 9)), ("density", d => 1.4 + 0.1 * Math.Cos((d + 6) / 13)));
        var c = Table("C", Depths(0, 150, 0.5), ("ms", d => Math.Sin((d - 4) / 9)));
        var project = Project("A", 0.5, Spec("A", gaps: [(118, 121.5)], disturbed: [(0, 4)]), Spec("B", gaps: [(60, 64)]), Spec("C")) with
        {
            Markers =
            [
                new MarkerSpec { Id = "ash-1", Kind = MarkerKind.Tephra, Depths = [new("A", CoreDepth.From(50, Cm)), new("B", CoreDepth.From(44, Cm)), new("C", CoreDepth.From(54, Cm))] },
                new MarkerSpec { Id = "tb-1", Kind = MarkerKind.Turbidite, Depths = [new("A", CoreDepth.From(150, Cm)), new("C", CoreDepth.From(154 - 10, Cm))] },
            ],
        };
        var alignment = Aligned("A", Ensemble(DepthMapping.Identity("A", Cm, 0, 200)),
            Ensemble(Shift("B", 6, 0, 180), Shift("B", 5.5, 0, 180), Shift("B", 6.5, 0, 180)),
            Ensemble(Shift("C", -4, 0, 150)));
        var loaded = Load(project, a, b, c);
        return (loaded, CompositeBuilder.Build(loaded, alignment, withAges ? new LinearAgeScale(-68, 4, 15) : null, null, CancellationToken.None));
    }

    private static XDocument Reparse(StratLink.Export.Svg.SvgCanvas canvas) =>
        // Round trip through text: the test checks the written form is well-formed XML.
        XDocument.Parse(canvas.ToDocument().ToString());

    [Fact]
    public void Correlation_panel_is_well_formed_with_one_path_per_core_and_signal()
    {
        var (project, result) = Site(withAges: false);
        var doc = Reparse(CorrelationPanel.Draw(project, result));
        Assert.Equal(Svg + "svg", doc.Root!.Name);
        var traces = doc.Descendants(Svg + "path").Where(p => (string?)p.Attribute("class") == CorrelationPanel.TraceClass).ToList();
        // A and B have ms and density, C has ms only: five traces.
        Assert.Equal(5, traces.Count);
        Assert.Equal(["trace-A-ms", "trace-A-density", "trace-B-ms", "trace-B-density", "trace-C-ms"], traces.Select(t => (string)t.Attribute("id")!));
        // Ties: ash-1 joins A-B and B-C, tb-1 joins A-C: three lines across.
        Assert.Equal(3, doc.Descendants(Svg + "line").Count(l => (string?)l.Attribute("class") == "tie"));
        Assert.Equal(result.Splice.Pieces.Count, doc.Descendants(Svg + "rect").Count(r => (string?)r.Attribute("class") == "splice"));
        Assert.Equal(2, doc.Descendants(Svg + "rect").Count(r => (string?)r.Attribute("class") == "gap"));
        Assert.Contains(doc.Descendants(Svg + "text"), t => t.Value.StartsWith("core depth (cm)"));
        // A's gap breaks its trace: the path lifts the pen (a second move-to) there.
        string d = (string)traces[0].Attribute("d")!;
        Assert.True(d.Count(ch => ch == 'M') >= 2, "the trace should break at the gap");
    }

    [Fact]
    public void Profiles_against_depth_and_age_are_well_formed_and_labelled_with_units()
    {
        var (_, result) = Site(withAges: true);
        var ms = result.Record("ms")!;
        var depth = Reparse(CompositeFigures.Profile(result, ms, againstAge: false)!);
        var age = Reparse(CompositeFigures.Profile(result, ms, againstAge: true)!);
        Assert.Contains(depth.Descendants(Svg + "text"), t => t.Value == "composite depth (cm)");
        Assert.Contains(age.Descendants(Svg + "text"), t => t.Value.StartsWith("age (cal BP"));
        foreach (var doc in new[] { depth, age })
        {
            Assert.Single(doc.Descendants(Svg + "path"), p => (string?)p.Attribute("class") == "band");
            Assert.Single(doc.Descendants(Svg + "path"), p => (string?)p.Attribute("class") == "mean");
            // The splice is told apart by its dash pattern, not by colour.
            var splice = Assert.Single(doc.Descendants(Svg + "path"), p => (string?)p.Attribute("class") == "splice");
            Assert.NotNull(splice.Attribute("stroke-dasharray"));
        }
        var (_, noAges) = Site(withAges: false);
        Assert.Null(CompositeFigures.Profile(noAges, noAges.Record("ms")!, againstAge: true));
    }

    [Fact]
    public void All_outputs_are_written_into_the_folder_and_its_figures_subfolder()
    {
        var (project, result) = Site(withAges: true);
        string dir = Path.Combine(Path.GetTempPath(), "stratlink-composite-" + Guid.NewGuid().ToString("N"));
        try
        {
            var files = CompositeOutputs.WriteAll(project, result, dir);
            string[] expected = ["composite.csv", "splice.csv", "mapping-A.csv", "mapping-B.csv", "mapping-C.csv",
                "figures/composite-ms-depth.svg", "figures/composite-ms-age.svg", "figures/composite-density-depth.svg",
                "figures/composite-density-age.svg", "figures/correlation.svg"];
            Assert.Equal(expected.Order(), files.Select(f => Path.GetRelativePath(dir, f).Replace('\\', '/')).Order());
            foreach (string f in files.Where(f => f.EndsWith(".svg"))) XDocument.Load(f);
            Assert.Empty(Directory.GetFiles(dir, "*.tmp", SearchOption.AllDirectories));
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }
}
