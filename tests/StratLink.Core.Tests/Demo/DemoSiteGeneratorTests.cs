using MathNet.Numerics;
using StratLink.Demo;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Quantities;

namespace StratLink.Tests.Demo;

public class DemoSiteGeneratorTests
{
    private const DepthUnit Cm = DepthUnit.Centimetre;
    public static readonly TheoryData<int> Seeds = new() { 1, 2, 3, 4 };

    [Fact]
    public void SameSeedGivesTheSameSiteNumberForNumber()
    {
        var a = DemoSiteGenerator.Generate(7);
        var b = DemoSiteGenerator.Generate(7);
        Assert.Equal(ProjectWriter.ToYaml(a.Project), ProjectWriter.ToYaml(b.Project));
        foreach (var id in a.Tables.Keys)
        {
            Assert.Equal(a.Tables[id].Depths, b.Tables[id].Depths);
            foreach (var (name, values) in a.Tables[id].Signals) Assert.Equal(values, b.Tables[id].Signals[name]);
            Assert.Equal(a.Truth[id].CompositeDepths, b.Truth[id].CompositeDepths);
            Assert.Equal(a.Truth[id].AgesBP, b.Truth[id].AgesBP);
        }
        Assert.Equal(a.CountedVarves, b.CountedVarves);
        Assert.Equal(a.History.Climate, b.History.Climate);
    }

    [Fact]
    public void DifferentSeedsGiveDifferentSites()
    {
        var a = DemoSiteGenerator.Generate(1);
        var b = DemoSiteGenerator.Generate(2);
        Assert.NotEqual(a.Tables["MW19-P1"].Signals["ms"].Take(100), b.Tables["MW19-P1"].Signals["ms"].Take(100));
        Assert.NotEqual(a.History.Climate, b.History.Climate);
        Assert.NotEqual(ProjectWriter.ToYaml(a.Project), ProjectWriter.ToYaml(b.Project));
    }

    [Theory]
    [MemberData(nameof(Seeds))]
    public void CoresHaveTheScenariosTypesLengthsAndSampling(int seed)
    {
        var site = DemoSiteGenerator.Generate(seed);
        Assert.Equal(["MW19-P1", "MW19-P2", "MW19-G3", "MW19-F4"], site.Project.Cores.Select(c => c.Id));
        Assert.Equal(["piston", "piston", "gravity", "freeze"], site.Project.Cores.Select(c => c.Type));
        var t = site.Truth;
        Assert.InRange(t["MW19-P1"].Length, 600, 900);
        Assert.InRange(t["MW19-P2"].Length, 600, 900);
        Assert.InRange(t["MW19-G3"].Length, 250, 350);
        Assert.InRange(t["MW19-F4"].Length, 50, 100);
        // The reference core reaches several thousand years and is the oldest, so every sample has a true composite depth.
        double referenceBase = t["MW19-P1"].AgesBP[^1];
        Assert.True(referenceBase > 3000, $"reference base age {referenceBase}");
        foreach (var id in t.Keys.Where(k => k != "MW19-P1")) Assert.True(t[id].AgesBP[^1] < referenceBase, id);
        // The gravity core lost tens of cm at its top; the freeze core keeps the sediment surface of the coring year.
        Assert.InRange(t["MW19-G3"].CompositeDepths[0], 20, 90);
        Assert.Equal(DemoSiteGenerator.CoringAgeBP, t["MW19-F4"].TopAgeBP, 9);
        Assert.Equal(-69, DemoSiteGenerator.CoringAgeBP);
        foreach (var table in site.Tables.Values)
        {
            Assert.Equal(["ms", "density", "ca_ti"], table.SignalNames);
            for (int i = 1; i < table.Count; i++)
            {
                double step = table.Depths[i] - table.Depths[i - 1];
                Assert.True(step > 0 && Math.Abs(step / 0.5 - Math.Round(step / 0.5)) < 1e-9, $"{table.CoreId} step {step} at {table.Depths[i]}");
            }
        }
    }

