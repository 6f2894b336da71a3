namespace StratLink.AgeModelling.Calibration;

/// <summary>
/// A small bar plot drawn with the eighth-block characters (U+2581..U+2588) for terminals: no UI
/// dependency, just strings, so the command line, the dashboard and logs can all show it.
/// </summary>
public static class TextBars
{
    private const string Eighths = " \u2581\u2582\u2583\u2584\u2585\u2586\u2587\u2588";

    /// <summary>
    /// <paramref name="height"/> lines, top first, one column per value, scaled so the largest value fills
    /// the height. Non-positive values draw nothing.
    /// </summary>
    public static string[] Render(IReadOnlyList<double> values, int height)
    {
        if (height < 1) throw new ArgumentOutOfRangeException(nameof(height), height, "At least one line.");
        double max = values.Count == 0 ? 0 : values.Max();
        var levels = new int[values.Count];
        for (int c = 0; c < levels.Length; c++)
            levels[c] = max > 0 && values[c] > 0 ? Math.Max(1, (int)Math.Round(values[c] / max * height * 8)) : 0;
        var lines = new string[height];
        var row = new char[values.Count];
        for (int r = 0; r < height; r++)
        {
            int floor = (height - 1 - r) * 8;
            for (int c = 0; c < row.Length; c++) row[c] = Eighths[Math.Clamp(levels[c] - floor, 0, 8)];
            lines[r] = new string(row);
        }
        return lines;
    }

    /// <summary>Sums consecutive values into <paramref name="bins"/> bins of equal span over the indices <paramref name="firstIndex"/>..<paramref name="lastIndex"/> (probabilities stay probabilities).</summary>
    public static double[] SumIntoBins(IReadOnlyList<double> values, int firstIndex, int lastIndex, int bins)
    {
        if (bins < 1) throw new ArgumentOutOfRangeException(nameof(bins), bins, "At least one bin.");
        var sums = new double[bins];
        double span = Math.Max(1, lastIndex - firstIndex + 1);
        for (int i = Math.Max(0, firstIndex); i <= Math.Min(lastIndex, values.Count - 1); i++)
            sums[Math.Min(bins - 1, (int)((i - firstIndex) / span * bins))] += values[i];
        return sums;
    }
}
