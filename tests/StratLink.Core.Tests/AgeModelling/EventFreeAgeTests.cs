using StratLink.AgeModelling;
using StratLink.Checks;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Tables;
using StratLink.Workflows;
using static StratLink.Tests.AgeModelling.AgeModelFixture;

namespace StratLink.Tests.AgeModelling;

public class EventFreeAgeTests
{
    [Fact]
    public void EventFreeDepthCutsEachLayerOut()
    {
        // Hand arithmetic from the definition (event-free depth = depth minus the event thickness above it; inside
        // a layer, that of its top and base): layers 50-60 and 120-125 cm.
        var scale = new EventFreeScale([50, 120], [60, 125]);
        Assert.Equal(40, scale.ToEventFree(40), 12);
        Assert.Equal(50, scale.ToEventFree(50), 12);
        Assert.Equal(50, scale.ToEventFree(55), 12);
        Assert.Equal(50, scale.ToEventFree(60), 12);
        Assert.Equal(90, scale.ToEventFree(100), 12);
        Assert.Equal(110, scale.ToEventFree(122), 12);
        Assert.Equal(185, scale.ToEventFree(200), 12);
        Assert.Equal(60, scale.BaseOf(51), 12);
        Assert.Equal(100, scale.BaseOf(100), 12);
        Assert.True(scale.Covers(60));
        Assert.False(scale.IsInEvent(60));
        Assert.Equal(15, scale.TotalThickness, 12);
    }

    [Fact]
    public void SyntheticCoreWithEventLayersGivesTheTrueAgeDepthRelation()
    {
        // A core whose true history is known by construction: background sediment at 0.5 cm/yr from -50 cal BP at
        // 0 cm, interrupted by two instantaneous event layers (50-60 cm, a turbidite; 120-125 cm, a flood bed). The true
        // age is -50 + 2 x event-free depth: constant through each layer. Three calendar ages on the truth (1, 3, 3 yr
        // sigma). Checks: the 95 % range holds the true age at every sample (the truth is the straight line the model
        // can draw; at least 95 % required, nominal coverage), the median within 3 yr of the truth (about one sigma of
        // the controls), ages inside a layer all equal to its base's, and the event-free rate 0.5 cm/yr within 10 %
        // at mid-interval. Without the layers listed, the same controls spread the turbidite over years.
        var events = new EventFreeScale([50, 120], [60, 125]);
        double True(double d) => -50 + 2 * events.ToEventFree(d);
        var depths = Range(0, 200, 0.5);
        AgeControlSpec[] ages = [Calendar("top", "R", 0, True(0), 1), Calendar("mid", "R", 100, True(100), 3), Calendar("base", "R", 200, True(200), 3)];
        var loaded = Project(ages, new Dictionary<string, double[]> { ["R"] = depths }, iterations: 1000, step: 0.5);
        var withEvents = loaded.Project with { Cores = [loaded.Project.Cores[0] with { Events = [DepthInterval.FromTopBottom(50, 60, Unit), DepthInterval.FromTopBottom(120, 125, Unit)] }] };
        var project = new LoadedProject(loaded.Document, withEvents, loaded.Tables, new FindingList());
        var alignment = Aligned(new StratLink.Alignment.MappingEnsemble(StratLink.Alignment.DepthMapping.Identity("R", Unit, 0, 200), []));

        var result = AgeModeller.Run(project, alignment, NoVarves, null, CancellationToken.None);
        var s = result.Cores["R"];
        int inside = 0;
        for (int i = 0; i < s.Count; i++)
        {
            double t = True(s.Depths[i]);
            if (t >= s.AgeLoBP[i] - 1e-9 && t <= s.AgeHiBP[i] + 1e-9) inside++;
            Assert.True(Math.Abs(s.AgeMedianBP[i] - t) <= 3, $"{s.Depths[i]} cm: median {s.AgeMedianBP[i]:0.0} vs true {t:0.0}");
            Assert.Equal(events.ToEventFree(s.Depths[i]), s.EventFreeDepths[i], 12);
        }
        Console.WriteLine($"coverage {inside / (double)s.Count:P1}");
        Assert.True(inside >= 0.95 * s.Count);
        int Row(double d) => Array.IndexOf(s.Depths, d);
        foreach (double d in new[] { 50.0, 52.5, 55, 59.5 }) Assert.Equal(s.AgeMedianBP[Row(60)], s.AgeMedianBP[Row(d)], 9);
        Assert.InRange(s.RateMedian[Row(80)], 0.45, 0.55);

        var plain = AgeModeller.Run(loaded, alignment, NoVarves, null, CancellationToken.None).Cores["R"];
        double spread = plain.AgeMedianBP[Row(59.5)] - plain.AgeMedianBP[Row(50)];
        Console.WriteLine($"without the layers: the turbidite spans {spread:0.0} yr");
        Assert.True(spread > 10);
    }

    [Fact]
    public void VarveCountOutsideItsCoreIsAnErrorAtItsTableKey()
    {
        // A count of varves 0-300 cm in a core sampled 0-100 cm (e.g. a wrong depth unit).
        string dir = Path.Combine(Path.GetTempPath(), $"stratlink-varves-outside-{Guid.NewGuid():N}");
        Directory.CreateDirectory(dir);
        try
        {
            File.WriteAllText(Path.Combine(dir, "v.csv"), "depth_top,depth_bottom\n" + string.Concat(Enumerable.Range(0, 300).Select(k => $"{k},{k + 1}\n")));
            string file = Path.Combine(dir, "p.yaml");
            var control = new VarveCountControl { Id = "v", Core = "R", Table = "v.csv", AnchorDepth = D(0), AnchorAge = CalendarAge.FromYearsBP(-69) };
            var loaded = Project([control], new Dictionary<string, double[]> { ["R"] = Range(0, 100, 1) });
            var map = new SourceMap(file);
            map.Set("ages[v].table", 12);
            var project = new LoadedProject(new ProjectDocument(file, loaded.Project, new FindingList(), map), loaded.Project, loaded.Tables, new FindingList());
            var problems = new FindingList();
            var layers = VarveLayerLoader.Load(project, problems);
            Assert.Empty(layers);
            var f = Assert.Single(problems);
            Assert.Equal(ProjectCodes.VarvesOutsideCore, f.Code);
            Assert.Equal(Severity.Error, f.Severity);
            Assert.Equal(file, f.File);
            Assert.Equal(12, f.Line);
            Assert.Equal("ages[v].table", f.Field);
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }
}
