using StratLink.Analysis;

namespace StratLink.Tests.Analysis;

public class RegimeShiftTests
{
    [Theory]
    // Rodionov 2004 (GRL 31:L09204): diff = t sqrt(2 sigma_l^2 / l); l = 10, sigma_l = 1:
    // p = 0.1 -> t18 = 1.734, diff = 0.7755; p = 0.05 -> t18 = 2.101, diff = 0.9396.
    [InlineData(0.1, 0.7755)]
    [InlineData(0.05, 0.9396)]
    public void CriticalDifference_MatchesPublishedValues(double p, double expected) =>
        Assert.Equal(expected, RegimeShiftDetector.CriticalDifference(10, 1, p), 5e-4);

    [Fact]
    public void TwoMeanShifts_OnUnevenAges_AreFound()
    {
        // 400 samples over 2000-0 cal BP with uneven spacing (seed 4), white noise sd 0.5, mean 0 before
        // 1400 BP, +2 between 1400 and 600 BP, +0.5 after 600 BP (shifts of 4 and -3 sd); l = 20, p = 0.01
        // (diff ~ 0.86 sd, so a 3-sd shift leaves a sample inside mean +- diff with chance < 2 %).
        // Tolerance: three samples (15 yr on average) either side. A sample just before the shift that noise puts
        // beyond mean +- diff (chance ~0.19 at 0.86 sd) can open the new regime early; three such in a row: < 1 %.
        var rng = new Random(4);
        int n = 400;
        var ages = new double[n];
        ages[0] = 2000;
        for (int i = 1; i < n; i++) ages[i] = ages[i - 1] - (1 + 8 * rng.NextDouble()) * 2000.0 / (5 * n);
        var values = new double[n];
        var noise = new double[n];
        MathNet.Numerics.Distributions.Normal.Samples(rng, noise, 0, 0.5);
        for (int i = 0; i < n; i++) values[i] = (ages[i] > 1400 ? 0 : ages[i] > 600 ? 2 : 0.5) + noise[i];
        var series = AgeSeries.Create(ages, values);
        var r = RegimeShiftDetector.Detect(series, new RegimeShiftOptions { CutoffLength = 20, Probability = 0.01, HuberParameter = 1 });
        int at1400 = Array.FindIndex(series.AgesBP, a => a <= 1400), at600 = Array.FindIndex(series.AgesBP, a => a <= 600);
        var older = r.Shifts.Single(s => Math.Abs(s.Index - at1400) <= 3);
        var younger = r.Shifts.Single(s => Math.Abs(s.Index - at600) <= 3);
        // Means of the regimes within 3 standard errors (sd 0.5, >= 100 samples each: 3 * 0.5/sqrt(100) = 0.15).
        Assert.Equal(0.0, older.MeanBefore, 0.15);
        Assert.Equal(2.0, older.MeanAfter, 0.15);
        Assert.Equal(2.0, younger.MeanBefore, 0.15);
        Assert.InRange(younger.MeanAfter, 0.5 - 0.2, 0.5 + 0.2);
        Assert.True(older.Rsi > 0 && younger.Rsi > 0 && !older.Tentative && !younger.Tentative);
        // The sequential test also accepts weaker noise-made shifts (its false-alarm rate exceeds p; Rodionov 2006):
        // any other shift found must be far weaker than the true ones (mean change below 1, half the smaller one).
        foreach (var extra in r.Shifts.Except([older, younger]))
            Assert.True(Math.Abs(extra.MeanAfter - extra.MeanBefore) < 1, extra.ToString());
    }

    [Fact]
    public void HuberMean_DownweightsAnOutlier()
    {
        // Nine values at 0 and one at 10, sigma 1, h = 1: the median is 0 and the outlier's weight 1/10
        // gives mean 1/(9 + 0.1) = 0.1099 after the first step, staying near 0.11 (plain mean 1.0).
        double[] x = [0, 0, 0, 0, 0, 0, 0, 0, 0, 10];
        double m = RegimeShiftDetector.HuberMean(x, 1, 1);
        Assert.InRange(m, 0.10, 0.13);
    }
}
