using System.Globalization;

namespace StratLink.Cli.Dashboard.Drawing;

/// <summary>
/// The value range a signal is drawn on: its 2nd to 98th percentile, so a few spikes (event
/// layers, bad readings) do not squash the rest; values beyond are drawn at the edge, and the share
/// of them is reported so the clipping is never hidden. A signal with fewer than 50 values, or
/// whose percentiles coincide, is drawn on its full range.
/// </summary>
public readonly record struct RobustRange(double Min, double Max, double ClippedShare, bool Clipping)
{
    public const double LowPercent = 2;
    public const double HighPercent = 98;
    private const int FewestForPercentiles = 50;

    public static RobustRange Of(IEnumerable<double> values)
    {
        var finite = values.Where(double.IsFinite).ToArray();
        if (finite.Length == 0) return new RobustRange(0, 1, 0, false);
        Array.Sort(finite);
        double min = finite[0], max = finite[^1];
        if (finite.Length >= FewestForPercentiles)
        {
            double lo = Statistics.PercentileSorted(finite, LowPercent), hi = Statistics.PercentileSorted(finite, HighPercent);
            if (hi > lo)
            {
                int clipped = finite.Count(v => v < lo || v > hi);
                return new RobustRange(lo, hi, (double)clipped / finite.Length, true);
            }
        }
        if (!(max > min)) (min, max) = (min - 0.5, min + 0.5);
        return new RobustRange(min, max, 0, false);
    }

    /// <summary>"2-98 %, 3.1 % clipped" or "full range".</summary>
    public string Describe() => Clipping
        ? $"{LowPercent.ToString(CultureInfo.InvariantCulture)}-{HighPercent.ToString(CultureInfo.InvariantCulture)} %, {(ClippedShare * 100).ToString("0.0", CultureInfo.InvariantCulture)} % clipped"
        : "full range";
}
