using System.Globalization;
using StratLink.AgeModelling;
using StratLink.Model;
using StratLink.Tests.TestSupport;
using StratLink.Workflows;
using static StratLink.Tests.AgeModelling.AgeModelFixture;

namespace StratLink.Tests.AgeModelling;

public class RateWalkTests
{
    private static AgeModelResult Run(LoadedProject project) =>
        AgeModeller.Run(project, Aligned(Affine("R", 1, 0)), NoVarves, null, CancellationToken.None);

    /// <summary>Exact controls at 50, 150 and 250 cm (10 then 5 yr/cm); samples every cm from 0 to 300.</summary>
    private static AgeModelResult ExactControls(double variability, int iterations) =>
        Run(Project([Calendar("a", "R", 50, 400, 0), Calendar("b", "R", 150, 1400, 0), Calendar("c", "R", 250, 1900, 0)],
            new Dictionary<string, double[]> { ["R"] = Range(0, 300, 1) }, iterations: iterations, rateVariability: variability));

    private static (double Mean, double Sd) MeanSd(IReadOnlyList<double> values)
    {
        double mean = values.Average();
        return (mean, Math.Sqrt(values.Sum(v => (v - mean) * (v - mean)) / (values.Count - 1)));
    }

    [Fact]
    public void WalkPassesThroughTheControlsStaysMonotoneAndSpreadsBetweenThem()
    {
        var result = ExactControls(AgeModelSettings.DefaultRateVariability, 500);
        var s = result.Cores["R"];
        // Exact controls: every member passes through them, so the range there has no width (bridge property).
        foreach (var (depth, age) in new[] { (50, 400.0), (150, 1400.0), (250, 1900.0) })
        {
            Assert.Equal(age, s.AgeLoBP[depth], 1e-9);
            Assert.Equal(age, s.AgeHiBP[depth], 1e-9);
        }
        // Between and beyond them the rate varies, so the ranges open up; they widen with distance beyond the end control.
        Assert.True(s.AgeHiBP[100] - s.AgeLoBP[100] > 50, $"range at 100 cm: {s.AgeLoBP[100]:0}-{s.AgeHiBP[100]:0}");
        Assert.True(s.AgeHiBP[300] - s.AgeLoBP[300] > s.AgeHiBP[270] - s.AgeLoBP[270]);
        Assert.True(s.AgeHiBP[0] - s.AgeLoBP[0] > s.AgeHiBP[30] - s.AgeLoBP[30]);
        // Extrapolation stays flagged: 0-49 cm above the top control, 251-300 below the bottom one.
        Assert.Equal(50, s.Extrapolated.Take(51).Count(e => e));
        Assert.Equal(50, s.Extrapolated.Skip(250).Count(e => e));
        foreach (var member in result.Members)
            for (int k = 1; k < member.AgesBP.Count; k++) Assert.True(member.AgesBP[k] >= member.AgesBP[k - 1]);
    }

    [Fact]
    public void ZeroVariabilityGivesStraightLinesThroughTheControls()
    {
        // rate_variability 0: the members are the controls' knots and nothing else (straight lines, common practice).
        var result = ExactControls(0, 20);
        Assert.All(result.Members, m => Assert.Equal([50.0, 150.0, 250.0], m.CompositeDepths));
        Assert.Equal(900, result.Cores["R"].AgeMedianBP[100], 1e-9);
        Assert.Equal(1900 + 50 * 5, result.Cores["R"].AgeMedianBP[300], 1e-9);
    }

    [Fact]
    public void LogRateChangeAcrossAnIntervalHasTheSetSpread()
    {
        // The setting's definition: the walk's log-rate change across one interval has sd = variability. The first and
        // last of its 50 sub-steps (2 cm each on the 1-cm composite step) are 49 steps apart: sd = v sqrt(49/50).
        // Below the bottom control, 26 steps of 51/26 cm reach the walk's extent (300 cm + one step); at 299 cm the
        // rate is 25 steps out: sd = v sqrt(25 x (51/26) / 100) (random-walk variance grows linearly with distance).
        // 2,000 members: the sd's standard error is about 1.6 %; bound 5 % (3 standard errors); mean 0 within 0.05.
        const double v = 0.6;
        var result = ExactControls(v, 2000);
        var across = new double[result.MemberCount];
        var beyond = new double[result.MemberCount];
        for (int m = 0; m < result.MemberCount; m++)
        {
            result.Members[m].AgeAt(51, out double first);
            result.Members[m].AgeAt(149, out double last);
            result.Members[m].AgeAt(299, out double deep);
            across[m] = Math.Log(last / first);
            beyond[m] = Math.Log(deep / 5); // the bottom interval's mean rate: 5 yr/cm
        }
        var (meanAcross, sdAcross) = MeanSd(across);
        var (meanBeyond, sdBeyond) = MeanSd(beyond);
        Assert.InRange(sdAcross / (v * Math.Sqrt(49 / 50.0)), 0.95, 1.05);
        Assert.InRange(meanAcross, -0.05, 0.05);
        Assert.InRange(sdBeyond / (v * Math.Sqrt(25 * (51 / 26.0) / 100)), 0.95, 1.05);
        Assert.InRange(meanBeyond, -0.05, 0.05);
    }

