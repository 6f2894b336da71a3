using StratLink.Alignment;
using StratLink.Checks;
using StratLink.Model;
using StratLink.Workflows;
using static StratLink.Tests.Checks.CheckFixtures;

namespace StratLink.Tests.Checks;

public sealed class AlignmentChecksTests
{
    // Hidden truth: A is the reference scale, B accumulates slower, C faster and offset.
    private static readonly Dictionary<string, (double, double)> Truth = new()
    {
        ["A"] = (1.0, 0.0),
        ["B"] = (0.8, 5.0),
        ["C"] = (1.2, -3.0),
    };

    private static Project ThreeCores(double shiftOfM2InB, double uncertainty = 0.5, double shiftOfM3InB = 0)
    {
        var aligner = new LinearTruthAligner(Truth);
        MarkerSpec M(string id, double t, double shiftB = 0) =>
            Marker(id, uncertainty, ("A", aligner.CoreDepthOf("A", t)), ("B", aligner.CoreDepthOf("B", t) + shiftB), ("C", aligner.CoreDepthOf("C", t)));
        return Project(["A", "B", "C"], [M("m1", 20), M("m2", 50, shiftOfM2InB), M("m3", 75, shiftOfM3InB)]);
    }

    private static LoadedProject LoadThree(Project p) => Load(p, Table("A", 0, 100), Table("B", 0, 90), Table("C", 0, 120));

    private static Project OnScale(Project p, string scale) => p with { Alignment = p.Alignment with { Scale = scale } };

    [Fact]
    public void TieTheSignalsDisagreeWithIsReportedWithItsDistance()
    {
        var aligner = new LinearTruthAligner(Truth);
        var lp = LoadThree(ThreeCores(shiftOfM2InB: 6));
        var findings = Run(lp, new CheckContext { Aligner = aligner.Align });

        var f = Assert.Single(findings, f => f.Code == CheckCodes.TieMisfit);
        Assert.Equal(("B", "m2", Severity.Warning), (f.Core, f.Item, f.Severity));
        Assert.Equal(aligner.CoreDepthOf("B", 50) + 6, f.Depth);
        Assert.Contains("6 cm from the tie", f.Message);
        // Leave-one-out: each marker was left out of one alignment to the reference alone on optimal
        // paths (no ensemble); m2, whose misfit would be reported, once more with sampled paths, and,
        // still off, last on the project's own (site) scale, optimal paths first, then sampled.
        string LeftOut(Project c) => "m1 m2 m3".Split(' ').Except(c.Markers.Select(m => m.Id)).Single();
        var leftOut = aligner.Calls.Where(c => c.Markers.Count == 2).ToList();
        Assert.Equal(["m1", "m2", "m3"], leftOut.Where(c => c.Alignment.Ensemble == 0 && c.Alignment.Scale == AlignmentScales.Reference).Select(LeftOut).Order());
        Assert.Equal([("m2", AlignmentScales.Site, false), ("m2", AlignmentScales.Reference, true), ("m2", AlignmentScales.Site, true)],
            leftOut.Where(c => c.Alignment.Ensemble > 0 || c.Alignment.Scale == AlignmentScales.Site)
                .Select(c => (LeftOut(c), c.Alignment.Scale, c.Alignment.Ensemble > 0)).OrderBy(c => c.Item3).ThenBy(c => c.Scale));
        Assert.Contains("on the site scale", f.Message);
    }

    [Fact]
    public void ATieThatOnlyAnOpenEndWouldPlaceIsANoteNotAWarning()
    {
        // m3 (the deepest marker) is 6 cm off in B, and B's base is left open: left out, nothing holds
        // B below m2, so where the path puts m3 is the open end's choice, not the signals'.
        var aligner = new LinearTruthAligner(Truth);
        aligner.OpenEnds[("A", "B")] = (false, true);
        var findings = Run(LoadThree(ThreeCores(shiftOfM2InB: 0, shiftOfM3InB: 6)), new CheckContext { Aligner = aligner.Align });
        var f = Assert.Single(findings, f => f.Code == CheckCodes.TieMisfit);
        Assert.Equal(("B", "m3", Severity.Note), (f.Core, f.Item, f.Severity));
        Assert.Contains("no tie between the marker and its base", f.Message);
    }

