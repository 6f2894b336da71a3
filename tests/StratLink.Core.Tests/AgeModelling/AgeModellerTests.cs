using StratLink.AgeModelling;
using StratLink.AgeModelling.Calibration;
using StratLink.Export;
using StratLink.Model;
using StratLink.Quantities;
using StratLink.Workflows;
using AlignmentResult = StratLink.Alignment.AlignmentResult;
using static StratLink.Tests.AgeModelling.AgeModelFixture;

namespace StratLink.Tests.AgeModelling;

public class AgeModellerTests
{
    /// <summary>Invented truth for synthetic sites: 10 yr per cm of composite depth, -60 cal BP at the top (coring 2010 CE).</summary>
    private static double Truth(double composite) => 10 * composite - 60;

    private static AgeModelResult Run(LoadedProject project, AlignmentResult alignment,
        IReadOnlyDictionary<string, (double[] Tops, double[] Bottoms)>? varves = null) =>
        AgeModeller.Run(project, alignment, varves ?? NoVarves, null, CancellationToken.None);

    /// <summary>Calendar controls in core R at the given depths, ages = truth + N(0, sigma) from a fixed seed.</summary>
    private static List<AgeControlSpec> NoisyControls(double[] depths, double sigma, int seed)
    {
        var rng = new Random(seed);
        return depths.Select((d, k) => (AgeControlSpec)Calendar($"c{k}", "R", d, Truth(d) + sigma * MathNet.Numerics.Distributions.Normal.InvCDF(0, 1, rng.NextDouble()), sigma)).ToList();
    }

    [Fact]
    public void SyntheticSiteCoversTruthInEveryCore()
    {
        // Two cores: R is the reference; B maps by composite = 1.2 d + 3 with an alignment ensemble of +-10 cm.
        // Five calendar controls in R with 30-yr errors. The 95 % ranges should hold the truth for at least 90 %
        // of samples (nominal 95 %; bound allows for the one fixed noise draw of the controls). The truth is a
        // straight line, so straight lines between controls (rate variability 0) are the right model here.
        var project = Project(NoisyControls([0, 50, 120, 200, 300], 30, seed: 3),
            new Dictionary<string, double[]> { ["R"] = Range(0, 300, 1), ["B"] = Range(0, 245, 1) }, iterations: 1000, rateVariability: 0);
        var alignment = Aligned(Affine("R", 1, 0), AffineWithMembers("B", 1.2, 3, 10, 50));
        var result = Run(project, alignment);
        Assert.True(result.IsBuilt);
        Assert.Equal(7, result.Seed);
        foreach (var (core, toComposite) in new (string, Func<double, double>)[] { ("R", d => d), ("B", d => 1.2 * d + 3) })
        {
            var s = result.Cores[core];
            int inside = 0;
            double absErr = 0;
            for (int i = 0; i < s.Count; i++)
            {
                double truth = Truth(toComposite(s.Depths[i]));
                if (truth >= s.AgeLoBP[i] && truth <= s.AgeHiBP[i]) inside++;
                absErr += Math.Abs(s.AgeMedianBP[i] - truth);
            }
            double share = inside / (double)s.Count;
            Console.WriteLine($"core {core}: 95 % range holds truth for {share:P1}; mean |median - truth| {absErr / s.Count:0.0} yr");
            Assert.True(share >= 0.9, $"core {core}: coverage {share:P1}");
        }
        // Correlation uncertainty widens B's ranges: members spread evenly over +-10 cm x 10 yr/cm = +-100 yr, whose
        // 95 % range (190 yr) adds in quadrature to R's: about sqrt(90^2 + 190^2) = 210 yr; require R's + 60.
        double widthR = result.Cores["R"].AgeHiBP[150] - result.Cores["R"].AgeLoBP[150];
        int b = Array.IndexOf(result.Cores["B"].Depths, 122.0); // composite 149.4
        double widthB = result.Cores["B"].AgeHiBP[b] - result.Cores["B"].AgeLoBP[b];
        Assert.True(widthB > widthR + 60, $"width R {widthR:0}, B {widthB:0}");
    }

