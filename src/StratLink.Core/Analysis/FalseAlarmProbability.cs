using MathNet.Numerics;

namespace StratLink.Analysis;

/// <summary>False-alarm probabilities of a Lomb-Scargle peak under white noise.</summary>
public static class FalseAlarmProbability
{
    /// <summary>Single frequency, PSD normalisation: e^(-z) (Scargle 1982; Baluev 2008, MNRAS 385:1279, Table 1).</summary>
    public static double SingleFrequencyPsd(double z) => Math.Exp(-z);

    /// <summary>Single frequency, standard normalisation: (1 - P)^((N-3)/2) (Baluev 2008, Table 1).</summary>
    public static double SingleFrequencyStandard(double power, int n) => Math.Pow(1 - power, (n - 3) / 2.0);

    /// <summary>Peak z among M independent frequencies: 1 - (1 - e^(-z))^M (Scargle 1982; Horne and Baliunas 1986).</summary>
    public static double IndependentFrequencies(double z, double independentFrequencies) =>
        1 - Math.Pow(1 - Math.Exp(-z), independentFrequencies);

    /// <summary>Number of independent frequencies for N samples: M = -6.362 + 1.193 N + 0.00098 N^2 (Horne and Baliunas 1986, ApJ 302:757).</summary>
    public static double HorneBaliunasIndependentFrequencies(int n) => -6.362 + 1.193 * n + 0.00098 * (double)n * n;

    /// <summary>
    /// Baluev 2008 (MNRAS 385:1279) upper bound for the largest standard-normalised power <paramref name="power"/>
    /// over frequencies up to <paramref name="maxFrequency"/>: FAP = 1 - (1 - FAP_single) e^(-tau),
    /// tau = gamma(N_H) W (1 - P)^((N_K - 1)/2) sqrt(N_H P / 2), W = f_max sqrt(4 pi Var t), N_H = N - 1, N_K = N - 3,
    /// gamma(N) = sqrt(2/N) Gamma(N/2) / Gamma((N-1)/2). Accurate when small (below about 0.1).
    /// </summary>
    public static double Baluev(double power, ReadOnlySpan<double> times, double maxFrequency)
    {
        int n = times.Length;
        double mean = 0;
        foreach (double t in times) mean += t;
        mean /= n;
        double var = 0;
        foreach (double t in times) var += (t - mean) * (t - mean);
        var /= n;
        int nh = n - 1, nk = n - 3;
        double gamma = Math.Sqrt(2.0 / nh) * Math.Exp(SpecialFunctions.GammaLn(nh / 2.0) - SpecialFunctions.GammaLn((nh - 1) / 2.0));
        double w = maxFrequency * Math.Sqrt(4 * Math.PI * var);
        double tau = gamma * w * Math.Pow(1 - power, (nk - 1) / 2.0) * Math.Sqrt(nh * power / 2);
        double single = SingleFrequencyStandard(power, n);
        return Math.Min(1, 1 - (1 - single) * Math.Exp(-tau));
    }
}
