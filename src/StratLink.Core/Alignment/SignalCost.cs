namespace StratLink.Alignment;

/// <summary>
/// Weighted multi-signal local cost between two prepared cores (row-major, one column per signal,
/// NaN = missing): sqrt(sum_k w_k (a_k - b_k)^2 / sum_k w_k) over the signals present on both
/// sides, so one signal of weight 1 gives |a - b| and dropping a signal does not shrink the cost.
/// Where no signal is present on both sides (a gap, a disturbed interval) the cost is the constant
/// <see cref="Neutral"/>: under symmetric2 every monotone path across a constant-cost region
/// costs the same (its weight is the region's extent i + j), so the gap neither attracts nor repels the
/// path; the mapping later crosses such rows in a straight line (the local mean rate).
/// Offsets let a segment of the lattice be solved as a lattice of its own.
/// </summary>
public readonly struct SignalCost : ILocalCost
{
    private readonly double[] _a;
    private readonly double[] _b;
    private readonly double[] _w;
    private readonly int _dims;
    private readonly int _offsetI;
    private readonly int _offsetJ;

    public SignalCost(double[] a, double[] b, double[] weights, double neutral, int offsetI = 0, int offsetJ = 0)
    {
        _a = a;
        _b = b;
        _w = weights;
        _dims = weights.Length;
        Neutral = neutral;
        _offsetI = offsetI;
        _offsetJ = offsetJ;
    }

    public double Neutral { get; }

    /// <summary>The same cost seen from cell (offsetI, offsetJ) as origin (a segment's own lattice).</summary>
    public SignalCost At(int offsetI, int offsetJ) => new(_a, _b, _w, Neutral, offsetI, offsetJ);

    public SignalCost WithNeutral(double neutral) => new(_a, _b, _w, neutral, _offsetI, _offsetJ);

    public double Cost(int i, int j)
    {
        int a = (i + _offsetI) * _dims, b = (j + _offsetJ) * _dims;
        double s = 0, wp = 0;
        for (int k = 0; k < _dims; k++)
        {
            double d = _a[a + k] - _b[b + k];
            if (double.IsNaN(d)) continue;
            s += _w[k] * d * d;
            wp += _w[k];
        }
        return wp > 0 ? Math.Sqrt(s / wp) : Neutral;
    }

    /// <summary>True when no signal is present on both sides of (i, j).</summary>
    public bool IsMissing(int i, int j)
    {
        int a = (i + _offsetI) * _dims, b = (j + _offsetJ) * _dims;
        for (int k = 0; k < _dims; k++)
            if (_w[k] > 0 && !double.IsNaN(_a[a + k] - _b[b + k])) return false;
        return true;
    }

    public void Row(int i, int j0, Span<double> into)
    {
        for (int k = 0; k < into.Length; k++) into[k] = Cost(i, j0 + k);
    }
}