    [Fact]
    public void AccumulationRateAndCompositeGrid()
    {
        // Exact controls on a 10 yr/cm line: the rate is 0.1 cm/yr in R, and 0.12 cm/yr in B whose depths
        // are 1/1.2 of composite (d core / d age = (d composite / d age) / 1.2... inverted: 0.1 / 1.2 x 1.2^2).
        var project = Project([Calendar("a", "R", 10, Truth(10), 0), Calendar("b", "R", 200, Truth(200), 0)],
            new Dictionary<string, double[]> { ["R"] = Range(0, 250, 5), ["B"] = Range(0, 200, 5) }, iterations: 50, step: 2, rateVariability: 0);
        var result = Run(project, Aligned(Affine("R", 1, 0), Affine("B", 1.2, 3)));
        Assert.All(result.Cores["R"].RateMedian, r => Assert.Equal(0.1, r, 1e-9));
        Assert.All(result.Cores["B"].RateMedian, r => Assert.Equal(0.1 / 1.2, r, 1e-9));
        var grid = result.Composite!;
        Assert.True(grid.IsComposite);
        Assert.Equal(0, grid.Depths[0], 1e-12);
        Assert.Equal(2, grid.Depths[1] - grid.Depths[0], 1e-12);
        Assert.Equal(250, grid.Depths[^1], 1e-12);
        for (int i = 0; i < grid.Count; i++) Assert.Equal(Truth(grid.Depths[i]), grid.AgeMedianBP[i], 1e-6);
        var (med, lo, hi) = result.AgeAt(CompositeDepth.From(100, Unit));
        Assert.Equal(Truth(100), med, 1e-6);
        Assert.Equal(Truth(100), lo, 1e-6);
        Assert.Equal(Truth(100), hi, 1e-6);
        Assert.Equal(Truth(100), result.MemberAgeAt(3, CompositeDepth.From(100, Unit)), 1e-6);
    }

    [Fact]
    public void RateThroughStaircaseMembersIsReadOverTheWindow()
    {
        // A dtw member maps core rows onto whole reference columns: here every 1 cm of B is a flat half (ratio 0)
        // and a steep half (ratio 2), mean ratio 1, the phase shifted from member to member. Exact controls on a
        // 10 yr/cm line, so B accumulates at 0.1 cm/yr (rate = depth / time, common practice). Read at one depth the
        // members' slopes give an infinite upper rate; over the window (10 composite steps of 1 cm) the rounding of
        // each end to a column moves the rate by at most one column in ten.
        var project = Project([Calendar("a", "R", 0, Truth(0), 0), Calendar("b", "R", 200, Truth(200), 0)],
            new Dictionary<string, double[]> { ["R"] = Range(0, 200, 1), ["B"] = Range(20.25, 180, 0.5) }, iterations: 40, rateVariability: 0);
        var members = Enumerable.Range(0, 8).Select(k => Staircase("B", k / 8.0)).ToArray();
        var result = Run(project, Aligned(Affine("R", 1, 0), new StratLink.Alignment.MappingEnsemble(members[0], members)));
        var b = result.Cores["B"];
        for (int i = 0; i < b.Count; i++)
        {
            Assert.InRange(b.RateLo[i], 0.09, 0.112);
            Assert.InRange(b.RateHi[i], 0.09, 0.112);
        }
        Assert.All(result.Cores["R"].RateMedian, r => Assert.Equal(0.1, r, 1e-9));
    }

