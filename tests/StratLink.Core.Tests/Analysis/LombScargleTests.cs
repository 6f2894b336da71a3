using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.LinearRegression;
using StratLink.Analysis;

namespace StratLink.Tests.Analysis;

public class LombScargleTests
{
    [Fact]
    public void UnitSineOfPeriod10_HasPower49_5AtItsFrequency()
    {
        // Check value: 100 even samples of a unit sine, period 10, sample variance (N-1):
        // P(0.1) = (N-1)/2 = 49.5 (Scargle 1982 normalisation; Horne and Baliunas 1986).
        var t = Enumerable.Range(0, 100).Select(i => (double)i).ToArray();
        var y = t.Select(v => Math.Sin(2 * Math.PI * v / 10)).ToArray();
        var p = LombScargle.Power(t, y, [0.1]);
        Assert.Equal(49.5, p[0], 1e-9);
    }

    [Fact]
    public void FalseAlarm_Z10_M100_Is0_00453()
    {
        // FAP = 1 - (1 - e^-z)^M (Scargle 1982); z = 10, M = 100 -> 0.00453.
        Assert.Equal(0.00453, FalseAlarmProbability.IndependentFrequencies(10, 100), 5e-6);
        Assert.Equal(Math.Exp(-10), FalseAlarmProbability.SingleFrequencyPsd(10), 1e-15);
    }

    [Fact]
    public void HorneBaliunasIndependentFrequencies_N100_Is122_7()
    {
        // Horne and Baliunas 1986, ApJ 302:757: M = -6.362 + 1.193 N + 0.00098 N^2 -> 122.738 for N = 100.
        Assert.Equal(122.7, FalseAlarmProbability.HorneBaliunasIndependentFrequencies(100), 0.05);
    }

    [Fact]
    public void Power_EqualsReductionInSumOfSquaresOfASinusoidFit_OnUnevenTimes()
    {
        // Lomb 1976 / VanderPlas 2018 (ApJS 236:16, sec. 5): the Lomb-Scargle power is the drop in the residual
        // sum of squares when a sinusoid a cos wt + b sin wt is fitted by least squares to the mean-removed data:
        // P_standard = 1 - RSS/SS. Checked against MathNet's QR least squares on random uneven times.
        var rng = new Random(7);
        int n = 73;
        var t = Enumerable.Range(0, n).Select(_ => rng.NextDouble() * 500).OrderBy(v => v).ToArray();
        var y = t.Select(v => 0.7 * Math.Sin(2 * Math.PI * v / 37 + 0.3) + rng.NextDouble() - 0.5).ToArray();
        double mean = y.Average();
        var yc = y.Select(v => v - mean).ToArray();
        double ss = yc.Sum(v => v * v);
        double[] freqs = [0.0031, 0.011, 1 / 37.0, 0.05, 0.137];
        var p = LombScargle.Power(t, y, freqs, LombScargleNormalisation.Standard);
        for (int k = 0; k < freqs.Length; k++)
        {
            double w = 2 * Math.PI * freqs[k];
            var x = Matrix<double>.Build.Dense(n, 2, (i, j) => j == 0 ? Math.Cos(w * t[i]) : Math.Sin(w * t[i]));
            var beta = MultipleRegression.QR(x, Vector<double>.Build.DenseOfArray(yc));
            var resid = Vector<double>.Build.DenseOfArray(yc) - x * beta;
            double expected = 1 - resid.DotProduct(resid) / ss;
            Assert.Equal(expected, p[k], 1e-10);
        }
    }

    [Fact]
    public void GridRecurrence_MatchesDirectEvaluation()
    {
        // The grid version advances cos/sin by recurrence; it must agree with direct evaluation (1e-9 relative).
        var rng = new Random(11);
        var t = Enumerable.Range(0, 300).Select(_ => rng.NextDouble() * 3000).OrderBy(v => v).ToArray();
        var y = t.Select(v => Math.Cos(2 * Math.PI * v / 88) + rng.NextDouble()).ToArray();
        var grid = new FrequencyGrid(1 / 12000.0, 1200);
        var fast = LombScargle.PowerOnGrid(t, y, grid);
        var slow = LombScargle.Power(t, y, grid.Frequencies());
        for (int k = 0; k < grid.Count; k++) Assert.Equal(slow[k], fast[k], Math.Max(1e-12, 1e-9 * slow[k]));
    }

    [Fact]
    public void BaluevBound_AgreesWithWhiteNoiseMonteCarlo()
    {
        // Baluev 2008 (MNRAS 385:1279): for small false-alarm probabilities the bound is close to the true
        // probability that the largest standard power over (0, f_max] exceeds P. Independent check: 2000 white
        // noise series on fixed uneven times (seed 3); the share whose peak exceeds P* is compared with the bound
        // at P* where the bound is 0.05. Bound: an upper bound, accurate to some 10-20 % at this level; with 2000
        // trials the binomial sd of 0.05 is 0.005, so the Monte Carlo share must lie in [0.03, 0.06].
        var rng = new Random(3);
        int n = 100;
        var t = Enumerable.Range(0, n).Select(_ => rng.NextDouble() * 100).OrderBy(v => v).ToArray();
        double fmax = 0.5;
        var grid = new FrequencyGrid(1 / (5 * 100.0), (int)(fmax * 5 * 100));
        double lo = 0, hi = 1;
        for (int it = 0; it < 60; it++)
        {
            double mid = 0.5 * (lo + hi);
            if (FalseAlarmProbability.Baluev(mid, t, fmax) > 0.05) lo = mid; else hi = mid;
        }
        double pStar = 0.5 * (lo + hi);
        int exceed = 0, trials = 2000;
        var y = new double[n];
        for (int r = 0; r < trials; r++)
        {
            MathNet.Numerics.Distributions.Normal.Samples(rng, y, 0, 1);
            var p = LombScargle.PowerOnGrid(t, y, grid, LombScargleNormalisation.Standard);
            if (p.Max() > pStar) exceed++;
        }
        double share = (double)exceed / trials;
        Assert.InRange(share, 0.03, 0.06);
    }
}