    [Theory]
    [MemberData(nameof(Seeds))]
    public void GapsHoldNoRowsAndMarkersLieInsideTheirCoresOutsideGaps(int seed)
    {
        var site = DemoSiteGenerator.Generate(seed);
        Assert.Contains(site.Project.Cores, c => c.Gaps.Count > 0);
        foreach (var core in site.Project.Cores)
        {
            var depths = site.Tables[core.Id].Depths;
            foreach (var gap in core.Gaps)
            {
                Assert.DoesNotContain(depths, gap.ContainsValue);
                Assert.True(gap.Top.In(Cm) > 0 && gap.Bottom.In(Cm) < depths[^1], $"{core.Id} gap {gap} outside the core");
            }
        }
        Assert.True(site.Project.Markers.Count >= 5, $"{site.Project.Markers.Count} markers");
        foreach (var marker in site.Project.Markers)
        {
            Assert.True(marker.Depths.Count >= 2, marker.Id);
            Assert.InRange(marker.Uncertainty, 0.1, 0.9);
            foreach (var md in marker.Depths)
            {
                var core = site.Project.FindCore(md.CoreId)!;
                double d = md.Depth.In(Cm);
                Assert.InRange(d, 0, site.Truth[md.CoreId].Length);
                Assert.False(core.IsInGap(d), $"{marker.Id} in a gap of {md.CoreId}");
            }
        }
        // One marker seen in the reference core is missing from the gravity core (above its lost top).
        Assert.Contains(site.Project.Markers, m => m.DepthIn("MW19-P1") is not null && m.DepthIn("MW19-G3") is null);
    }

    [Theory]
    [MemberData(nameof(Seeds))]
    public void MarkerDepthsAgreeWithTheTrueCompositeDepths(int seed)
    {
        var site = DemoSiteGenerator.Generate(seed);
        foreach (var marker in site.Project.Markers)
        {
            double reference = marker.DepthIn("MW19-P1")!.Value.In(Cm);
            foreach (var md in marker.Depths)
            {
                double composite = site.Truth[md.CoreId].CompositeDepthAt(md.Depth.In(Cm));
                // Picks carry 0.15 cm (1 sigma) of error in each core, scaled by layer thickness ratios up to
                // about 1.5: the difference has a sd of about 0.3 cm; 1 cm is over 3 sd.
                Assert.True(Math.Abs(composite - reference) < 1.0, $"{marker.Id} in {md.CoreId}: true composite {composite}, reference pick {reference}");
            }
        }
    }

    [Theory]
    [MemberData(nameof(Seeds))]
    public void TruthIsMonotoneAndAgesIncreaseWithDepth(int seed)
    {
        var site = DemoSiteGenerator.Generate(seed);
        foreach (var (id, truth) in site.Truth)
        {
            for (int i = 1; i < truth.Depths.Length; i++)
            {
                Assert.True(truth.CompositeDepths[i] >= truth.CompositeDepths[i - 1], $"{id} composite decreases at {truth.Depths[i]}");
                Assert.True(truth.AgesBP[i] >= truth.AgesBP[i - 1], $"{id} age decreases at {truth.Depths[i]}");
            }
            // Over every 10 cm the age grows: event layers (instantaneous) are a few cm thick at most.
            for (int i = 20; i < truth.Depths.Length; i++)
                if (truth.Depths[i] - truth.Depths[i - 20] <= 10.0 + 1e-9)
                    Assert.True(truth.AgesBP[i] > truth.AgesBP[i - 20], $"{id} age constant over 10 cm at {truth.Depths[i]}");
        }
        var reference = site.Truth["MW19-P1"];
        for (int i = 0; i < reference.Depths.Length; i++) Assert.Equal(reference.Depths[i], reference.CompositeDepths[i], 9);
    }

    [Theory]
    [MemberData(nameof(Seeds))]
    public void StraightLinesBetweenTiesAreADecentButImprovableBaseline(int seed)
    {
        // Accumulation rates wiggle between ties on decimetre scales, so straight lines between marker
        // ties miss the true mapping by centimetres (room for a signal alignment to do better), yet
        // the ties are dense enough that the miss stays well below a decimetre.
        var site = DemoSiteGenerator.Generate(seed);
        foreach (string id in new[] { "MW19-P2", "MW19-G3" })
            Assert.InRange(TiesBaselineRms(site, id), 1.5, 8.0);
    }

