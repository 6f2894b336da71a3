using StratLink.Tables;

namespace StratLink.Alignment;

/// <summary>
/// Aligns two series directly by dynamic time warping with the Euclidean local cost between rows
/// (no resampling, no standardisation): the engine behind the <c>pair</c> command, and the form
/// checked against the R package dtw and mlpy.
/// </summary>
public static class PairAligner
{
    public static PairResult Align(double[] a, double[] b, PairOptions options, CancellationToken ct = default)
    {
        CheckFinite(a, "A", null);
        CheckFinite(b, "B", null);
        return Run(new AbsoluteCost(a, b), a.Length, b.Length, options, ct);
    }

    /// <summary>Multi-signal series: rows are samples, columns signals (the same number in both).</summary>
    public static PairResult Align(double[,] a, double[,] b, PairOptions options, CancellationToken ct = default)
    {
        int dims = a.GetLength(1);
        if (b.GetLength(1) != dims) throw new ArgumentException($"Series A has {dims} signals and series B {b.GetLength(1)}; they need the same signals.");
        var fa = RowMajor(a);
        var fb = RowMajor(b);
        CheckFinite(fa, "A", dims);
        CheckFinite(fb, "B", dims);
        return Run(new EuclideanCost(fa, fb, dims), a.GetLength(0), b.GetLength(0), options, ct);
    }

    /// <summary>Two core tables on the named signals (every sample used as it is, in depth order).</summary>
    public static PairResult Align(CoreTable a, CoreTable b, IReadOnlyList<string> signals, PairOptions options, CancellationToken ct = default)
    {
        if (signals.Count == 0) throw new ArgumentException("Name at least one signal to align on.");
        return Align(Matrix(a, signals), Matrix(b, signals), options, ct);
    }

    private static double[,] Matrix(CoreTable t, IReadOnlyList<string> signals)
    {
        var m = new double[t.Count, signals.Count];
        for (int k = 0; k < signals.Count; k++)
        {
            if (!t.Signals.TryGetValue(signals[k], out var col))
                throw new ArgumentException($"{t.SourceFile ?? t.CoreId}: no signal column '{signals[k]}' (columns: {string.Join(", ", t.SignalNames)}).");
            for (int r = 0; r < t.Count; r++)
            {
                if (!double.IsFinite(col[r]))
                {
                    string line = t.SourceLines is { } lines ? $" line {lines[r]}," : "";
                    throw new ArgumentException($"{t.SourceFile ?? t.CoreId}:{line} signal '{signals[k]}' has no value at depth {t.Depths[r].ToString(System.Globalization.CultureInfo.InvariantCulture)}; a direct alignment needs every value.");
                }
                m[r, k] = col[r];
            }
        }
        return m;
    }

    private static PairResult Run<TCost>(TCost cost, int n, int m, PairOptions options, CancellationToken ct) where TCost : struct, ILocalCost
    {
        if (n == 0 || m == 0) throw new ArgumentException("Both series need at least one sample.");
        var band = options.Window is int w
            ? (w < 0 ? throw new ArgumentException("The window cannot be negative.") : Band.SakoeChiba(n, m, w))
            : Band.Full(n, m);
        if (options.Window is int ww && !options.OpenEnd && !options.OpenBegin && Math.Abs(n - m) > ww)
            throw new ArgumentException($"No warping path exists: the series differ in length by {Math.Abs(n - m)} samples, more than the window of {ww}.");
        var dtwOptions = new DtwOptions { OpenBegin = options.OpenBegin, OpenEnd = options.OpenEnd };
        return new PairResult(DtwSolver.Solve(cost, options.Pattern, band, dtwOptions, ct), options.Pattern);
    }

    private static double[] RowMajor(double[,] x)
    {
        int n = x.GetLength(0), d = x.GetLength(1);
        var f = new double[n * d];
        for (int i = 0; i < n; i++)
            for (int k = 0; k < d; k++) f[i * d + k] = x[i, k];
        return f;
    }

    private static void CheckFinite(double[] x, string name, int? dims)
    {
        for (int k = 0; k < x.Length; k++)
            if (!double.IsFinite(x[k]))
                throw new ArgumentException($"Series {name} has a missing or infinite value at row {(dims is int d ? k / d : k) + 1}; a direct alignment needs every value.");
    }
}
