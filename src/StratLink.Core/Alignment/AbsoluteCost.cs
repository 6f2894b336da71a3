using System.Numerics;

namespace StratLink.Alignment;

/// <summary>|x_i - y_j|: the one-signal Euclidean local cost (R package dtw, mlpy dtw_std).</summary>
public readonly struct AbsoluteCost(double[] x, double[] y) : ILocalCost
{
    public double Cost(int i, int j) => Math.Abs(x[i] - y[j]);

    public void Row(int i, int j0, Span<double> into)
    {
        double xi = x[i];
        var ys = y.AsSpan(j0, into.Length);
        int k = 0;
        if (Vector.IsHardwareAccelerated)
        {
            var vx = new Vector<double>(xi);
            for (; k <= into.Length - Vector<double>.Count; k += Vector<double>.Count)
                Vector.Abs(vx - new Vector<double>(ys[k..])).CopyTo(into[k..]);
        }
        for (; k < into.Length; k++) into[k] = Math.Abs(xi - ys[k]);
    }
}
