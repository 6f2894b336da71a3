using StratLink.Model;
using StratLink.Quantities;
using StratLink.Tables;

namespace StratLink.Alignment;

/// <summary>
/// Turns a core table into alignment signals: linear resampling onto a uniform grid, gaps and
/// disturbed intervals left missing (never interpolated across), optional linear detrend and
/// derivative form, then standardisation per core.
/// </summary>
public static class SignalPreparation
{
    /// <summary>
    /// Samples further apart than this many grid steps (or median spacings) are a hole, not
    /// interpolated: one missing sample is bridged, a longer run is not. Values interpolated across a
    /// hole are not measurements, yet the path would match them as evidence (a straight ramp fits a
    /// stretch of almost anything); left missing, the hole costs the neutral level and the path crosses
    /// it at the local mean rate. The same rule as the stacks' (<c>CompositeCore.BridgeSpacings</c>).
    /// </summary>
    private const double MaxBridge = 2.5;

    public static double MedianSpacing(double[] depths)
    {
        if (depths.Length < 2) return double.NaN;
        var d = new double[depths.Length - 1];
        for (int i = 0; i < d.Length; i++) d[i] = depths[i + 1] - depths[i];
        Array.Sort(d);
        return Statistics.PercentileSorted(d, 50);
    }

    public static PreparedSignals Prepare(CoreTable table, IReadOnlyList<DepthInterval> unusable, IReadOnlyList<string> signals, double step, AlignmentSettings settings)
    {
        if (!(step > 0)) throw new ArgumentException($"The grid step must be positive (found {step}).");
        if (table.Count < 2) throw new ArgumentException($"Core {table.CoreId} has {table.Count} sample(s); alignment needs at least two.");
        double top = table.Depths[0], bottom = table.Depths[^1];
        int count = (int)Math.Floor((bottom - top) / step + 1e-9) + 1;
        var intervals = unusable.Select(u => (Top: u.Top.In(table.Unit), Bottom: u.Bottom.In(table.Unit))).ToArray();
        double bridge = MaxBridge * Math.Max(step, MedianSpacing(table.Depths));
        int dims = signals.Count;
        var values = new double[count * dims];
        var column = new double[count];
        var spacing = new double[count];
        for (int k = 0; k < dims; k++)
        {
            if (!table.Signals.TryGetValue(signals[k], out var raw)) Array.Fill(column, double.NaN);
            else Resample(table.Depths, raw, intervals, top, step, bridge, column, spacing);
            if (settings.Detrend) Detrend(column);
            if (settings.Derivative) column = Derivative(column);
            Standardise(column, settings.Standardise == StandardiseMethods.Robust);
            for (int r = 0; r < count; r++) values[r * dims + k] = column[r];
        }
        for (int r = 0; r < count; r++) spacing[r] = Math.Max(spacing[r], step);
        return new PreparedSignals(table.CoreId, top, step, count, [.. signals], values, spacing);
    }

    private static bool Unusable((double Top, double Bottom)[] intervals, double depth)
    {
        foreach (var (t, b) in intervals) if (depth >= t && depth <= b) return true;
        return false;
    }

    private static bool Crosses((double Top, double Bottom)[] intervals, double upper, double lower)
    {
        foreach (var (t, b) in intervals) if (t < lower && b > upper) return true;
        return false;
    }

    /// <param name="spacing">Raised, per row, to the spacing of the samples the row is read from.</param>
    private static void Resample(double[] depths, double[] raw, (double Top, double Bottom)[] intervals, double top, double step, double bridge, double[] column, double[] spacing)
    {
        var valid = new List<int>(depths.Length);
        for (int i = 0; i < depths.Length; i++)
            if (double.IsFinite(raw[i]) && !Unusable(intervals, depths[i])) valid.Add(i);
        int p = 0;
        for (int r = 0; r < column.Length; r++)
        {
            double z = top + r * step;
            column[r] = double.NaN;
            if (valid.Count == 0 || Unusable(intervals, z)) continue;
            while (p + 1 < valid.Count && depths[valid[p + 1]] <= z) p++;
            int a = valid[p];
            if (depths[a] == z)
            {
                column[r] = raw[a];
                // A sample on the row stands for the half-spacings to its neighbours on either side.
                double below = p + 1 < valid.Count ? depths[valid[p + 1]] - z : 0, above = p > 0 ? z - depths[valid[p - 1]] : 0;
                spacing[r] = Math.Max(spacing[r], Math.Min(bridge, 0.5 * (above + below)));
                continue;
            }
            if (depths[a] > z || p + 1 >= valid.Count) continue;
            int b = valid[p + 1];
            double za = depths[a], zb = depths[b];
            if (zb - za > bridge || Crosses(intervals, za, zb)) continue;
            column[r] = raw[a] + (raw[b] - raw[a]) * (z - za) / (zb - za);
            spacing[r] = Math.Max(spacing[r], zb - za);
        }
    }

