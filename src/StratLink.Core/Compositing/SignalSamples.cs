namespace StratLink.Compositing;

/// <summary>
/// One signal of one core reduced to the samples that may contribute to a composite: present
/// (not NaN) and outside gaps and disturbed intervals, optionally standardised. Values between
/// samples are interpolated linearly; nothing is invented beyond the end samples, inside an
/// unusable interval, or across a run of missing samples wider than <see cref="MaxBridge"/>.
/// </summary>
internal sealed class SignalSamples
{
    public SignalSamples(string signal, double[] depths, double[] values, double maxBridge, double centre, double scale)
    {
        Signal = signal;
        Depths = depths;
        Values = values;
        MaxBridge = maxBridge;
        Centre = centre;
        Scale = scale;
    }

    public string Signal { get; }
    public double[] Depths { get; }

    /// <summary>Values already centred and scaled (identity when not standardised).</summary>
    public double[] Values { get; }

    /// <summary>Widest spacing of two neighbouring usable samples that is still interpolated across.</summary>
    public double MaxBridge { get; }

    /// <summary>Mean subtracted before scaling (0 when not standardised).</summary>
    public double Centre { get; }

    /// <summary>Divisor after centring (1 when not standardised).</summary>
    public double Scale { get; }

    /// <summary>Values at non-decreasing core depths (NaN where there is no value), in one pass.</summary>
    public void SampleAscending(ReadOnlySpan<double> coreDepths, Span<double> result, UnusableIntervals unusable)
    {
        var cursor = unusable.Start();
        var x = Depths;
        var y = Values;
        int n = x.Length;
        // One search places the sweep at the first depth; the rest of the pass only moves forward.
        int i = coreDepths.Length > 0 ? LastAtOrBefore(x, coreDepths[0]) : 0;
        for (int k = 0; k < coreDepths.Length; k++)
        {
            double d = coreDepths[k];
            if (n == 0 || d < x[0] || d > x[n - 1] || cursor.IsUnusable(d))
            {
                result[k] = double.NaN;
                continue;
            }
            while (i < n - 1 && x[i + 1] <= d) i++;
            if (x[i] == d || i == n - 1) { result[k] = y[i]; continue; }
            double dx = x[i + 1] - x[i];
            result[k] = dx > MaxBridge ? double.NaN : y[i] + (y[i + 1] - y[i]) * (d - x[i]) / dx;
        }
    }

    private static int LastAtOrBefore(double[] x, double d)
    {
        int k = Array.BinarySearch(x, d);
        if (k >= 0) return k;
        return Math.Max(0, ~k - 1);
    }
}