    /// <summary>Knots of a staircase with period 1 cm: flat over the first half of each period, then rising 1 cm.</summary>
    private static StratLink.Alignment.DepthMapping Staircase(string core, double phase)
    {
        var x = new List<double>();
        var y = new List<double>();
        for (int c = 0; c <= 200; c++)
        {
            x.Add(c + phase);
            y.Add(c);
            x.Add(c + phase + 0.5);
            y.Add(c);
        }
        return new StratLink.Alignment.DepthMapping(core, Unit, [.. x], [.. y]);
    }

    [Fact]
    public void ExtrapolationIsFlaggedAndUsesEndSegmentRates()
    {
        // Linear extrapolation with the nearest segment's rate (methods section 3, common practice).
        var project = Project([Calendar("a", "R", 50, 400, 0), Calendar("b", "R", 100, 900, 0), Calendar("c", "R", 150, 1200, 0)],
            new Dictionary<string, double[]> { ["R"] = Range(0, 200, 10) }, iterations: 20, rateVariability: 0);
        var result = Run(project, Aligned(Affine("R", 1, 0)));
        var s = result.Cores["R"];
        Assert.Equal(-100, s.AgeMedianBP[0], 1e-9);     // 400 - 50 x 10 yr/cm (top segment)
        Assert.Equal(1500, s.AgeMedianBP[^1], 1e-9);    // 1200 + 50 x 6 yr/cm (bottom segment)
        Assert.Equal([true, true, true, true, true, false], s.Extrapolated[..6]);
        Assert.True(s.Extrapolated[^1]);
        Assert.False(s.Extrapolated[15]);
        Assert.Contains(result.Findings, f => f.Code == AgeModelCodes.Extrapolated && f.Message.Contains("above the shallowest"));
        Assert.Contains(result.Findings, f => f.Code == AgeModelCodes.Extrapolated && f.Message.Contains("below the deepest"));
    }

    [Fact]
    public void ContradictedControlIsFlaggedAndCanBeExcluded()
    {
        // Five controls on the truth (+-20 yr) and one 1000 yr too old at 150 cm: it is out of order with the control
        // at 200 cm in nearly every iteration. Order alone cannot say which of the two is wrong, so both are flagged;
        // the leave-one-out z-score puts the reworked one further from the rest (about 1000 vs 550 yr off, on
        // 20-30 yr errors). The three others are not flagged.
        var good = NoisyControls([20, 80, 120, 200, 260], 20, seed: 11);
        var bad = Calendar("reworked", "R", 150, Truth(150) + 1000, 20);
        var depths = new Dictionary<string, double[]> { ["R"] = Range(0, 280, 2) };
        var alignment = Aligned(Affine("R", 1, 0));

        var withBad = Run(Project([.. good, bad], depths, iterations: 400), alignment);
        var flagged = withBad.Controls.Single(c => c.Id == "reworked");
        Assert.True(flagged.Flagged && flagged.Used);
        Assert.True(flagged.ContradictionShare > 0.95, $"share {flagged.ContradictionShare}");
        var partner = withBad.Controls.Single(c => c.Id == "c3");
        Assert.True(partner.Flagged);
        Assert.True(flagged.LeaveOneOutZ > 10 && partner.LeaveOneOutZ < -5, $"z reworked {flagged.LeaveOneOutZ:0.0}, c3 {partner.LeaveOneOutZ:0.0}");
        Assert.True(Math.Abs(flagged.LeaveOneOutZ) > Math.Abs(partner.LeaveOneOutZ));
        Assert.All(withBad.Controls.Where(c => c.Id is "c0" or "c1" or "c2" or "c4"), c => Assert.True(c.ContradictionShare < 0.2, $"{c.Id}: {c.ContradictionShare}"));
        Assert.Contains(withBad.Findings, f => f.Code == AgeModelCodes.Contradicted && f.Item == "reworked");
        // With the outlier model (5 % prior each) an ordered set is found by leaving one of the two out, never by
        // pooling; order alone cannot say which, so both carry a large outlier share, the three others a small one.
        Assert.Equal(0, withBad.OrderForcedIterations);
        foreach (var c in withBad.Controls) Console.WriteLine($"{c.Id}: outlier share {c.OutlierShare:0.000}");
        Assert.True(flagged.OutlierShare > 0.3 && partner.OutlierShare > 0.3, $"reworked {flagged.OutlierShare:0.00}, c3 {partner.OutlierShare:0.00}");
        Assert.All(withBad.Controls.Where(c => c.Id is "c0" or "c1" or "c2" or "c4"), c => Assert.True(c.OutlierShare < 0.1, $"{c.Id}: {c.OutlierShare}"));

        var excluded = Run(Project([.. good, bad with { Exclude = true }], depths, iterations: 400), alignment);
        var listed = excluded.Controls.Single(c => c.Id == "reworked");
        Assert.True(listed.Excluded);
        Assert.False(listed.Used);
        Assert.True(listed.Flagged, "an excluded control is still measured against the others");
        Assert.Equal(0, excluded.OrderForcedIterations);
        Assert.Contains(excluded.Findings, f => f.Code == AgeModelCodes.Excluded && f.Item == "reworked");
        int i150 = Array.IndexOf(excluded.Cores["R"].Depths, 150.0);
        Assert.InRange(excluded.Cores["R"].AgeMedianBP[i150], Truth(150) - 40, Truth(150) + 40);
    }