    /// <summary>RMS (cm) of straight lines between marker ties against the true composite depth, over the samples between the outer ties.</summary>
    internal static double TiesBaselineRms(DemoSite site, string coreId)
    {
        var ties = site.Project.Markers
            .Where(m => m.DepthIn(coreId) is not null && m.DepthIn(site.ReferenceCoreId) is not null)
            .Select(m => (Core: m.DepthIn(coreId)!.Value.In(Cm), Reference: m.DepthIn(site.ReferenceCoreId)!.Value.In(Cm)))
            .OrderBy(t => t.Core).ToList();
        Assert.True(ties.Count >= 2, $"{coreId} has {ties.Count} ties");
        var truth = site.Truth[coreId];
        double sum = 0;
        int n = 0;
        for (int i = 0; i < truth.Depths.Length; i++)
        {
            double z = truth.Depths[i];
            if (z < ties[0].Core || z > ties[^1].Core) continue;
            int k = 0;
            while (k < ties.Count - 2 && z > ties[k + 1].Core) k++;
            double line = ties[k].Reference + (z - ties[k].Core) * (ties[k + 1].Reference - ties[k].Reference) / (ties[k + 1].Core - ties[k].Core);
            sum += (line - truth.CompositeDepths[i]) * (line - truth.CompositeDepths[i]);
            n++;
        }
        return Math.Sqrt(sum / n);
    }

    [Fact]
    public void TrueMappingAsDepthMappingReproducesTheSampleTruth()
    {
        var site = DemoSiteGenerator.Generate(1);
        var truth = site.Truth["MW19-P2"];
        var mapping = truth.ToDepthMapping(Cm, 0.05);
        // Knots every 0.05 cm; the truth is piecewise linear with kinks at most 0.05 cm apart from a knot,
        // so interpolation differs by less than the steepest slope (event layers absent elsewhere: about 3) x 0.05.
        for (int i = 0; i < truth.Depths.Length; i++)
            Assert.True(Math.Abs(mapping.ToCompositeValue(truth.Depths[i]) - truth.CompositeDepths[i]) < 0.15, $"at {truth.Depths[i]}");
    }

    [Fact]
    public void ProjectHoldsTheStatedSettings()
    {
        var p = DemoSiteGenerator.Generate(1).Project;
        Assert.Equal(DepthUnit.Centimetre, p.DepthUnit);
        Assert.Equal(DemoSiteGenerator.SiteName, p.Site.Name);
        Assert.Equal("MW19-P1", p.ReferenceCoreId);
        Assert.Equal([("ms", 1.0), ("density", 0.5), ("ca_ti", 0.75)], p.Alignment.Signals.Select(s => (s.Signal, s.Weight)));
        Assert.Equal(0.15, p.Alignment.Window);
        Assert.Equal(200, p.Alignment.Ensemble);
        Assert.Equal(AlignmentMethods.Dtw, p.Alignment.Method);
        Assert.Equal(0.5, p.Composite.Step);
        Assert.Null(p.Composite.Splice);
        Assert.Equal(2000, p.AgeModel.Iterations);
        Assert.Equal(42, p.AgeModel.Seed);
        var disturbed = Assert.Single(p.FindCore("MW19-P2")!.Disturbed);
        Assert.Equal(0, disturbed.Top.In(Cm));
        Assert.InRange(disturbed.Bottom.In(Cm), 5, 9);

        var top = Assert.Single(p.Ages.OfType<CalendarAgeControl>(), a => a.Core is not null);
        Assert.Equal(("MW19-F4", 0.0, -69.0), (top.Core, top.Depth!.Value.In(Cm), top.Age.YearsBP));
        Assert.False(top.Exclude);
        // Every age control is used: the tephra ages and the freeze core's count weigh the reference core's varve chronology.
        var tephraAges = p.Ages.OfType<CalendarAgeControl>().Where(a => a.Marker is not null).ToList();
        Assert.Equal(3, tephraAges.Count);
        Assert.All(tephraAges, a => Assert.False(a.Exclude, a.Id));
        var varves = p.Ages.OfType<VarveCountControl>().ToList();
        Assert.Equal(2, varves.Count);
        Assert.Equal(("MW19-F4", "cores/MW19-F4-varves.csv", 0.0, -69.0, 0.02, 0.0, false),
            (varves[0].Core, varves[0].Table, varves[0].AnchorDepth.In(Cm), varves[0].AnchorAge.YearsBP, varves[0].MiscountRate, varves[0].CountError, varves[0].Exclude));
        Assert.Equal(("MW19-P1", "cores/MW19-P1-varves.csv", 0.0, -69.0, 0.02, 0.0, false),
            (varves[1].Core, varves[1].Table, varves[1].AnchorDepth.In(Cm), varves[1].AnchorAge.YearsBP, varves[1].MiscountRate, varves[1].CountError, varves[1].Exclude));
    }