    [Theory]
    // m2 is 6 cm off in B. Sampled without it, B's members lie h composite cm either side of the
    // truth, 0.8 h cm of B (B runs at 0.8 cm per cm of A): a 95 % range of 1.6 h, standard uncertainty
    // 1.6 h / 3.92, combined with the 1 cm grid step: the limit is 3 x sqrt(1 + (0.41 h)^2).
    [InlineData(10.0, false)] // limit 3 x 4.2 = 12.6 cm > 6 cm: the signals alone cannot place m2 that well
    [InlineData(1.0, true)] // limit 3 x 1.08 = 3.2 cm < 6 cm
    public void ATieIsJudgedAgainstTheSpreadOfTheSignalsPlacementWithoutIt(double halfWidth, bool reported)
    {
        var aligner = new LinearTruthAligner(Truth);
        aligner.SampledBands[("A", "B")] = halfWidth;
        var findings = Run(LoadThree(ThreeCores(shiftOfM2InB: 6)), new CheckContext { Aligner = aligner.Align });
        var misfits = findings.Where(f => f.Code == CheckCodes.TieMisfit).ToList();
        if (!reported)
        {
            Assert.Empty(misfits);
            return;
        }
        var f = Assert.Single(misfits);
        Assert.Equal(("B", "m2"), (f.Core, f.Item));
        Assert.Contains("the signals' 95 % range there is", f.Message);
    }

    [Fact]
    public void ExactTieIsHeldToOneGridStepNotToZero()
    {
        // Uncertainty 0 and a 0.3 cm offset: within 3 x one grid step (1 cm sampling), so accepted;
        // without the floor any offset at all would be reported.
        var aligner = new LinearTruthAligner(Truth);
        Assert.DoesNotContain(Run(LoadThree(ThreeCores(0.3, uncertainty: 0)), new CheckContext { Aligner = aligner.Align }),
            f => f.Code == CheckCodes.TieMisfit);
        // A 5 cm offset is beyond 3 grid steps.
        Assert.Contains(Run(LoadThree(ThreeCores(5, uncertainty: 0)), new CheckContext { Aligner = aligner.Align }),
            f => f.Code == CheckCodes.TieMisfit && f.Core == "B" && f.Item == "m2");
    }

    [Fact]
    public void ConsistentAlignmentsCloseTheLoopAndSayHowWell()
    {
        var aligner = new LinearTruthAligner(Truth);
        var f = Assert.Single(Run(LoadThree(OnScale(ThreeCores(0), AlignmentScales.Reference)), new CheckContext { Aligner = aligner.Align }), f => f.Code == CheckCodes.LoopClosure);
        Assert.Equal(Severity.Note, f.Severity);
        Assert.Contains("differs by 0 cm", f.Message);
        // One alignment per reference core, each with that core as the reference.
        Assert.Equal(["A", "B", "C"], aligner.Calls.Where(c => c.Markers.Count == 3).Select(c => c.Alignment.Reference).Order());
    }

    [Fact]
    public void LoopThatDoesNotCloseIsAWarningThatSaysWhere()
    {
        var aligner = new LinearTruthAligner(Truth);
        // With C as the reference, A's mapping bulges by up to 6 cm around A = 50 cm.
        aligner.Distortions[("C", "A")] = [(40, 0), (50, 6), (60, 0)];
        var findings = Run(LoadThree(OnScale(ThreeCores(0), AlignmentScales.Reference)), new CheckContext { Aligner = aligner.Align });
        var f = Assert.Single(findings, f => f.Code == CheckCodes.LoopClosure);
        Assert.Equal(Severity.Warning, f.Severity);
        Assert.Contains("differs by 6 cm", f.Message);
        // Worst where the bulge peaks: A at 50 cm, or the B depth that maps there.
        double expected = f.Core == "A" ? 50 : aligner.CoreDepthOf("B", 50);
        Assert.Equal(expected, f.Depth!.Value, 1.0);
    }

    [Fact]
    public void PassedAlignmentIsReusedForItsReferenceCore()
    {
        var aligner = new LinearTruthAligner(Truth);
        var lp = LoadThree(OnScale(ThreeCores(0), AlignmentScales.Reference));
        var given = aligner.Align(lp, CancellationToken.None);
        aligner.Calls.Clear();
        Run(lp, new CheckContext { Aligner = aligner.Align }, given);
        Assert.Equal(["B", "C"], aligner.Calls.Where(c => c.Markers.Count == 3).Select(c => c.Alignment.Reference!).Order());
    }

    [Fact]
    public void OnTheSiteScaleThePairsThroughTheCompositeAgreeWithDirectPairAlignments()
    {
        var aligner = new LinearTruthAligner(Truth);
        var lp = LoadThree(OnScale(ThreeCores(0), AlignmentScales.Site));
        var given = aligner.Align(lp, CancellationToken.None);
        aligner.Calls.Clear();
        var f = Assert.Single(Run(lp, new CheckContext { Aligner = aligner.Align }, given), f => f.Code == CheckCodes.LoopClosure);
        Assert.Equal(Severity.Note, f.Severity);
        Assert.Contains("differs by 0 cm", f.Message);
        // One direct alignment per core longer than another (B, 90 cm, is the shortest: aligned to A
        // and C, never their reference), on the reference scale: the site's own alignment is not run
        // again, and no round of the site scale is repeated per reference.
        var loops = aligner.Calls.Where(c => c.Markers.Count == 3).ToList();
        Assert.Equal(["A", "C"], loops.Select(c => c.Alignment.Reference!).Order());
        Assert.All(loops, c => Assert.Equal(AlignmentScales.Reference, c.Alignment.Scale));
    }

