using StratLink.Analysis;

namespace StratLink.Tests.Analysis;

/// <summary>Invented test records: uneven ages, cycles of chosen periods and AR(1) noise.</summary>
internal static class SyntheticRecords
{
    /// <summary>
    /// <paramref name="n"/> ages from <paramref name="oldestBP"/> towards 0 cal BP, gaps uniform in
    /// [0.2, 1.8] times the mean gap.
    /// </summary>
    public static double[] UnevenAges(Random rng, int n, double oldestBP)
    {
        double mean = oldestBP / n;
        var ages = new double[n];
        ages[0] = oldestBP;
        for (int i = 1; i < n; i++) ages[i] = ages[i - 1] - mean * (0.2 + 1.6 * rng.NextDouble());
        return ages;
    }

    /// <summary>Sum of cosines (amplitude, period in years) plus unit-variance AR(1) noise of persistence tau, on the ages.</summary>
    public static double[] CyclesPlusRedNoise(Random rng, double[] agesBP, double tauYears, params (double Amplitude, double Period)[] cycles)
    {
        var forward = agesBP.Select(a => -a).ToArray();
        var noise = new double[agesBP.Length];
        Ar1Process.Simulate(forward, tauYears, rng, noise);
        var y = new double[agesBP.Length];
        for (int i = 0; i < y.Length; i++)
        {
            y[i] = noise[i];
            foreach (var (a, p) in cycles) y[i] += a * Math.Cos(2 * Math.PI * agesBP[i] / p);
        }
        return y;
    }

    /// <summary>Largest power/level ratio within half the resolution bandwidth of 1/<paramref name="period"/>.</summary>
    public static double PeakRatio(SpectrumEstimate s, double period, double percent)
    {
        var level = s.Level(percent);
        double f0 = 1 / period, half = 0.5 * s.SixDecibelBandwidth;
        double best = 0;
        for (int k = 0; k < s.Frequencies.Length; k++)
            if (Math.Abs(s.Frequencies[k] - f0) <= half) best = Math.Max(best, s.Power[k] / level[k]);
        return best;
    }
}