    [Fact]
    public void SameSeedSameBitsDifferentSeedDifferentDraws()
    {
        var depths = new Dictionary<string, double[]> { ["R"] = Range(0, 300, 1), ["B"] = Range(0, 245, 1) };
        var alignment = Aligned(Affine("R", 1, 0), AffineWithMembers("B", 1.2, 3, 2, 37));
        var controls = NoisyControls([0, 50, 120, 200, 300], 30, seed: 3);
        var a = Run(Project(controls, depths, iterations: 300, seed: 42), alignment);
        var b = Run(Project(controls, depths, iterations: 300, seed: 42), alignment);
        var c = Run(Project(controls, depths, iterations: 300, seed: 43), alignment);
        foreach (string core in new[] { "R", "B" })
        {
            Assert.Equal(a.Cores[core].AgeMedianBP, b.Cores[core].AgeMedianBP);
            Assert.Equal(a.Cores[core].AgeLoBP, b.Cores[core].AgeLoBP);
            Assert.Equal(a.Cores[core].RateHi, b.Cores[core].RateHi);
            Assert.NotEqual(a.Cores[core].AgeMedianBP, c.Cores[core].AgeMedianBP);
        }
        for (int m = 0; m < a.MemberCount; m++) Assert.Equal(a.Members[m].AgesBP, b.Members[m].AgesBP);
    }

    [Fact]
    public void RadiocarbonDrawsFollowTheCalibratedDensity()
    {
        // One IntCal20 date on the Hallstatt plateau and an exact coring-year top far above: ordering never binds,
        // so the modelled ages at the date follow its calibrated density (inverse-CDF draws, Blaauw 2010), not a
        // normal. Monte Carlo bound for the 2.5/97.5 percentiles with 4000 draws: sqrt(0.025 x 0.975 / 4000) = 0.0025
        // in probability, under 5 yr at the plateau's density; tolerance 15 yr.
        var date = new RadiocarbonAgeControl
        {
            Id = "c14", Core = "R", Depth = D(200), C14Age = RadiocarbonAge.FromYearsBP(2450), C14Error = 30,
            Curve = TestCurves.PathOf("intcal20.14c"),
        };
        var project = Project([Calendar("top", "R", 0, -60, 0), date], new Dictionary<string, double[]> { ["R"] = [100, 200] }, iterations: 4000);
        var result = Run(project, Aligned(Affine("R", 1, 0)));
        var density = Calibrator.Calibrate(RadiocarbonAge.FromYearsBP(2450), 30, TestCurves.IntCal20).Density!;
        var s = result.Cores["R"];
        Assert.Equal(density.InverseCdf(0.025), s.AgeLoBP[1], 15.0);
        Assert.Equal(density.InverseCdf(0.975), s.AgeHiBP[1], 15.0);
        Assert.Equal(density.Median, s.AgeMedianBP[1], 15.0);
        var summary = result.Controls.Single(c => c.Id == "c14");
        Assert.Equal("radiocarbon", summary.Kind);
        Assert.Equal(density.Median, summary.InputMedianBP, 1e-9);
        Assert.True(summary.InputHpd95.Length >= 1);
        Assert.Equal(200, summary.CompositeTop, 1e-12);
        Assert.Equal(density.Median, summary.ModelledMedianBP, 15.0);
    }

