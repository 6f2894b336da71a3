namespace StratLink.Export.Svg;

/// <summary>Round tick values for an axis: steps of 1, 2 or 5 times a power of ten (common practice).</summary>
public static class AxisTicks
{
    /// <summary>Ticks inside [<paramref name="min"/>, <paramref name="max"/>], about <paramref name="target"/> of them.</summary>
    public static IReadOnlyList<double> Nice(double min, double max, int target = 6)
    {
        if (!(max > min) || !double.IsFinite(min) || !double.IsFinite(max)) return double.IsFinite(min) ? [min] : [];
        double step = NiceStep((max - min) / Math.Max(1, target));
        var ticks = new List<double>();
        for (double t = Math.Ceiling(min / step - 1e-9) * step; t <= max + step * 1e-9; t += step)
            ticks.Add(Math.Abs(t) < step * 1e-9 ? 0 : Math.Round(t / step) * step);
        return ticks;
    }

    public static double NiceStep(double rough)
    {
        double power = Math.Pow(10, Math.Floor(Math.Log10(rough)));
        double f = rough / power;
        double nice = f <= 1 ? 1 : f <= 2 ? 2 : f <= 5 ? 5 : 10;
        return nice * power;
    }

    /// <summary>Tick label with no more decimals than the step needs.</summary>
    public static string Label(double value, double step)
    {
        int decimals = Math.Max(0, (int)Math.Ceiling(-Math.Log10(step) - 1e-9));
        return value.ToString("F" + decimals, System.Globalization.CultureInfo.InvariantCulture);
    }
}
