namespace StratLink.Alignment;

/// <summary>|x_i - y_j|: the one-signal Euclidean local cost (R package dtw, mlpy dtw_std).</summary>
public readonly struct AbsoluteCost(double[] x, double[] y) : ILocalCost
{
    public double Cost(int i, int j) => Math.Abs(x[i] - y[j]);
}
