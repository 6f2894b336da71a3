namespace StratLink.Compositing;

/// <summary>
/// Percentiles of unsorted values by selection (expected linear time), giving exactly the value of
/// <see cref="Statistics.PercentileSorted"/> (Hyndman and Fan 1996 type 7) without a full sort:
/// pooled stacks take two percentiles of hundreds of values at every composite depth.
/// </summary>
internal static class OrderStatistics
{
    /// <summary>Type-7 percentile (0-100) of <paramref name="values"/>; reorders the span. NaN when empty.</summary>
    public static double PercentileInPlace(Span<double> values, double percent)
    {
        int n = values.Length;
        if (n == 0) return double.NaN;
        double h = (n - 1) * percent / 100.0;
        int lo = (int)Math.Floor(h);
        double a = Select(values, lo);
        if (lo + 1 >= n || h == lo) return a;
        // After selection everything right of lo is >= a; the next order statistic is their minimum.
        double b = double.PositiveInfinity;
        for (int i = lo + 1; i < n; i++) if (values[i] < b) b = values[i];
        return a + (h - lo) * (b - a);
    }

    /// <summary>
    /// Puts the order statistic of every rank in <paramref name="ranks"/> (0-based, ascending, distinct) at its index:
    /// the middle rank is selected first and the others sought only in the part on their side of it.
    /// </summary>
    public static void SelectRanks(Span<double> values, ReadOnlySpan<int> ranks)
    {
        if (ranks.IsEmpty) return;
        int m = ranks.Length / 2, pivot = ranks[m];
        Select(values, pivot);
        SelectRanks(values[..pivot], ranks[..m]);
        var above = ranks[(m + 1)..];
        if (above.IsEmpty) return;
        Span<int> shifted = stackalloc int[above.Length];
        for (int r = 0; r < above.Length; r++) shifted[r] = above[r] - pivot - 1;
        SelectRanks(values[(pivot + 1)..], shifted);
    }

    /// <summary>Moves the k-th smallest value (0-based) to index k, smaller ones before it, larger after (Hoare's selection).</summary>
    private static double Select(Span<double> v, int k)
    {
        int left = 0, right = v.Length - 1;
        while (right > left)
        {
            // Median of three as pivot keeps sorted and constant runs from degrading; deterministic.
            int mid = left + ((right - left) >> 1);
            double pivot = MedianOf3(v[left], v[mid], v[right]);
            int i = left, j = right;
            while (i <= j)
            {
                while (v[i] < pivot) i++;
                while (v[j] > pivot) j--;
                if (i <= j)
                {
                    (v[i], v[j]) = (v[j], v[i]);
                    i++;
                    j--;
                }
            }
            if (k <= j) right = j;
            else if (k >= i) left = i;
            else return v[k];
        }
        return v[k];
    }

    private static double MedianOf3(double a, double b, double c) =>
        a < b ? (b < c ? b : Math.Max(a, c)) : (a < c ? a : Math.Max(b, c));
}