    [Fact]
    public void UncalibratableDateIsListedNotDropped()
    {
        var modern = new RadiocarbonAgeControl
        {
            Id = "young", Core = "R", Depth = D(5), C14Age = RadiocarbonAge.FromYearsBP(-400), C14Error = 30,
            Curve = TestCurves.PathOf("intcal20.14c"),
        };
        var project = Project([Calendar("a", "R", 0, -60, 1), modern, Calendar("b", "R", 100, 940, 20)],
            new Dictionary<string, double[]> { ["R"] = Range(0, 100, 10) }, iterations: 50);
        var result = Run(project, Aligned(Affine("R", 1, 0)));
        Assert.True(result.IsBuilt);
        var s = result.Controls.Single(c => c.Id == "young");
        Assert.False(s.Used);
        Assert.Contains("modern", s.Problem);
        Assert.Contains(result.Findings, f => f.Code == AgeModelCodes.Calibration && f.Item == "young");
    }

    [Fact]
    public void MarkerAgeAppliesInEveryCoreHoldingIt()
    {
        // ash-1 at 50 cm in R and 40 cm in B; B maps by composite = 1.25 d, so both points land at composite 50.
        var marker = new MarkerSpec { Id = "ash-1", Kind = MarkerKind.Tephra, Depths = [new MarkerDepth("R", D(50)), new MarkerDepth("B", D(40))] };
        var ash = new CalendarAgeControl { Id = "ash-1-age", Marker = "ash-1", Age = CalendarAge.FromYearsBP(440), Error = 10 };
        var project = Project([Calendar("top", "B", 0, -60, 0), ash],
            new Dictionary<string, double[]> { ["R"] = Range(0, 60, 10), ["B"] = Range(0, 48, 8) }, iterations: 200, markers: [marker]);
        var result = Run(project, Aligned(Affine("R", 1, 0), Affine("B", 1.25, 0)));
        var s = result.Controls.Single(c => c.Id == "ash-1-age");
        Assert.Equal(["R", "B"], s.Cores.ToArray());
        Assert.Equal(50, s.CompositeTop, 1e-9);
        Assert.Equal(50, s.CompositeBottom, 1e-9);
        int r50 = Array.IndexOf(result.Cores["R"].Depths, 50.0);
        int b40 = Array.IndexOf(result.Cores["B"].Depths, 40.0);
        Assert.Equal(result.Cores["R"].AgeMedianBP[r50], result.Cores["B"].AgeMedianBP[b40], 1e-9);
        Assert.Equal(440, result.Cores["B"].AgeMedianBP[b40], 2.0);
    }