    [Theory]
    [MemberData(nameof(Seeds))]
    public void TephraAgesLieWithinTheirStatedErrors(int seed)
    {
        var site = DemoSiteGenerator.Generate(seed);
        foreach (var control in site.Project.Ages.OfType<CalendarAgeControl>().Where(a => a.Marker is not null))
        {
            var marker = site.Project.FindMarker(control.Marker!)!;
            Assert.Equal(MarkerKind.Tephra, marker.Kind);
            var md = marker.Depths[0];
            double trueAge = site.Truth[md.CoreId].AgeAt(md.Depth.In(Cm));
            // Published age = true age + N(0, error), rounded to a year: within 4 sigma + 0.5 yr.
            Assert.True(Math.Abs(control.Age.YearsBP - trueAge) <= 4 * control.Error + 0.5, $"{control.Id}: {control.Age} vs true {trueAge}");
        }
    }

    [Theory]
    [MemberData(nameof(Seeds))]
    public void CountedVarvesCoverTheFreezeCoreAndMatchTheTrueCountClosely(int seed)
    {
        var site = DemoSiteGenerator.Generate(seed);
        var truth = site.Truth[site.VarveCoreId];
        // One varve per whole year between the coring year and the age at the core base.
        Assert.Equal((int)Math.Floor(truth.AgeAt(truth.Length) - DemoSiteGenerator.CoringAgeBP), site.TrueVarveCount);
        var v = site.CountedVarves;
        Assert.Equal(0, v[0].Top);
        for (int i = 0; i < v.Count; i++)
        {
            Assert.True(v[i].Bottom > v[i].Top, $"varve {i}");
            if (i > 0) Assert.Equal(v[i - 1].Bottom, v[i].Top);
        }
        Assert.True(v[^1].Bottom <= truth.Length);
        // About 1 % missed and 1 % doubled: over ~300 varves the net error has sd ~2.5 varves; 5 % is about 6 sd.
        Assert.InRange(v.Count, site.TrueVarveCount * 0.95, site.TrueVarveCount * 1.05);
    }

    [Theory]
    [MemberData(nameof(Seeds))]
    public void CountedVarvesCoverTheReferenceCoreAndMatchTheTrueCountClosely(int seed)
    {
        var site = DemoSiteGenerator.Generate(seed);
        var truth = site.Truth[site.ReferenceCoreId];
        Assert.Equal((int)Math.Floor(truth.AgeAt(truth.Length) - DemoSiteGenerator.CoringAgeBP), site.ReferenceTrueVarveCount);
        var v = site.ReferenceCountedVarves;
        Assert.Equal(0, v[0].Top);
        for (int i = 1; i < v.Count; i++) Assert.Equal(v[i - 1].Bottom, v[i].Top);
        Assert.True(v[^1].Bottom <= truth.Length);
        // ~1 % missed and ~1 % doubled over ~3500 varves: the net error has sd ~ sqrt(0.02 n) ~ 8 varves, so 1 %
        // (~35 varves) is about 4 sd; the age model's stated 2 % counting error is far wider.
        Assert.InRange(v.Count, site.ReferenceTrueVarveCount * 0.99, site.ReferenceTrueVarveCount * 1.01);
    }

