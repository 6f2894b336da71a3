using MathNet.Numerics.Statistics;
using StratLink.Alignment;

namespace StratLink.Tests.Alignment;

/// <summary>
/// Standardising over a window of rows: over that window the result has mean 0 and sample SD 1
/// (z-score) or median 0 and 1.4826 x MAD = 1 (robust), checked with MathNet.Numerics' statistics;
/// rows outside the window get the same affine map; a too-short window keeps the old scaling.
/// </summary>
public class StandardiseOverTests
{
    private static PreparedSignals Sample()
    {
        var rng = new Random(7);
        int n = 200;
        var v = new double[n * 2];
        for (int r = 0; r < n; r++)
        {
            v[r * 2] = 0.05 * r + Math.Sin(r / 7.0) + 0.3 * rng.NextDouble(); // a trend: window and whole differ
            v[r * 2 + 1] = r % 17 == 0 ? double.NaN : 3 * Math.Cos(r / 11.0) + rng.NextDouble();
        }
        return new PreparedSignals("C", 0, 0.5, n, ["ms", "density"], v);
    }

    [Fact]
    public void ZScoreOverTheWindow()
    {
        var p = Sample();
        var s = SignalPreparation.StandardiseOver(p, 40, 119, robust: false);
        for (int k = 0; k < 2; k++)
        {
            var window = Enumerable.Range(40, 80).Select(r => s.Value(r, k)).Where(x => !double.IsNaN(x)).ToArray();
            Assert.Equal(0, window.Mean(), 1e-12);
            Assert.Equal(1, window.StandardDeviation(), 1e-12);
            // The same affine map outside the window: differences keep their ratios.
            double ratio = (s.Value(0, 0) - s.Value(199, 0)) / (p.Value(0, 0) - p.Value(199, 0));
            double inside = (s.Value(40, 0) - s.Value(100, 0)) / (p.Value(40, 0) - p.Value(100, 0));
            Assert.Equal(inside, ratio, 1e-12);
        }
    }

    [Fact]
    public void RobustOverTheWindow()
    {
        var s = SignalPreparation.StandardiseOver(Sample(), 10, 150, robust: true);
        var window = Enumerable.Range(10, 141).Select(r => s.Value(r, 0)).ToArray();
        double median = window.Median();
        Assert.Equal(0, median, 1e-12);
        Assert.Equal(1, 1.4826 * window.Select(x => Math.Abs(x - median)).Median(), 1e-12);
    }

    [Fact]
    public void ShortWindowKeepsTheScaling()
    {
        var p = Sample();
        var s = SignalPreparation.StandardiseOver(p, 50, 50 + SignalPreparation.MinStandardiseValues - 2, robust: false);
        Assert.Equal(p.Values, s.Values);
    }
}
