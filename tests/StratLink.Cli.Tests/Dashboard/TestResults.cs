using StratLink.AgeModelling;
using StratLink.Alignment;
using StratLink.Cli.Dashboard.Results;
using StratLink.Quantities;
using StratLink.Workflows;

namespace StratLink.Tests.Dashboard;

/// <summary>Hand-made run results of known shape, so the views can be checked cell by cell.</summary>
internal static class TestResults
{
    /// <summary>T-1 is the reference; T-2 accumulated 10 % slower (composite = 1.1 x core depth); T-3 maps by identity.</summary>
    public static AlignmentResult Alignment() => new("T-1", "ties", new Dictionary<string, MappingEnsemble>
    {
        ["T-1"] = new(DepthMapping.Identity("T-1", DepthUnit.Centimetre, 0, 200), []),
        ["T-2"] = new(new DepthMapping("T-2", DepthUnit.Centimetre, [0, 200], [0, 220]), []),
        ["T-3"] = new(DepthMapping.Identity("T-3", DepthUnit.Centimetre, 0, 200), []),
    });

    /// <summary>Age = 10 yr per cm of composite depth, 95 % band +-5 %.</summary>
    public sealed class LinearAges : ICompositeAgeScale
    {
        public (double MedianBP, double LoBP, double HiBP) AgeAt(CompositeDepth depth)
        {
            double a = 10 * depth.In(DepthUnit.Centimetre);
            return (a, a * 0.95, a * 1.05);
        }

        public int MemberCount => 0;
        public double MemberAgeAt(int member, CompositeDepth depth) => AgeAt(depth).MedianBP;
    }

    public static RunResults Full(LoadedProject project)
    {
        int n = 401;
        var depth = new double[n];
        var mean = new double[n];
        var lo = new double[n];
        var hi = new double[n];
        var age = new double[n];
        for (int i = 0; i < n; i++)
        {
            depth[i] = i * 0.5;
            mean[i] = Math.Sin(depth[i] / 15);
            lo[i] = mean[i] - 0.2;
            hi[i] = mean[i] + 0.2;
            age[i] = 10 * depth[i];
        }
        return new RunResults
        {
            Project = project.Project,
            FinishedAt = DateTimeOffset.UnixEpoch,
            Alignment = Alignment(),
            Ages = new AgeCurve(new LinearAges(), 0, 200),
            Controls = [new ControlOutcome("ash-1-age", 50, 1200, 1160, 1240, ""), new ControlOutcome("top", 0, -68, -70, -66, "")],
            Composite = new CompositeRecords(
                [new CompositeSignal("ms", depth, mean, lo, hi, age)],
                [new SpliceSegment("T-1", 0, 100), new SpliceSegment("T-2", 100, 200)],
                []),
            Checks = [],
        };
    }
}