    [Fact]
    public void VarveCountingErrorGrowsLinearlyWithCount()
    {
        // 500 varves of 0.1 cm from 0 to 50 cm, anchored at 0 cm at -60 cal BP, a 2 % systematic counting error
        // (sigma = e n; methods: varve counting errors, growth [C]) on top of the default random-walk miscount rate
        // r = 2 % (variance r n). At n = 500: sigma = sqrt(10^2 + 10) = 10.49 yr, 95 % width 2 x 1.96 x 10.49 = 41.1 yr;
        // at n = 250: sqrt(5^2 + 5) = 5.48 yr, width 21.5 yr. Monte Carlo bound for 2000 draws: percentiles within
        // about 3 %: tolerance 10 %.
        var tops = Enumerable.Range(0, 500).Select(k => k / 10.0).ToArray();
        var bottoms = Enumerable.Range(1, 500).Select(k => k / 10.0).ToArray();
        var varves = new VarveCountControl
        {
            Id = "v", Core = "R", Table = "R-varves.csv", AnchorDepth = D(0), AnchorAge = CalendarAge.FromYearsBP(-60), CountError = 0.02,
        };
        var project = Project([varves], new Dictionary<string, double[]> { ["R"] = [0, 25, 50] }, iterations: 2000);
        var result = Run(project, Aligned(Affine("R", 1, 0)), new Dictionary<string, (double[], double[])> { ["v"] = (tops, bottoms) });
        var s = result.Cores["R"];
        Assert.Equal(-60, s.AgeMedianBP[0], 1e-9);
        Assert.Equal(-60 + 250, s.AgeMedianBP[1], 1.5);
        Assert.Equal(-60 + 500, s.AgeMedianBP[2], 3.0);
        Assert.Equal(41.1, s.AgeHiBP[2] - s.AgeLoBP[2], 4.1);
        Assert.Equal(21.5, s.AgeHiBP[1] - s.AgeLoBP[1], 2.2);
    }

    [Fact]
    public void RandomWalkMiscountsGrowWithTheSquareRootOfTheCount()
    {
        // The same 500 varves with the miscount model alone: each varve missed or split with probability r = 5 %,
        // so the cumulative error has variance r n (independent per-varve errors give sigma ~ sqrt(n); methods:
        // varve counting errors, growth [C]). At n = 500: sigma = 5 yr, 95 % width 19.6 yr; at n = 250: 3.54 yr,
        // width 13.9 yr (ratio sqrt 2). A 10 % uncertain-count interval over 25-50 cm raises the deeper variance to
        // 0.05 x 250 + 0.1 x 250 = 37.5 (width 24.0 yr). Tolerance 10 % (2000 draws, as above).
        var tops = Enumerable.Range(0, 500).Select(k => k / 10.0).ToArray();
        var bottoms = Enumerable.Range(1, 500).Select(k => k / 10.0).ToArray();
        var varves = new VarveCountControl { Id = "v", Core = "R", Table = "R-varves.csv", AnchorDepth = D(0), AnchorAge = CalendarAge.FromYearsBP(-60), MiscountRate = 0.05 };
        var layers = new Dictionary<string, (double[], double[])> { ["v"] = (tops, bottoms) };
        var s = Run(Project([varves], new Dictionary<string, double[]> { ["R"] = [0, 25, 50] }, iterations: 2000), Aligned(Affine("R", 1, 0)), layers).Cores["R"];
        Assert.Equal(19.6, s.AgeHiBP[2] - s.AgeLoBP[2], 2.0);
        Assert.Equal(13.9, s.AgeHiBP[1] - s.AgeLoBP[1], 1.4);
        var uncertain = varves with { Uncertain = [new UncertainCount(DepthInterval.FromTopBottom(25, 50, Unit), 0.1)] };
        var u = Run(Project([uncertain], new Dictionary<string, double[]> { ["R"] = [0, 25, 50] }, iterations: 2000), Aligned(Affine("R", 1, 0)), layers).Cores["R"];
        Assert.Equal(24.0, u.AgeHiBP[2] - u.AgeLoBP[2], 2.4);
        Assert.Equal(13.9, u.AgeHiBP[1] - u.AgeLoBP[1], 1.4);
    }

