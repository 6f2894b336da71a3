namespace StratLink.Alignment;

/// <summary>
/// The modes of an ensemble's values at one depth, and the median of the one holding a given value.
/// The members' density is a Gaussian kernel estimate at Silverman's rule-of-thumb bandwidth
/// h = 0.9 min(sd, IQR / 1.34) n^-1/5 (Silverman 1986, Density Estimation, eq. 3.31), binned on a
/// grid of h / 4 (linear binning); its local maxima are the modes and the minima between them split
/// the members into basins (Silverman's 1981 bump hunting counts modes so; from memory). Two
/// neighbouring basins count as separate modes only where each holds at least
/// <see cref="MinShare"/> of the members and the density between them falls to at most
/// <see cref="MaxDip"/> of the lower peak (both our choice: a clear dip between two substantial
/// placements, not the ripples a few hundred draws give a single one); otherwise they are merged.
/// </summary>
internal static class PosteriorModes
{
    public const double MinShare = 0.2;
    public const double MaxDip = 0.5;
    private const int MinMembers = 20;
    private const int MaxGrid = 1024;

    /// <summary>
    /// The median of the members in the mode holding <paramref name="x"/>; the plain median where the
    /// members form one mode. <paramref name="sorted"/> is ascending.
    /// </summary>
    public static double MedianOfModeHolding(ReadOnlySpan<double> sorted, double x)
    {
        int n = sorted.Length;
        double median = Statistics.PercentileSorted(sorted, 50);
        if (n < MinMembers || double.IsNaN(x)) return median;
        double mean = 0;
        foreach (double v in sorted) mean += v;
        mean /= n;
        double ss = 0;
        foreach (double v in sorted) ss += (v - mean) * (v - mean);
        double sd = Math.Sqrt(ss / (n - 1));
        double iqr = Statistics.PercentileSorted(sorted, 75) - Statistics.PercentileSorted(sorted, 25);
        double spread = iqr > 0 ? Math.Min(sd, iqr / 1.34) : sd;
        double h = 0.9 * spread * Math.Pow(n, -0.2);
        if (!(h > 0)) return median;
        double dx = h / 4;
        double lo = sorted[0], range = sorted[n - 1] - lo;
        int grid = (int)Math.Ceiling(range / dx) + 1;
        if (grid < 3) return median;
        if (grid > MaxGrid) { grid = MaxGrid; dx = range / (grid - 1); }
        var counts = new double[grid];
        foreach (double v in sorted)
        {
            double p = (v - lo) / dx;
            int k = Math.Min(grid - 2, (int)p);
            double f = p - k;
            counts[k] += 1 - f;
            counts[k + 1] += f;
        }
        int taps = (int)Math.Ceiling(4 * h / dx);
        var kernel = new double[taps + 1];
        for (int t = 0; t <= taps; t++) kernel[t] = Math.Exp(-0.5 * (t * dx / h) * (t * dx / h));
        var density = new double[grid];
        for (int g = 0; g < grid; g++)
        {
            if (counts[g] == 0) continue;
            for (int t = Math.Max(0, g - taps); t <= Math.Min(grid - 1, g + taps); t++) density[t] += counts[g] * kernel[Math.Abs(t - g)];
        }
        // Peaks and the lowest point between each neighbouring pair.
        var peaks = new List<int>();
        for (int g = 0; g < grid; g++)
            if ((g == 0 || density[g] > density[g - 1]) && (g == grid - 1 || density[g] >= density[g + 1])) peaks.Add(g);
        if (peaks.Count < 2) return median;
        var dips = new List<int>();
        for (int p = 0; p + 1 < peaks.Count; p++)
        {
            int a = peaks[p];
            for (int g = peaks[p] + 1; g < peaks[p + 1]; g++) if (density[g] < density[a]) a = g;
            dips.Add(a);
        }
        // Merge the least distinct neighbouring pair until every remaining pair is two modes.
        while (dips.Count > 0)
        {
            int worst = -1;
            double worstScore = double.NegativeInfinity;
            for (int d = 0; d < dips.Count; d++)
            {
                double lower = Math.Min(density[peaks[d]], density[peaks[d + 1]]);
                double dip = density[dips[d]] / lower;
                double left = Share(sorted, lo, dx, d == 0 ? -1 : dips[d - 1], dips[d]);
                double right = Share(sorted, lo, dx, dips[d], d + 1 < dips.Count ? dips[d + 1] : grid);
                bool distinct = dip <= MaxDip && left >= MinShare && right >= MinShare;
                double score = distinct ? double.NegativeInfinity : dip - Math.Min(left, right);
                if (score > worstScore) { worstScore = score; worst = d; }
            }
            if (double.IsNegativeInfinity(worstScore)) break;
            // The merged mode's peak is the higher of the two.
            if (density[peaks[worst]] < density[peaks[worst + 1]]) peaks.RemoveAt(worst);
            else peaks.RemoveAt(worst + 1);
            dips.RemoveAt(worst);
        }
        if (dips.Count == 0) return median;
        double at = (x - lo) / dx;
        int from = -1, to = grid;
        foreach (int d in dips)
        {
            if (d < at) from = d;
            else { to = d; break; }
        }
        var basin = new List<double>();
        foreach (double v in sorted)
        {
            double p = (v - lo) / dx;
            if (p > from && p <= to) basin.Add(v);
        }
        return basin.Count > 0 ? Statistics.PercentileSorted(basin.ToArray(), 50) : median;
    }

    /// <summary>Share of the members between grid points <paramref name="from"/> (exclusive) and <paramref name="to"/> (inclusive).</summary>
    private static double Share(ReadOnlySpan<double> sorted, double lo, double dx, int from, int to)
    {
        int c = 0;
        foreach (double v in sorted)
        {
            double p = (v - lo) / dx;
            if (p > from && p <= to) c++;
        }
        return (double)c / sorted.Length;
    }
}