    /// <summary>Least-squares line in grid position removed from the present values.</summary>
    private static void Detrend(double[] v)
    {
        double n = 0, sx = 0, sy = 0, sxx = 0, sxy = 0;
        for (int i = 0; i < v.Length; i++)
        {
            if (double.IsNaN(v[i])) continue;
            n++; sx += i; sy += v[i]; sxx += (double)i * i; sxy += i * v[i];
        }
        double den = n * sxx - sx * sx;
        if (n < 2 || den == 0) return;
        double slope = (n * sxy - sx * sy) / den, icept = (sy - slope * sx) / n;
        for (int i = 0; i < v.Length; i++) v[i] -= icept + slope * i;
    }

    /// <summary>
    /// Keogh and Pazzani (2001) derivative: D_i = ((q_i - q_{i-1}) + (q_{i+1} - q_{i-1}) / 2) / 2,
    /// the end points copying their neighbour; a missing neighbour makes the derivative missing.
    /// </summary>
    internal static double[] Derivative(double[] q)
    {
        int n = q.Length;
        var d = new double[n];
        if (n < 3) { Array.Fill(d, double.NaN); return d; }
        for (int i = 1; i < n - 1; i++) d[i] = ((q[i] - q[i - 1]) + (q[i + 1] - q[i - 1]) / 2) / 2;
        d[0] = d[1];
        d[n - 1] = d[n - 2];
        return d;
    }

    /// <summary>Fewest present values a standardisation window needs per signal; below it the whole-core scaling is kept.</summary>
    internal const int MinStandardiseValues = 10;

    /// <summary>
    /// The same signals standardised again over grid rows first..last only (then applied to every row).
    /// Standardisation is invariant to a prior positive affine scaling, so this equals standardising
    /// the unscaled signal over that window. A signal with fewer than <see cref="MinStandardiseValues"/>
    /// present values in the window keeps its whole-core scaling.
    /// </summary>
    public static PreparedSignals StandardiseOver(PreparedSignals p, int first, int last, bool robust)
    {
        first = Math.Max(0, first);
        last = Math.Min(p.Count - 1, last);
        int dims = p.Signals.Length;
        var values = (double[])p.Values.Clone();
        for (int k = 0; k < dims; k++)
        {
            var window = new List<double>(Math.Max(0, last - first + 1));
            for (int r = first; r <= last; r++)
                if (!double.IsNaN(values[r * dims + k])) window.Add(values[r * dims + k]);
            if (window.Count < MinStandardiseValues) continue;
            var (centre, scale) = Scaling(window.ToArray(), robust);
            for (int r = 0; r < p.Count; r++) values[r * dims + k] = (values[r * dims + k] - centre) / scale;
        }
        return new PreparedSignals(p.CoreId, p.Top, p.Step, p.Count, p.Signals, values, p.SampleSpacing);
    }

    /// <summary>z-score (mean, sample SD) or robust (median, 1.4826 x MAD, consistent with the SD for normal data).</summary>
    private static void Standardise(double[] v, bool robust)
    {
        var present = v.Where(x => !double.IsNaN(x)).ToArray();
        if (present.Length == 0) return;
        var (centre, scale) = Scaling(present, robust);
        for (int i = 0; i < v.Length; i++) v[i] = (v[i] - centre) / scale;
    }

    /// <summary>Centre and scale of present values (sorted in place when robust); a scale of 1 for a constant signal.</summary>
    private static (double Centre, double Scale) Scaling(double[] present, bool robust)
    {
        double centre, scale;
        if (robust)
        {
            Array.Sort(present);
            centre = Statistics.PercentileSorted(present, 50);
            var dev = present.Select(x => Math.Abs(x - centre)).ToArray();
            Array.Sort(dev);
            scale = 1.4826 * Statistics.PercentileSorted(dev, 50);
        }
        else
        {
            centre = present.Average();
            scale = present.Length > 1 ? Math.Sqrt(present.Sum(x => (x - centre) * (x - centre)) / (present.Length - 1)) : 0;
        }
        if (!(scale > 0)) scale = 1; // a constant signal carries no information; centring it is enough
        return (centre, scale);
    }
}