    [Fact]
    public void VarveTableProblemsNameTheVarve()
    {
        var varves = new VarveCountControl { Id = "v", Core = "R", Table = "t.csv", AnchorDepth = D(0), AnchorAge = CalendarAge.FromYearsBP(0) };
        var project = Project([varves, Calendar("a", "R", 0, 0, 1), Calendar("b", "R", 10, 100, 1)], new Dictionary<string, double[]> { ["R"] = [0, 5, 10] }, iterations: 10);
        var result = Run(project, Aligned(Affine("R", 1, 0)), new Dictionary<string, (double[], double[])> { ["v"] = ([0, 0.1, 0.15], [0.1, 0.2, 0.3]) });
        var f = Assert.Single(result.Findings, f => f.Code == AgeModelCodes.VarveTable);
        Assert.Contains("varve 3", f.Message);
        Assert.False(result.Controls.Single(c => c.Id == "v").Used);
    }

    [Fact]
    public void MonotoneSplineKeepsOrderAndLinearData()
    {
        // Fritsch and Carlson 1980: the PCHIP interpolant of monotone data stays monotone; linear data are reproduced (methods check).
        var depths = new Dictionary<string, double[]> { ["R"] = Range(0, 300, 0.5) };
        var linear = Run(Project([Calendar("a", "R", 0, Truth(0), 0), Calendar("b", "R", 100, Truth(100), 0), Calendar("c", "R", 300, Truth(300), 0)],
            depths, iterations: 5, interpolation: "monotone-spline", rateVariability: 0), Aligned(Affine("R", 1, 0)));
        Assert.All(linear.Cores["R"].Depths.Zip(linear.Cores["R"].AgeMedianBP), t => Assert.Equal(Truth(t.First), t.Second, 1e-9));

        // With and without the rate walk on the spline, every member stays monotone.
        foreach (double variability in new[] { 0, AgeModelSettings.DefaultRateVariability })
        {
            var wiggly = Run(Project(NoisyControls([0, 20, 30, 120, 130, 300], 40, seed: 5), depths, iterations: 100, interpolation: "monotone-spline",
                rateVariability: variability), Aligned(Affine("R", 1, 0)));
            Assert.Equal(AgeInterpolation.MonotoneSpline, wiggly.Interpolation);
            foreach (var member in wiggly.Members)
            {
                double prev = double.NegativeInfinity;
                for (double z = -10; z <= 310; z += 0.25)
                {
                    double a = member.AgeAt(z);
                    Assert.True(a >= prev - 1e-9, $"age decreases at {z}");
                    prev = a;
                }
            }
        }
    }

    [Fact]
    public void TooFewControlsIsAnError()
    {
        var result = Run(Project([Calendar("a", "R", 10, 100, 5)], new Dictionary<string, double[]> { ["R"] = [0, 10] }, iterations: 10),
            Aligned(Affine("R", 1, 0)));
        Assert.False(result.IsBuilt);
        Assert.True(result.Findings.HasErrors);
        Assert.Contains(result.Findings, f => f.Code == AgeModelCodes.TooFewControls);
        Assert.Single(result.Controls);
        Assert.True(double.IsNaN(result.AgeAt(CompositeDepth.From(5, Unit)).MedianBP));
    }

    [Fact]
    public void NoControlsAtAllIsANoteNotAnError()
    {
        var result = Run(Project([], new Dictionary<string, double[]> { ["R"] = [0, 10] }, iterations: 10), Aligned(Affine("R", 1, 0)));
        Assert.False(result.IsBuilt);
        Assert.False(result.Findings.HasErrors);
        Assert.Equal(StratLink.Checks.Severity.Note, Assert.Single(result.Findings, f => f.Code == AgeModelCodes.NoControls).Severity);
    }

