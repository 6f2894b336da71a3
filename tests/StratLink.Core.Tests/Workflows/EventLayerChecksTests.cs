using StratLink.Checks;
using StratLink.ProjectIO;
using StratLink.Workflows;

namespace StratLink.Tests.Workflows;

/// <summary>The checks of a core's event layers against its gaps, its length and the markers, each naming file, line and key.</summary>
public sealed class EventLayerChecksTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("stratlink-events-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private FindingList Load(string coreKeys, string markers = "")
    {
        File.WriteAllText(Path.Combine(_dir, "a.csv"), "depth,ms\n" + string.Concat(Enumerable.Range(0, 101).Select(k => $"{k},{k % 7}\n")));
        string yaml = "format: stratlink-project/1\ndepth_unit: cm\ncores:\n  - id: A\n    table: a.csv\n" + coreKeys + markers;
        string file = Path.Combine(_dir, "p.stratlink.yaml");
        File.WriteAllText(file, yaml);
        return ProjectLoader.Load(file).Problems;
    }

    [Fact]
    public void EventOverlappingAGapIsAnError()
    {
        var f = Assert.Single(Load("    gaps:\n      - [40, 45]\n    events:\n      - [44, 50]\n"), f => f.Code == ProjectCodes.EventInGap);
        Assert.Equal(Severity.Error, f.Severity);
        Assert.EndsWith("p.stratlink.yaml", f.File);
        Assert.Equal(9, f.Line);
        Assert.Equal("cores[A].events[0]", f.Field);
    }

    [Fact]
    public void EventThickerThanItsCoreIsAnError()
    {
        var f = Assert.Single(Load("    events:\n      - [0, 150]\n"), f => f.Code == ProjectCodes.EventThickerThanCore);
        Assert.Equal(7, f.Line);
        Assert.Equal("cores[A].events[0]", f.Field);
    }

    [Fact]
    public void EventMarkerOutsideTheCoresEventLayersIsAWarning()
    {
        string markers = "  - id: B\n    table: a.csv\nmarkers:\n  - id: turb-1\n    kind: turbidite\n    depths: {A: 60, B: 61}\n"
            + "  - id: turb-2\n    kind: turbidite\n    depths: {A: 21, B: 22}\n";
        var problems = Load("    events:\n      - [20, 23]\n", markers);
        var f = Assert.Single(problems, f => f.Code == ProjectCodes.MarkerOutsideEvent);
        Assert.Equal(Severity.Warning, f.Severity);
        Assert.Equal("markers[turb-1].depths.A", f.Field);
        Assert.Equal(13, f.Line);
        Assert.DoesNotContain(problems, p => p.Severity == Severity.Error);
    }
}
