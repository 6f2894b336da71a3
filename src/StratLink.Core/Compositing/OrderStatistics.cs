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

    /// <summary>
    /// Moves the k-th smallest value (0-based) to index k, smaller ones before it, larger after: the selection of
    /// Floyd and Rivest (1975, Comm. ACM 18:173-175, Algorithm 489). Over long ranges it first selects within a small
    /// sample around the expected place of rank k, so the pivot lands next to the answer and a pass or two settle it
    /// (about n + min(k, n - k) comparisons against Hoare's 2n to 3.4n). The value found is the order statistic
    /// itself, so any correct selection returns the same one to the bit.
    /// </summary>
    private static double Select(Span<double> v, int k) => FloydRivest(v, 0, v.Length - 1, k);

    private static double FloydRivest(Span<double> v, int left, int right, int k)
    {
        while (right > left)
        {
            if (right - left > SampleAbove)
            {
                // Constants of the published algorithm: a sample of about n^(2/3) values, its bounds half a
                // standard deviation of the sample rank beyond the place k is expected at.
                double n = right - left + 1, i = k - left + 1, z = Math.Log(n);
                double s = 0.5 * Math.Exp(2 * z / 3), sd = 0.5 * Math.Sqrt(z * s * (n - s) / n) * Math.Sign(i - n / 2);
                int newLeft = Math.Max(left, (int)(k - i * s / n + sd));
                int newRight = Math.Min(right, (int)(k + (n - i) * s / n + sd));
                FloydRivest(v, newLeft, newRight, k);
            }
            double t = v[k];
            int a = left, b = right;
            (v[left], v[k]) = (v[k], v[left]);
            if (v[right] > t) (v[right], v[left]) = (v[left], v[right]);
            while (a < b)
            {
                (v[a], v[b]) = (v[b], v[a]);
                a++;
                b--;
                while (v[a] < t) a++;
                while (v[b] > t) b--;
            }
            if (v[left] == t) (v[left], v[b]) = (v[b], v[left]);
            else
            {
                b++;
                (v[b], v[right]) = (v[right], v[b]);
            }
            if (b <= k) left = b + 1;
            if (k <= b) right = b - 1;
        }
        return v[k];
    }

    /// <summary>Ranges longer than this select a sample first (600 in the published algorithm).</summary>
    private const int SampleAbove = 600;
}
