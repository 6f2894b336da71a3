namespace StratLink;

/// <summary>Small statistics used across the library.</summary>
public static class Statistics
{
    /// <summary>
    /// The standard deviation a 95 % range from <paramref name="lo"/> to <paramref name="hi"/> stands for, were
    /// it normal: half its width over 1.96, the standard normal's 97.5th percentile to the usual two decimals.
    /// </summary>
    public static double SigmaOfRange95(double lo, double hi) => (hi - lo) / (2 * 1.96);

    /// <summary>
    /// Percentile (0-100) of an ascending array by linear interpolation between order statistics
    /// (Hyndman and Fan 1996 type 7, the default of R and numpy).
    /// </summary>
    public static double PercentileSorted(ReadOnlySpan<double> sorted, double percent)
    {
        if (sorted.Length == 0) return double.NaN;
        double h = (sorted.Length - 1) * percent / 100.0;
        int lo = (int)Math.Floor(h);
        int hi = Math.Min(lo + 1, sorted.Length - 1);
        return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
    }
}
