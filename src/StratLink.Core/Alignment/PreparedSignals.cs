namespace StratLink.Alignment;

/// <summary>
/// One core's alignment signals on a uniform depth grid: row-major values (one column per signal,
/// NaN = missing: gaps, disturbed intervals, holes in the record), standardised per core.
/// </summary>
public sealed class PreparedSignals
{
    public PreparedSignals(string coreId, double top, double step, int count, string[] signals, double[] values, double[]? sampleSpacing = null)
    {
        if (values.Length != count * signals.Length) throw new ArgumentException("Values do not fill count x signals.");
        if (sampleSpacing is not null && sampleSpacing.Length != count) throw new ArgumentException("Sample spacing needs one value per row.");
        SampleSpacing = sampleSpacing;
        CoreId = coreId;
        Top = top;
        Step = step;
        Count = count;
        Signals = signals;
        Values = values;
    }

    public string CoreId { get; }

    /// <summary>Depth of grid row 0 in the project unit.</summary>
    public double Top { get; }

    public double Step { get; }
    public int Count { get; }
    public string[] Signals { get; }
    public double[] Values { get; }

    /// <summary>
    /// Per row, the spacing of the measured samples the row was read from (the pair around it, the
    /// coarser over the signals); null where not known. A record sampled more coarsely than the grid
    /// is interpolated onto it, and cannot place a match more finely than its own spacing.
    /// </summary>
    public double[]? SampleSpacing { get; }

    public double DepthAt(int row) => Top + row * Step;

    /// <summary>Grid row nearest to a depth (not clamped).</summary>
    public int RowNearest(double depth) => (int)Math.Round((depth - Top) / Step, MidpointRounding.AwayFromZero);

    public double Value(int row, int signal) => Values[row * Signals.Length + signal];

    /// <summary>The same grid with only the named signals, in that order (missing names give NaN columns).</summary>
    public PreparedSignals Select(IReadOnlyList<string> names)
    {
        var v = new double[Count * names.Count];
        for (int k = 0; k < names.Count; k++)
        {
            int src = Array.IndexOf(Signals, names[k]);
            for (int r = 0; r < Count; r++) v[r * names.Count + k] = src < 0 ? double.NaN : Values[r * Signals.Length + src];
        }
        return new PreparedSignals(CoreId, Top, Step, Count, [.. names], v, SampleSpacing);
    }
}