    [Fact]
    public void TrueSignalHoldsTheElevenAndEightyEightYearCycles()
    {
        var h = DemoSiteGenerator.Generate(1).History;
        Assert.Equal([11.0, 88.0], h.Cycles.Select(c => c.PeriodYears));
        Assert.Equal([0.6, 0.8], h.Cycles.Select(c => c.Amplitude));
        // Least-squares harmonic fit y = a + b cos(2 pi t / P) + c sin(2 pi t / P), amplitude sqrt(b^2 + c^2)
        // (common practice; Bloomfield 2000, Fourier Analysis of Time Series, ch. 2). With AR(1) noise
        // (phi 0.7, sd 1) over 6000 years the coefficient standard errors are about 0.02 (11 yr) and 0.04
        // (88 yr): 0.12 is at least 3 of them.
        Assert.Equal(0.6, HarmonicAmplitude(h.AgesBP, h.Climate, 11), 0.12);
        Assert.Equal(0.8, HarmonicAmplitude(h.AgesBP, h.Climate, 88), 0.12);
        // Periods that were not put in fit only noise (standard errors about 0.03-0.04).
        Assert.True(HarmonicAmplitude(h.AgesBP, h.Climate, 17) < 0.2);
        Assert.True(HarmonicAmplitude(h.AgesBP, h.Climate, 40) < 0.2);
    }

    [Fact]
    public void TrueSignalSteppedAtTheRegimeShifts()
    {
        var h = DemoSiteGenerator.Generate(1).History;
        Assert.Equal(2, h.RegimeShifts.Count);
        foreach (var shift in h.RegimeShifts)
        {
            // Mean of 500 years on each side; AR(1) noise (phi 0.7) gives each mean a sd of
            // sqrt((1 + phi) / (1 - phi) / 500) = 0.11, the difference 0.15: 0.45 is 3 sd.
            double younger = MeanOver(h, shift.AgeBP - 500, shift.AgeBP), older = MeanOver(h, shift.AgeBP, shift.AgeBP + 500);
            Assert.Equal(shift.Step, younger - older, 0.45);
        }
    }

    private static double MeanOver(SiteHistory h, double fromBP, double toBP) =>
        Enumerable.Range(0, h.AgesBP.Length).Where(i => h.AgesBP[i] >= fromBP && h.AgesBP[i] < toBP).Average(i => h.Climate[i]);

    private static double HarmonicAmplitude(double[] t, double[] y, double period)
    {
        double w = 2 * Math.PI / period;
        double[] p = Fit.LinearCombination(t, y, _ => 1.0, x => Math.Cos(w * x), x => Math.Sin(w * x));
        return Math.Sqrt(p[1] * p[1] + p[2] * p[2]);
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    public void EventLayersAreListedWithTheirTrueThickness(int seed)
    {
        // The generator's hidden events are the outside reference: each core lists every event layer wholly in its
        // recovered part and clear of its gaps, at the layer's true top and base to the logged mm (0.05 cm rounding),
        // disjoint; every marker of an event kind sits inside one of its core's listed layers.
        var site = DemoSiteGenerator.Generate(seed);
        foreach (var core in site.Project.Cores)
        {
            Assert.NotEmpty(core.Events);
            for (int k = 1; k < core.Events.Count; k++) Assert.True(core.Events[k].Top >= core.Events[k - 1].Bottom);
            double total = core.Events.Sum(e => e.Length);
            Assert.True(total > 0.5, $"{core.Id}: events {total} cm in all");
            foreach (var m in site.Project.Markers.Where(m => m.DepthIn(core.Id) is not null))
            {
                double d = m.DepthIn(core.Id)!.Value.In(Cm);
                Assert.Contains(core.Events, e => d >= e.Top.In(Cm) - 0.05 && d <= e.Bottom.In(Cm) + 0.05);
            }
        }
    }
}