    [Fact]
    public void OnTheSiteScaleADirectPairAlignmentOffTheCompositeIsAWarning()
    {
        var aligner = new LinearTruthAligner(Truth);
        // Aligned to C (120 cm, longer than A) alone, A's mapping bulges by up to 6 cm around A = 50 cm; the site's composite does not.
        aligner.Distortions[("C", "A")] = [(40, 0), (50, 6), (60, 0)];
        var lp = LoadThree(OnScale(ThreeCores(0), AlignmentScales.Site));
        var f = Assert.Single(Run(lp, new CheckContext { Aligner = aligner.Align }), f => f.Code == CheckCodes.LoopClosure);
        Assert.Equal(Severity.Warning, f.Severity);
        Assert.Contains("differs by 6 cm", f.Message);
        // The worst of many points: 3 for one comparison is raised for their effective number.
        Assert.Contains("3 for one comparison, raised for the worst of about 10 independent points", f.Message);
        Assert.Equal(("A", "A/C"), (f.Core, f.Item));
        Assert.Equal(50, f.Depth!.Value, 1.0);
    }

    [Theory]
    // A's mapping to C alone bulges by 6 cm at A = 50 cm; the site's has no band, so on the optimal paths
    // the limit is k x 1 cm (one grid step; k = 3 for one comparison, 3.64 for the worst of the bulge's
    // effective 10 independent points) and the pair is aligned again with its path ensemble. Its
    // own band (half-width h) is a standard uncertainty of h / 1.96 (95 % range of a normal spread),
    // combined with the grid step: k x sqrt(1 + (h / 1.96)^2).
    [InlineData(5.0, Severity.Note)] // limit 3.64 x 2.74 = 10.0 cm > 6 cm
    [InlineData(1.0, Severity.Warning)] // limit 3.64 x 1.12 = 4.1 cm < 6 cm
    public void OnTheSiteScaleAPairThatWouldWarnIsJudgedAgainstItsOwnSampledBand(double band, Severity expected)
    {
        var aligner = new LinearTruthAligner(Truth);
        aligner.Distortions[("C", "A")] = [(40, 0), (50, 6), (60, 0)];
        aligner.SampledBands[("C", "A")] = band;
        var lp = LoadThree(OnScale(ThreeCores(0), AlignmentScales.Site));
        var f = Assert.Single(Run(lp, new CheckContext { Aligner = aligner.Align }), f => f.Code == CheckCodes.LoopClosure);
        Assert.Equal(expected, f.Severity);
        Assert.Contains("differs by 6 cm", f.Message);
        Assert.Contains("sampled paths", f.Message);
        // Only C, whose pair warned on the optimal paths, was aligned again with an ensemble.
        Assert.Equal(["C"], aligner.Calls.Where(c => c.Alignment.Ensemble > 0).Select(c => c.Alignment.Reference!));
    }

    [Fact]
    public void OnTheSiteScaleASampledPairIsComparedByTheNearerOfItsOptimalPathAndItsMedian()
    {
        // The pair's optimal path bulges by 6 cm at A = 50 cm, its members' median at A = 30 cm instead
        // (a posterior with two modes): the site agrees with one of them everywhere.
        var aligner = new LinearTruthAligner(Truth);
        aligner.Distortions[("C", "A")] = [(40, 0), (50, 6), (60, 0)];
        aligner.SampledDistortions[("C", "A")] = [(20, 0), (30, 6), (40, 0)];
        var lp = LoadThree(OnScale(ThreeCores(0), AlignmentScales.Site));
        var f = Assert.Single(Run(lp, new CheckContext { Aligner = aligner.Align }), f => f.Code == CheckCodes.LoopClosure);
        Assert.Equal(Severity.Note, f.Severity);
        Assert.Contains("whichever is nearer", f.Message);
    }

    [Theory]
    // A (0-100 cm) ends inside C (0-120 cm, to which A's base maps at 117 cm); its last tie, m3, is at
    // A = 75 cm. Aligned to C alone, A's base runs off along C by up to 6 cm from A = 85 cm.
    [InlineData(true, Severity.Note)] // the path may stop anywhere: beyond m3 the pair has no hold
    [InlineData(false, Severity.Warning)] // closed there, the pair's path is held at A's base
    public void OnTheSiteScaleAPairPathRunningOffAnOpenEndIsNotHeldAgainstTheSite(bool open, Severity expected)
    {
        var aligner = new LinearTruthAligner(Truth);
        aligner.Distortions[("C", "A")] = [(85, 0), (95, 6), (100, 6)];
        if (open) aligner.OpenEnds[("C", "A")] = (false, true);
        var lp = LoadThree(OnScale(ThreeCores(0), AlignmentScales.Site));
        var f = Assert.Single(Run(lp, new CheckContext { Aligner = aligner.Align }), f => f.Code == CheckCodes.LoopClosure);
        Assert.Equal(expected, f.Severity);
    }