    [Fact]
    public void BeyondADenseRunOfControlsTheWalkIsAsUncertainAsOneIntervalOfItsOwnLength()
    {
        // A varve count's points, every 0.5 cm from 50 to 250 cm at 5 yr/cm, extrapolated 50 cm above the first: the
        // walk is calibrated on the 50 cm of controls below it (rate 5 yr/cm), in 50 steps of 1 cm, so the log rate of
        // the topmost step departs from it with sd = v sqrt(50/50) = v (random-walk variance grows linearly with the
        // number of steps; textbook, from memory). Calibrated on the nearest 0.5 cm interval instead, it would be
        // v sqrt(50/0.5) = 10 v. 2,000 draws: the sd's standard error is about 1.6 %; bound 5 % (3 standard errors).
        const double v = 0.6;
        double[] z = Range(50, 250, 0.5);
        var controls = new AgeDepthCurve(z, z.Select(d => 5 * d).ToArray(), AgeInterpolation.Linear);
        var walk = new RateWalk(v, 1.0, 0, 250);
        var logRate = new double[2000];
        for (int m = 0; m < logRate.Length; m++)
        {
            walk.Apply(controls, new Random(1000 + m)).AgeAt(0.5, out double yearsPerCm);
            logRate[m] = Math.Log(yearsPerCm / 5);
        }
        var (mean, sd) = MeanSd(logRate);
        Assert.InRange(sd / v, 0.95, 1.05);
        Assert.InRange(mean, -0.05, 0.05);
    }

    [Theory]
    [InlineData("ODP925_agemodel_Bickert1997.txt")]
    [InlineData("ODP927_agemodel_Bickert1997.txt")]
    public void DefaultCoversTheSkippedTiesOfAPublishedAgeModel(string file)
    {
        // Source: Bickert, Curry and Wefer 1997 (Proc. ODP Sci. Results 154:239-254), orbitally tuned age models of
        // ODP Sites 925 and 927 (ceara-rise in the shared data). Every 4th tie point (about 1-4 m apart) becomes an
        // exact control; the other ties' published ages are the truth. The default variability was estimated from
        // these records (AgeModelSettings.DefaultRateVariability), so this checks the estimate's use end to end: the
        // 95 % ranges should hold about 95 % of the skipped ages; bound 88-99.5 % (a few hundred ties in runs of three,
        // not independent).
        var ties = File.ReadLines(RepoPaths.Data("ceara-rise", file))
            .Select(line => line.Split(' ', StringSplitOptions.RemoveEmptyEntries))
            .Where(p => p.Length >= 2 && double.TryParse(p[0], NumberStyles.Float, CultureInfo.InvariantCulture, out _))
            .Select(p => (DepthCm: 100 * double.Parse(p[0], CultureInfo.InvariantCulture), AgeBP: 1e6 * double.Parse(p[1], CultureInfo.InvariantCulture)))
            .ToList();
        // Site 927 lists two ties whose depth does not increase (91.28 m twice; 220.04 m after 220.27 m): dropped.
        ties = ties.Where((t, k) => k == 0 || t.DepthCm > ties[k - 1].DepthCm).ToList();
        Assert.True(ties.Count > 300, $"{file}: {ties.Count} ties");
        int last = (ties.Count - 1) / 4 * 4;
        var controls = Enumerable.Range(0, last / 4 + 1)
            .Select(k => (AgeControlSpec)Calendar($"t{4 * k}", "R", ties[4 * k].DepthCm, ties[4 * k].AgeBP, 0)).ToList();
        var skipped = ties.Take(last).Where((_, k) => k % 4 != 0).ToArray();
        var result = Run(Project(controls, new Dictionary<string, double[]> { ["R"] = skipped.Select(t => t.DepthCm).ToArray() }, iterations: 1000));
        var s = result.Cores["R"];
        int inside = Enumerable.Range(0, s.Count).Count(i => skipped[i].AgeBP >= s.AgeLoBP[i] && skipped[i].AgeBP <= s.AgeHiBP[i]);
        double share = inside / (double)s.Count;
        Console.WriteLine($"{file}: {controls.Count} controls, {s.Count} skipped ties, 95 % ranges hold {share:P1} of their published ages");
        Assert.InRange(share, 0.88, 0.995);
    }
}