    [Fact]
    public void AgesCsvHasUnitsInvariantNumbersAndAscendingDepths()
    {
        var project = Project([Calendar("a", "R", 0, -60, 0), Calendar("b", "R", 100, 940, 0)], new Dictionary<string, double[]> { ["R"] = [0.5, 10.25, 99.5] }, iterations: 5, rateVariability: 0);
        var result = Run(project, Aligned(Affine("R", 1, 0)));
        var sw = new StringWriter();
        AgesCsvWriter.Write(sw, result.Cores["R"]);
        Assert.StartsWith("depth_cm,age_median_bp,age_lo_bp,age_hi_bp,event_free_depth_cm,rate_median_cm_per_yr,rate_lo_cm_per_yr,rate_hi_cm_per_yr,"
            + "time_median_yr_per_cm,time_lo_yr_per_cm,time_hi_yr_per_cm\n0.5,-55,-55,-55,0.5,", sw.ToString());
        Assert.Contains("\n10.25,42.5,42.5,42.5,10.25,", sw.ToString());
        Assert.Equal("ages-R.csv", AgesCsvWriter.FileName("R"));
    }

    [Fact]
    public void A_core_with_its_coring_year_has_no_age_younger_than_it_and_the_composite_none_younger_than_the_last_coring()
    {
        // Exact controls 10 and 30 cm below the top at 5 yr/cm put the top 20 years after a 2019 coring unless the year holds
        // them (cal BP counts years before 1950 CE, Stuiver and Polach 1977: 2019 CE is -69 cal BP).
        var loaded = Project([Calendar("a", "R", 10, -20, 0), Calendar("b", "R", 30, 80, 0)],
            new Dictionary<string, double[]> { ["R"] = Range(0, 40, 1) }, iterations: 500);
        var aligned = Aligned(Affine("R", 1, 0));
        var free = AgeModeller.Run(loaded, aligned, NoVarves, null, CancellationToken.None);
        Assert.True(free.Cores["R"].AgeLoBP[0] < CalendarAge.FromYearCE(2019).YearsBP - 5, $"without the year the top's range starts at {free.Cores["R"].AgeLoBP[0]:0.0} cal BP");

        var dated = loaded.WithProject(loaded.Project with { Cores = [.. loaded.Project.Cores.Select(c => c with { CoringYear = 2019 })] });
        var held = AgeModeller.Run(dated, aligned, NoVarves, null, CancellationToken.None);
        foreach (var series in new[] { held.Cores["R"], held.Composite! })
            Assert.All(series.AgeLoBP, lo => Assert.True(lo >= CalendarAge.FromYearCE(2019).YearsBP, $"{series.Id}: {lo} cal BP"));
        Assert.Equal(CalendarAge.FromYearCE(2019).YearsBP, held.Cores["R"].AgeMedianBP[0], 1e-9);
        // Where the members are below the surface nothing changes: the same streams, the same ages.
        Assert.Equal(free.Cores["R"].AgeMedianBP[25], held.Cores["R"].AgeMedianBP[25], 1e-9);
    }

    [Fact]
    public void An_age_younger_than_its_cores_coring_year_is_a_warning()
    {
        // -75 cal BP (2025 CE) at 5 cm of a core taken in 2019 CE: beyond twice its 1-year error of the coring year.
        var loaded = Project([Calendar("late", "R", 5, -75, 1), Calendar("b", "R", 30, 80, 0)],
            new Dictionary<string, double[]> { ["R"] = Range(0, 40, 1) }, iterations: 200);
        var dated = loaded.WithProject(loaded.Project with { Cores = [.. loaded.Project.Cores.Select(c => c with { CoringYear = 2019 })] });
        var result = Run(dated, Aligned(Affine("R", 1, 0)));
        var f = Assert.Single(result.Findings, f => f.Code == AgeModelCodes.AfterCoring);
        Assert.Equal(("late", "R"), (f.Item, f.Core));
        Assert.Contains("2019 CE (-69 cal BP)", f.Message);
        Assert.DoesNotContain(Run(loaded, Aligned(Affine("R", 1, 0))).Findings, f => f.Code == AgeModelCodes.AfterCoring);
    }
}
