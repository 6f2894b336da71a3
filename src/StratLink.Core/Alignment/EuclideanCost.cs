namespace StratLink.Alignment;

/// <summary>
/// Euclidean distance between rows of two matrices stored row-major with <c>dims</c> columns:
/// sqrt of the sum of squared differences, not squared (the R package dtw's default through proxy::dist).
/// </summary>
public readonly struct EuclideanCost(double[] x, double[] y, int dims) : ILocalCost
{
    public double Cost(int i, int j)
    {
        double s = 0;
        int a = i * dims, b = j * dims;
        for (int k = 0; k < dims; k++)
        {
            double d = x[a + k] - y[b + k];
            s += d * d;
        }
        return Math.Sqrt(s);
    }

    public void Row(int i, int j0, Span<double> into)
    {
        for (int k = 0; k < into.Length; k++) into[k] = Cost(i, j0 + k);
    }
}