    [Theory]
    // The truth places A's top at C = -3 cm (C = 1.2 t - 3, A = t). Aligned to C alone, A's top is
    // pushed 6 cm down into C, easing to none at A = 15 cm, above A's first tie (m1, 20 cm).
    [InlineData(0.0, Severity.Note)] // C starts at 0: the ties place A's top above C's, so the push is C's closed top squeezing A onto it
    [InlineData(-6.0, Severity.Warning)] // C starts at -6 cm: A's top lies inside C, where the pair's records hold the path
    public void OnTheSiteScaleAPairPathSqueezedOntoTheLongerCoresEndIsNotHeldAgainstTheSite(double topOfC, Severity expected)
    {
        var aligner = new LinearTruthAligner(Truth);
        aligner.Distortions[("C", "A")] = [(0, 6), (15, 0)];
        var lp = Load(OnScale(ThreeCores(0), AlignmentScales.Site), Table("A", 0, 100), Table("B", 0, 90), Table("C", topOfC, 120));
        var f = Assert.Single(Run(lp, new CheckContext { Aligner = aligner.Align }), f => f.Code == CheckCodes.LoopClosure);
        Assert.Equal(expected, f.Severity);
    }

    [Theory]
    // Composite band half-width h on A's and C's site mappings: each a standard uncertainty of h / 1.96
    // (95 % range of a normal spread), combined in quadrature, doubled in variance for the direct
    // alignment's own, and carried to C's depth by C's rate (1.2 cm per composite cm): 1.22 h. With the
    // tie uncertainty (0.5 cm, or one grid step) the limit is k x sqrt(sigma^2 + (1.22 h)^2), k = 3.64
    // for the worst of the bulge's effective 10 independent points.
    [InlineData(0.5, Severity.Warning)] // limit at most 3.64 x sqrt(1 + 0.37) = 4.3 cm < 6 cm
    [InlineData(2.0, Severity.Note)] // limit at least 3 x 2.45 = 7.3 cm > 6 cm
    public void OnTheSiteScaleTheCompositesBandWidensTheLimit(double band, Severity expected)
    {
        var aligner = new LinearTruthAligner(Truth) { Band = band };
        aligner.Distortions[("C", "A")] = [(40, 0), (50, 6), (60, 0)];
        var lp = LoadThree(OnScale(ThreeCores(0), AlignmentScales.Site));
        var given = aligner.Align(lp, CancellationToken.None);
        var f = Assert.Single(Run(lp, new CheckContext { Aligner = aligner.Align }, given), f => f.Code == CheckCodes.LoopClosure);
        Assert.Equal(expected, f.Severity);
        Assert.Contains("differs by 6 cm", f.Message);
        Assert.Contains("from the bands of both mappings", f.Message);
    }

    [Fact]
    public void FailingAlignerGivesANoteAndTheOtherChecksStillRun()
    {
        AlignmentResult Failing(LoadedProject lp, CancellationToken ct) => throw new InvalidOperationException("no signal in common");
        var p = ThreeCores(0) with { Markers = [.. ThreeCores(0).Markers, Marker("bad", 0, ("A", 30), ("B", 5))] };
        var findings = Run(LoadThree(p), new CheckContext { Aligner = Failing });
        Assert.Contains(findings, f => f.Code == CheckCodes.CheckNotRun && f.Severity == Severity.Note && f.Message.Contains("no signal in common"));
        Assert.Contains(findings, f => f.Code == CheckCodes.TieCrossing);
    }

    [Fact]
    public void WithoutAnAlignerTheUserIsToldTheSignalChecksDidNotRun()
    {
        var f = Assert.Single(Run(LoadThree(ThreeCores(6))), f => f.Code == CheckCodes.CheckNotRun);
        Assert.Equal(Severity.Note, f.Severity);
    }

    [Fact]
    public void CancellationStopsTheRun()
    {
        var aligner = new LinearTruthAligner(Truth);
        using var cts = new CancellationTokenSource();
        cts.Cancel();
        Assert.ThrowsAny<OperationCanceledException>(() =>
            ProjectChecks.Run(LoadThree(ThreeCores(0)), null, new CheckContext { Aligner = aligner.Align }, cts.Token));
    }
}
