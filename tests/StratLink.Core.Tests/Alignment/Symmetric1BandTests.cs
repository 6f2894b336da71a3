using StratLink.Alignment;

namespace StratLink.Tests.Alignment;

/// <summary>
/// The symmetric1 solver (rows processed in skewed strips) against the textbook recurrence written
/// out cell by cell on a full n x m matrix: g(i,j) = d(i,j) + min(g(i-1,j-1), g(i,j-1), g(i-1,j)),
/// g(0,0) = d(0,0), cells outside the band +inf, ties to the first of diagonal, left, up (Sakoe and
/// Chiba 1978; the order of Giorgino 2009, R package dtw). Random walks have no exact ties, so paths
/// must be identical; distances agree to 1e-12 relative (the same additions in the same order).
/// Sizes cover strips with rows left over and bands whose rows start and end at different columns.
/// </summary>
public class Symmetric1BandTests
{
    private static (double Distance, List<(int I, int J)> Path) Textbook(double[] x, double[] y, Band band)
    {
        int n = x.Length, m = y.Length;
        var g = new double[n, m];
        for (int i = 0; i < n; i++)
            for (int j = 0; j < m; j++)
            {
                if (!band.Contains(i, j)) { g[i, j] = double.PositiveInfinity; continue; }
                double d = Math.Abs(x[i] - y[j]);
                if (i == 0 && j == 0) { g[i, j] = d; continue; }
                double diag = i > 0 && j > 0 ? g[i - 1, j - 1] : double.PositiveInfinity;
                double left = j > 0 ? g[i, j - 1] : double.PositiveInfinity;
                double up = i > 0 ? g[i - 1, j] : double.PositiveInfinity;
                g[i, j] = Math.Min(diag, Math.Min(left, up)) + d;
            }
        var path = new List<(int, int)>();
        int a = n - 1, b = m - 1;
        path.Add((a, b));
        while (a > 0 || b > 0)
        {
            double diag = a > 0 && b > 0 ? g[a - 1, b - 1] : double.PositiveInfinity;
            double left = b > 0 ? g[a, b - 1] : double.PositiveInfinity;
            double up = a > 0 ? g[a - 1, b] : double.PositiveInfinity;
            if (diag <= left && diag <= up) { a--; b--; }
            else if (left <= up) b--;
            else a--;
            path.Add((a, b));
        }
        path.Reverse();
        return (g[n - 1, m - 1], path);
    }

    /// <summary>A band of uneven width around the diagonal, every row joined to the next.</summary>
    private static Band Ragged(Random rng, int n, int m)
    {
        var lo = new int[n];
        var hi = new int[n];
        for (int i = 0; i < n; i++)
        {
            int c = n == 1 ? 0 : (int)Math.Round((double)i * (m - 1) / (n - 1));
            lo[i] = Math.Max(0, c - rng.Next(0, 6));
            hi[i] = Math.Min(m - 1, c + rng.Next(0, 6));
            if (i > 0) lo[i] = Math.Min(lo[i], hi[i - 1] + 1);
        }
        lo[0] = 0;
        hi[n - 1] = m - 1;
        for (int i = n - 2; i >= 0; i--) hi[i] = Math.Max(hi[i], lo[i + 1] - 1);
        return new Band(m, lo, hi);
    }

    [Theory]
    [InlineData(1, 1)]
    [InlineData(1, 9)]
    [InlineData(9, 1)]
    [InlineData(5, 5)]
    [InlineData(6, 11)]
    [InlineData(13, 7)]
    [InlineData(57, 61)]
    [InlineData(203, 190)]
    public void StripsMatchTheTextbookRecurrence(int n, int m)
    {
        var rng = new Random(n * 1000 + m);
        var x = RandomWalks.Walk(rng, n);
        var y = RandomWalks.Walk(rng, m);
        var bands = new List<Band> { Band.Full(n, m), Ragged(rng, n, m) };
        foreach (int w in new[] { 0, 1, 3, 10 })
            if (Math.Abs(n - m) <= w) bands.Add(Band.SakoeChiba(n, m, w));
        foreach (var band in bands)
        {
            var (distance, path) = Textbook(x, y, band);
            var ours = DtwSolver.Solve(new AbsoluteCost(x, y), StepPattern.Symmetric1, band, DtwOptions.Default);
            Assert.Equal(distance, ours.Distance, Math.Max(distance, 1) * 1e-12);
            Assert.Equal(path.Select(p => p.I), ours.I);
            Assert.Equal(path.Select(p => p.J), ours.J);
        }
    }
}
