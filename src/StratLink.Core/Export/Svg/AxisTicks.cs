using System.Globalization;

namespace StratLink.Export.Svg;

/// <summary>
/// Round tick values for an axis: steps of 1, 2 or 5 times a power of ten on a linear axis, whole
/// decades on a logarithmic one (common practice).
/// </summary>
public static class AxisTicks
{
    /// <summary>Linear ticks inside [<paramref name="min"/>, <paramref name="max"/>], about <paramref name="target"/> of them.</summary>
    private static List<double> Nice(double min, double max, int target = 6)
    {
        if (!(max > min) || !double.IsFinite(min) || !double.IsFinite(max)) return double.IsFinite(min) ? [min] : [];
        double step = Step(min, max, target);
        var ticks = new List<double>();
        for (double t = Math.Ceiling(min / step - 1e-9) * step; t <= max + step * 1e-9; t += step)
            ticks.Add(Math.Abs(t) < step * 1e-9 ? 0 : Math.Round(t / step) * step);
        return ticks;
    }

    /// <summary>Labelled ticks of a linear or logarithmic axis over the range.</summary>
    public static IReadOnlyList<AxisTick> For((double Min, double Max) range, bool log, int target)
    {
        if (log) return Decades(range.Min, range.Max);
        var values = Nice(range.Min, range.Max, target);
        double step = values.Count > 1 ? values[1] - values[0] : 1;
        return values.Select(v => new AxisTick(v, Label(v, step))).ToList();
    }

    /// <summary>The range widened outwards to whole ticks of the step the ticks would use (a log range to whole decades).</summary>
    public static (double Min, double Max) PadToTicks(double min, double max, bool log, int target = 6)
    {
        if (log)
        {
            double lo = Math.Pow(10, Math.Floor(Math.Log10(min))), hi = Math.Pow(10, Math.Ceiling(Math.Log10(max) - 1e-9));
            return (lo, hi > lo ? hi : lo * 10);
        }
        if (!(max > min)) return (min, max);
        double step = Step(min, max, target);
        return (Math.Floor(min / step + 1e-9) * step, Math.Ceiling(max / step - 1e-9) * step);
    }

    /// <summary>The 1, 2 or 5 times a power of ten nearest <paramref name="rough"/>, so the count stays near the target either way.</summary>
    private static double NiceStep(double rough)
    {
        double power = Math.Pow(10, Math.Floor(Math.Log10(rough)));
        double f = rough / power;
        double nice = f < 1.5 ? 1 : f < 3.5 ? 2 : f < 7.5 ? 5 : 10;
        return nice * power;
    }

    /// <summary>Tick label with no more decimals than the step needs.</summary>
    private static string Label(double value, double step)
    {
        int decimals = Math.Max(0, (int)Math.Ceiling(-Math.Log10(step) - 1e-9));
        return value.ToString("F" + decimals, CultureInfo.InvariantCulture);
    }

    private static double Step(double min, double max, int target) => NiceStep((max - min) / Math.Max(1, target));

    /// <summary>Every power of ten in the range; written out from 0.001 to 10000, as 10 with a raised exponent beyond.</summary>
    private static List<AxisTick> Decades(double min, double max)
    {
        var ticks = new List<AxisTick>();
        for (int e = (int)Math.Ceiling(Math.Log10(min) - 1e-9); e <= (int)Math.Floor(Math.Log10(max) + 1e-9); e++)
        {
            double v = Math.Pow(10, e);
            ticks.Add(e is >= -3 and <= 4
                ? new AxisTick(v, v.ToString("0.###", CultureInfo.InvariantCulture))
                : new AxisTick(v, "10", e.ToString(CultureInfo.InvariantCulture)));
        }
        return ticks;
    }
}
