using StratLink.Checks;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Workflows;
using static StratLink.Tests.Checks.CheckFixtures;

namespace StratLink.Tests.Checks;

public sealed class TieChecksTests
{
    [Fact]
    public void CrossingTiesAreReportedInTheCoreThatDisagrees()
    {
        // X lies above Y in A and B, below it in C: C's depths are the odd ones.
        var p = Project(["A", "B", "C"], [
            Marker("X", 0.5, ("A", 10), ("B", 12), ("C", 30)),
            Marker("Y", 0.5, ("A", 20), ("B", 22), ("C", 25)),
        ]);
        var f = Assert.Single(Run(Load(p)), f => f.Code == CheckCodes.TieCrossing);
        Assert.Equal(Severity.Error, f.Severity);
        Assert.Equal("C", f.Core);
        Assert.Equal("X/Y", f.Item);
        Assert.Equal(30, f.Depth);
        Assert.Contains("A, B", f.Message);
    }

    [Fact]
    public void OrderWithinTheUncertaintiesIsNotACrossingButASharedDepth()
    {
        var p = Project(["A", "B"], [
            Marker("X", 1, ("A", 10), ("B", 25.5)),
            Marker("Y", 1, ("A", 20), ("B", 25)),
        ]);
        var findings = Run(Load(p));
        Assert.DoesNotContain(findings, f => f.Code == CheckCodes.TieCrossing);
        var same = Assert.Single(findings, f => f.Code == CheckCodes.TieSameDepth);
        Assert.Equal("B", same.Core);
        Assert.Equal(Severity.Warning, same.Severity);
    }

    [Fact]
    public void TwoExactMarkersAtOneDepthAreReported()
    {
        var p = Project(["A", "B"], [Marker("X", 0, ("A", 10), ("B", 40)), Marker("Y", 0, ("A", 10), ("B", 50))]);
        Assert.Contains(Run(Load(p)), f => f.Code == CheckCodes.TieSameDepth && f.Core == "A" && f.Item == "X/Y");
    }

    [Fact]
    public void MarkerInAGapIsAnErrorAndInADisturbedIntervalAWarning()
    {
        var p = Project(["A", "B"], [Marker("X", 0, ("A", 42), ("B", 42)), Marker("Y", 0, ("A", 2), ("B", 3))]);
        p = p with
        {
            Cores = [
                Core("A") with { Gaps = [DepthInterval.FromTopBottom(40, 45, Unit)] },
                Core("B") with { Disturbed = [DepthInterval.FromTopBottom(0, 4, Unit)] },
            ],
        };
        var findings = Run(Load(p));
        var gap = Assert.Single(findings, f => f.Code == CheckCodes.TieInGap);
        Assert.Equal(("A", "X", Severity.Error), (gap.Core, gap.Item, gap.Severity));
        var disturbed = Assert.Single(findings, f => f.Code == CheckCodes.TieInDisturbed);
        Assert.Equal(("B", "Y", Severity.Warning), (disturbed.Core, disturbed.Item, disturbed.Severity));
    }

    [Fact]
    public void MarkerAtTheEdgeOfAGapIsAccepted()
    {
        var p = Project(["A", "B"], [Marker("X", 0, ("A", 40), ("B", 40))]) with
        {
            Cores = [Core("A") with { Gaps = [DepthInterval.FromTopBottom(40, 45, Unit)] }, Core("B")],
        };
        Assert.DoesNotContain(Run(Load(p)), f => f.Code == CheckCodes.TieInGap);
    }

    [Fact]
    public void RateRatioJumpBeyondTheFactorIsReportedAtBothEndsOfTheOddSegment()
    {
        // Reference A spacing 10, 10, 10; core B spacing 10, 2, 10: ratios 1, 5, 1 (jumps of 5 > 4).
        var p = Project(["A", "B"], [
            Marker("m1", 0, ("A", 10), ("B", 10)),
            Marker("m2", 0, ("A", 20), ("B", 20)),
            Marker("m3", 0, ("A", 30), ("B", 22)),
            Marker("m4", 0, ("A", 40), ("B", 32)),
        ]);
        var jumps = Run(Load(p)).Where(f => f.Code == CheckCodes.TieRateJump).ToList();
        Assert.Equal(["m2", "m3"], jumps.Select(f => f.Item));
        Assert.All(jumps, f => Assert.Equal("B", f.Core));
        Assert.Contains("a factor of 5", jumps[0].Message);

        // The project's factor is honoured: 6 tolerates a jump of 5.
        var lenient = p with { Checks = new CheckSettings { RateJumpFactor = 6 } };
        Assert.DoesNotContain(Run(Load(lenient)), f => f.Code == CheckCodes.TieRateJump);
    }

    [Fact]
    public void FindingsPointAtTheLineOfTheMarkerDepthInTheProjectFile()
    {
        string yaml = """
            format: stratlink-project/1
            depth_unit: cm
            cores:
              - id: A
                table: a.csv
              - id: B
                table: b.csv
            markers:
              - id: X
                depths:
                  A: 10
                  B: 30
              - id: Y
                depths:
                  A: 20
                  B: 25
            """;
        var doc = ProjectReader.Parse(yaml, ProjectPath);
        Assert.False(doc.Problems.HasErrors, string.Join("; ", doc.Problems));
        var tables = doc.Project!.Cores.ToDictionary(c => c.Id, c => Table(c.Id));
        var lp = new LoadedProject(doc, doc.Project, tables, []);
        // Two cores, one each way: the reference core's order (A) is taken as right, so B is reported.
        var f = Assert.Single(Run(lp), f => f.Code == CheckCodes.TieCrossing);
        Assert.Equal("B", f.Core);
        Assert.Equal(ProjectPath, f.File);
        Assert.Equal(12, f.Line);
    }
}
