namespace StratLink.Analysis;

/// <summary>
/// A record on an age axis ready for analysis: missing values dropped and samples ordered forward in
/// time (oldest first, ages in years cal BP decreasing). Forward order is what the sequential regime
/// test needs; the spectral methods do not care, but share the order so indices agree everywhere.
/// </summary>
public sealed class AgeSeries
{
    private AgeSeries(double[] agesBP, double[] values, int[] sourceIndex)
    {
        AgesBP = agesBP;
        Values = values;
        SourceIndex = sourceIndex;
        TimesForward = new double[agesBP.Length];
        for (int i = 0; i < agesBP.Length; i++) TimesForward[i] = -agesBP[i];
    }

    /// <summary>Ages, years cal BP, oldest first (non-increasing).</summary>
    public double[] AgesBP { get; }

    /// <summary>Values aligned with <see cref="AgesBP"/>, none missing.</summary>
    public double[] Values { get; }

    /// <summary>Time in years increasing forward (= -age BP), aligned with <see cref="AgesBP"/>.</summary>
    public double[] TimesForward { get; }

    /// <summary>Index of each sample in the arrays the series was built from.</summary>
    public int[] SourceIndex { get; }

    public int Count => Values.Length;

    /// <summary>Years from the oldest to the youngest sample.</summary>
    public double SpanYears => Count == 0 ? 0 : AgesBP[0] - AgesBP[^1];

    /// <summary>Mean spacing between consecutive samples, years.</summary>
    public double MeanSpacingYears => Count < 2 ? double.NaN : SpanYears / (Count - 1);

    /// <summary>Median spacing between consecutive samples, years.</summary>
    public double MedianSpacingYears
    {
        get
        {
            if (Count < 2) return double.NaN;
            var d = new double[Count - 1];
            for (int i = 1; i < Count; i++) d[i - 1] = AgesBP[i - 1] - AgesBP[i];
            Array.Sort(d);
            return Statistics.PercentileSorted(d, 50);
        }
    }

    /// <summary>
    /// Builds a series from ages (years cal BP) and values in any order; pairs with a NaN age or value
    /// are dropped. Equal ages keep their input order.
    /// </summary>
    public static AgeSeries Create(ReadOnlySpan<double> agesBP, ReadOnlySpan<double> values)
    {
        if (agesBP.Length != values.Length)
            throw new ArgumentException($"{agesBP.Length} ages for {values.Length} values.", nameof(values));
        var keep = new List<int>(agesBP.Length);
        for (int i = 0; i < agesBP.Length; i++)
            if (!double.IsNaN(agesBP[i]) && !double.IsNaN(values[i]) && double.IsFinite(agesBP[i]) && double.IsFinite(values[i]))
                keep.Add(i);
        var order = keep.ToArray();
        var keys = new double[order.Length];
        for (int i = 0; i < order.Length; i++) keys[i] = -agesBP[order[i]];
        // Array.Sort is not stable; sort (key, original index) pairs so equal ages keep input order.
        var idx = new int[order.Length];
        for (int i = 0; i < idx.Length; i++) idx[i] = i;
        Array.Sort(idx, (a, b) => keys[a] != keys[b] ? keys[a].CompareTo(keys[b]) : a.CompareTo(b));
        var ages = new double[order.Length];
        var vals = new double[order.Length];
        var src = new int[order.Length];
        for (int i = 0; i < idx.Length; i++)
        {
            int s = order[idx[i]];
            ages[i] = agesBP[s];
            vals[i] = values[s];
            src[i] = s;
        }
        return new AgeSeries(ages, vals, src);
    }
}
