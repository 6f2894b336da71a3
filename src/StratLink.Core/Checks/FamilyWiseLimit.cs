using MathNet.Numerics.Distributions;

namespace StratLink.Checks;

/// <summary>
/// A limit for the worst of many comparisons. A check that reports the largest of m misfits against
/// k standard uncertainties warns, on consistent data, far more often than one comparison at k would:
/// with m independent normal misfits, 1 - (1 - a)^m for a = P(|Z| > k). The Šidák (1967) limit keeps
/// the family's rate at that of one comparison. Misfits along a core are strongly autocorrelated, so m
/// is their effective number, n / (1 + 2 sum_k (1 - k/n) r_k) for autocorrelations r_k (Bretherton
/// et al. 1999, J. Climate 12, from memory), the sum stopped at the first lag whose autocorrelation is
/// not positive (common practice). The whole sum, not the lag-1 value alone, because a misfit between
/// two alignments is a smooth departure plus grid-step jitter: the jitter makes neighbours look
/// independent while the departures that reach the limit span many points.
/// </summary>
internal static class FamilyWiseLimit
{
    /// <summary>
    /// Effective number of independent values in a series read at even spacing, from 1 (one smooth
    /// departure, or a constant) to n (white noise); 0 for an empty series.
    /// </summary>
    public static double EffectiveCount(IReadOnlyList<double> evenlySpaced)
    {
        int n = evenlySpaced.Count;
        if (n < 3) return n;
        double mean = evenlySpaced.Average();
        var d = new double[n];
        double c0 = 0, scale = 0;
        for (int i = 0; i < n; i++)
        {
            d[i] = evenlySpaced[i] - mean;
            c0 += d[i] * d[i];
            scale = Math.Max(scale, Math.Abs(evenlySpaced[i]));
        }
        // A constant series (consistent alignments agreeing to rounding) is one value repeated.
        if (!(Math.Sqrt(c0 / n) > 1e-9 * Math.Max(1, scale))) return 1;
        double sum = 0;
        for (int lag = 1; lag < n; lag++)
        {
            double c = 0;
            for (int i = lag; i < n; i++) c += d[i] * d[i - lag];
            double r = c / c0;
            if (r <= 0) break;
            sum += (1 - (double)lag / n) * r;
        }
        return Math.Clamp(n / (1 + 2 * sum), 1, n);
    }

    /// <summary>
    /// Standard uncertainties the worst of <paramref name="effectiveCount"/> independent two-sided
    /// comparisons may reach so that the family is exceeded as rarely as one comparison at
    /// <paramref name="perComparison"/>; <paramref name="perComparison"/> itself for one comparison or fewer.
    /// </summary>
    public static double Sigmas(double perComparison, double effectiveCount)
    {
        if (!(effectiveCount > 1)) return perComparison;
        double alpha = 2 * Normal.CDF(0, 1, -perComparison);
        // 1 - (1 - alpha)^(1/m), without cancellation for small alpha.
        double each = -double.ExpM1(double.LogP1(-alpha) / effectiveCount);
        return -Normal.InvCDF(0, 1, each / 2);
    }
}
