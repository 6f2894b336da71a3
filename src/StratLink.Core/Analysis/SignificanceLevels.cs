namespace StratLink.Analysis;

/// <summary>The false-alarm levels reported against the red-noise background (common practice: 80, 90, 95, 99 %).</summary>
public static class SignificanceLevels
{
    public static IReadOnlyList<double> Percents { get; } = [80, 90, 95, 99];

    /// <summary>Position of <paramref name="percent"/> in <see cref="Percents"/>.</summary>
    public static int IndexOf(double percent)
    {
        for (int i = 0; i < Percents.Count; i++)
            if (Percents[i] == percent) return i;
        throw new ArgumentOutOfRangeException(nameof(percent), percent, "Levels are 80, 90, 95 and 99 %.");
    }
}
