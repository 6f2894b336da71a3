namespace StratLink.AgeModelling;

/// <summary>
/// Checks and repairs of stratigraphic order (age must not decrease with depth) for points on the
/// composite depth scale. Points at the same depth may have any ages (no order between them).
/// </summary>
internal static class StratigraphicOrder
{
    /// <summary>True when, visiting points by <paramref name="order"/> (ascending depth), no point is younger than one strictly above it.</summary>
    public static bool IsOrdered(ReadOnlySpan<int> order, ReadOnlySpan<double> depths, ReadOnlySpan<double> ages)
    {
        double maxAbove = double.NegativeInfinity;
        int i = 0;
        while (i < order.Length)
        {
            double z = depths[order[i]];
            double groupMax = double.NegativeInfinity;
            int j = i;
            for (; j < order.Length && depths[order[j]] == z; j++)
            {
                double a = ages[order[j]];
                if (a < maxAbove) return false;
                if (a > groupMax) groupMax = a;
            }
            if (groupMax > maxAbove) maxAbove = groupMax;
            i = j;
        }
        return true;
    }

    /// <summary>
    /// Weighted least-squares monotone (non-decreasing) fit of the ages in depth order, by the pool-adjacent-
    /// violators algorithm (Ayer et al. 1955, Ann. Math. Stat. 26:641-647); overwrites <paramref name="ages"/>.
    /// </summary>
    public static void Pool(ReadOnlySpan<int> order, Span<double> ages, ReadOnlySpan<double> weights)
    {
        int n = order.Length;
        var value = new double[n];
        var weight = new double[n];
        var count = new int[n];
        int blocks = 0;
        for (int i = 0; i < n; i++)
        {
            value[blocks] = ages[order[i]];
            weight[blocks] = weights[order[i]];
            count[blocks] = 1;
            blocks++;
            while (blocks > 1 && value[blocks - 2] > value[blocks - 1])
            {
                double w = weight[blocks - 2] + weight[blocks - 1];
                value[blocks - 2] = (value[blocks - 2] * weight[blocks - 2] + value[blocks - 1] * weight[blocks - 1]) / w;
                weight[blocks - 2] = w;
                count[blocks - 2] += count[blocks - 1];
                blocks--;
            }
        }
        int k = 0;
        for (int b = 0; b < blocks; b++)
            for (int c = 0; c < count[b]; c++) ages[order[k++]] = value[b];
    }

    /// <summary>
    /// True when some point of one control is out of order with some point of the other. Each control's points
    /// come sorted by depth with non-decreasing ages (true of every kind of control), so for each point of the
    /// smaller set it suffices to compare with the deepest point strictly above it and the shallowest strictly below.
    /// </summary>
    public static bool Conflict(ReadOnlySpan<double> depthsA, ReadOnlySpan<double> agesA, ReadOnlySpan<double> depthsB, ReadOnlySpan<double> agesB)
    {
        if (depthsA.Length > depthsB.Length) return Conflict(depthsB, agesB, depthsA, agesA);
        for (int q = 0; q < depthsA.Length; q++)
        {
            double z = depthsA[q], a = agesA[q];
            int above = LowerBound(depthsB, z) - 1;
            if (above >= 0 && agesB[above] > a) return true;
            int below = UpperBound(depthsB, z);
            if (below < depthsB.Length && agesB[below] < a) return true;
        }
        return false;
    }

    private static int LowerBound(ReadOnlySpan<double> xs, double x)
    {
        int lo = 0, hi = xs.Length;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (xs[mid] < x) lo = mid + 1; else hi = mid;
        }
        return lo;
    }

    private static int UpperBound(ReadOnlySpan<double> xs, double x)
    {
        int lo = 0, hi = xs.Length;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (xs[mid] <= x) lo = mid + 1; else hi = mid;
        }
        return lo;
    }
}
