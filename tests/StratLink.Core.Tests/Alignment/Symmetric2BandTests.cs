using StratLink.Alignment;

namespace StratLink.Tests.Alignment;

/// <summary>
/// The three-move solver on symmetric2 against the textbook recurrence written out cell by cell on
/// a full n x m matrix: g(i,j) = min(g(i-1,j-1) + 2 d(i,j), g(i,j-1) + d(i,j), g(i-1,j) + d(i,j)),
/// g(0,0) = d(0,0), cells outside the band +inf, ties to the first of diagonal, left, up (Sakoe and
/// Chiba 1978, symmetric form with slope constraint P = 0; the order of Giorgino 2009, R package
/// dtw). With an open begin the row before the first costs c per reference column skipped.
/// Random walks have no exact ties, so paths must be identical; distances agree to 1e-12 relative
/// (the same additions in the same order).
/// </summary>
public class Symmetric2BandTests
{
    private static (double Distance, List<(int I, int J)> Path) Textbook(double[] x, double[] y, Band band, double? openBeginCost)
    {
        int n = x.Length, m = y.Length;
        var g = new double[n, m];
        // Where the path came from: 0 diagonal, 1 left, 2 up; -1 the start.
        var from = new int[n, m];
        double Before(int j) => openBeginCost is double c && j >= 0 ? c * j : double.PositiveInfinity;
        for (int i = 0; i < n; i++)
            for (int j = 0; j < m; j++)
            {
                from[i, j] = -1;
                if (!band.Contains(i, j)) { g[i, j] = double.PositiveInfinity; continue; }
                double d = Math.Abs(x[i] - y[j]);
                if (i == 0 && j == 0 && openBeginCost is null) { g[i, j] = d; continue; }
                double diag = (i > 0 ? (j > 0 ? g[i - 1, j - 1] : double.PositiveInfinity) : Before(j - 1)) + 2 * d;
                double left = (j > 0 ? g[i, j - 1] : double.PositiveInfinity) + d;
                double up = (i > 0 ? g[i - 1, j] : Before(j)) + d;
                (g[i, j], from[i, j]) = (diag, 0);
                if (left < g[i, j]) (g[i, j], from[i, j]) = (left, 1);
                if (up < g[i, j]) (g[i, j], from[i, j]) = (up, 2);
            }
        var path = new List<(int, int)>();
        int a = n - 1, b = m - 1;
        path.Add((a, b));
        while (from[a, b] >= 0)
        {
            switch (from[a, b])
            {
                case 0: a--; b--; break;
                case 1: b--; break;
                default: a--; break;
            }
            if (a < 0) break;
            path.Add((a, b));
        }
        path.Reverse();
        return (g[n - 1, m - 1], path);
    }

    [Theory]
    [InlineData(1, 1)]
    [InlineData(1, 9)]
    [InlineData(9, 1)]
    [InlineData(6, 11)]
    [InlineData(57, 61)]
    [InlineData(203, 190)]
    public void ThreeMoveLoopMatchesTheTextbookRecurrence(int n, int m)
    {
        var rng = new Random(n * 1000 + m);
        var x = RandomWalks.Walk(rng, n);
        var y = RandomWalks.Walk(rng, m);
        var bands = new List<Band> { Band.Full(n, m) };
        foreach (int w in new[] { 0, 3, 10 })
            if (Math.Abs(n - m) <= w) bands.Add(Band.SakoeChiba(n, m, w));
        foreach (var band in bands)
            foreach (double? openBegin in new double?[] { null, 0.25 })
            {
                var options = openBegin is double c ? new DtwOptions { OpenBegin = true, CompletionCostPerColumn = c } : DtwOptions.Default;
                var (distance, path) = Textbook(x, y, band, openBegin);
                if (double.IsPositiveInfinity(distance)) continue;
                var ours = DtwSolver.Solve(new AbsoluteCost(x, y), StepPattern.Symmetric2, band, options);
                Assert.Equal(distance, ours.Distance, Math.Max(distance, 1) * 1e-12);
                Assert.Equal(path.Select(p => p.I), ours.I);
                Assert.Equal(path.Select(p => p.J), ours.J);
            }
    }
}
