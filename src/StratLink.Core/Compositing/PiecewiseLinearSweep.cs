namespace StratLink.Compositing;

/// <summary>
/// Evaluates a monotone piecewise-linear function (the knots of a depth mapping) at many ascending
/// points with one linear pass over the knots instead of a binary search per point. The result is
/// identical to <see cref="Alignment.DepthMapping"/>'s own evaluation: the segment used is the last
/// one starting at or before x, flat segments return their start value, and beyond the ends the
/// nearest segment with length extends outwards (the end slope).
/// </summary>
internal static class PiecewiseLinearSweep
{
    /// <param name="xs">Knot abscissae, non-decreasing.</param>
    /// <param name="ys">Knot ordinates, same length.</param>
    /// <param name="xAscending">Points to evaluate, non-decreasing.</param>
    /// <param name="result">Receives one value per point.</param>
    public static void EvaluateAscending(IReadOnlyList<double> xs, IReadOnlyList<double> ys, ReadOnlySpan<double> xAscending, Span<double> result)
    {
        // The mapping knots are arrays in practice; index them directly in the hot loop.
        double[] x = xs as double[] ?? [.. xs];
        double[] y = ys as double[] ?? [.. ys];
        int n = x.Length;
        if (xAscending.Length == 0) return;
        if (n == 1)
        {
            for (int k = 0; k < xAscending.Length; k++) result[k] = y[0] + (xAscending[k] - x[0]);
            return;
        }
        int first = FirstProper(x), last = LastProper(x);
        // Start at the last knot at or before the first point (one search per call, then a sweep).
        int i = LastAtOrBefore(x, xAscending[0]);
        for (int k = 0; k < xAscending.Length; k++)
        {
            double v = xAscending[k];
            int seg;
            if (v <= x[0]) seg = first;
            else if (v >= x[n - 1]) seg = last;
            else
            {
                while (x[i + 1] <= v) i++;
                seg = i;
            }
            double dx = x[seg + 1] - x[seg];
            result[k] = dx <= 0 ? y[seg] : y[seg] + (y[seg + 1] - y[seg]) * (v - x[seg]) / dx;
        }
    }

    private static int LastAtOrBefore(double[] x, double v)
    {
        int lo = 0, hi = x.Length - 1;
        if (v < x[0]) return 0;
        if (v >= x[hi]) return Math.Max(0, hi - 1);
        while (hi - lo > 1)
        {
            int mid = (lo + hi) >>> 1;
            if (x[mid] <= v) lo = mid; else hi = mid;
        }
        return lo;
    }

    private static int FirstProper(double[] x)
    {
        for (int i = 0; i < x.Length - 1; i++) if (x[i + 1] > x[i]) return i;
        return 0;
    }

    private static int LastProper(double[] x)
    {
        for (int i = x.Length - 2; i >= 0; i--) if (x[i + 1] > x[i]) return i;
        return Math.Max(0, x.Length - 2);
    }
}
