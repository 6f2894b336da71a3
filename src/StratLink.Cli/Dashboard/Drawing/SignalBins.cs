namespace StratLink.Cli.Dashboard.Drawing;

/// <summary>
/// Minimum and maximum of a signal in each dot row of a depth window. One pass over the samples
/// in the window fills the bins, so drawing stays proportional to rows x columns however dense
/// the core table is.
/// </summary>
public sealed class SignalBins
{
    private SignalBins(double[] min, double[] max)
    {
        Min = min;
        Max = max;
    }

    /// <summary>Smallest value in each dot row; NaN where the row holds no sample.</summary>
    public double[] Min { get; }

    /// <summary>Largest value in each dot row; NaN where the row holds no sample.</summary>
    public double[] Max { get; }

    public int Count => Min.Length;

    /// <summary>
    /// Bins samples with depths in [top, top + binCount * binDepth). <paramref name="depths"/> must
    /// increase (as core tables guarantee); missing values (NaN) are skipped.
    /// </summary>
    public static SignalBins FromSorted(double[] depths, double[] values, double top, double binDepth, int binCount)
    {
        var min = new double[binCount];
        var max = new double[binCount];
        Array.Fill(min, double.NaN);
        Array.Fill(max, double.NaN);
        if (binCount == 0 || !(binDepth > 0) || depths.Length == 0) return new SignalBins(min, max);
        double bottom = top + binCount * binDepth;
        int i = LowerBound(depths, top);
        for (; i < depths.Length && depths[i] < bottom; i++)
        {
            double v = values[i];
            if (double.IsNaN(v)) continue;
            int b = Math.Min(binCount - 1, (int)((depths[i] - top) / binDepth));
            if (double.IsNaN(min[b]) || v < min[b]) min[b] = v;
            if (double.IsNaN(max[b]) || v > max[b]) max[b] = v;
        }
        return new SignalBins(min, max);
    }

    /// <summary>First index whose depth is at or below <paramref name="depth"/> (binary search).</summary>
    public static int LowerBound(double[] sorted, double depth)
    {
        int lo = 0, hi = sorted.Length;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (sorted[mid] < depth) lo = mid + 1; else hi = mid;
        }
        return lo;
    }

    /// <summary>Index of the sample nearest to <paramref name="depth"/>, or -1 when none lies within <paramref name="tolerance"/>.</summary>
    public static int NearestSorted(double[] sorted, double depth, double tolerance)
    {
        if (sorted.Length == 0) return -1;
        int i = LowerBound(sorted, depth);
        int best = -1;
        double bestDistance = double.PositiveInfinity;
        foreach (int j in new[] { i - 1, i })
        {
            if (j < 0 || j >= sorted.Length) continue;
            double d = Math.Abs(sorted[j] - depth);
            if (d < bestDistance) { bestDistance = d; best = j; }
        }
        return bestDistance <= tolerance ? best : -1;
    }
}
