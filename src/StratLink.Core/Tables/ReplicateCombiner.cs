using StratLink.Model;
using StratLink.ProjectIO;

namespace StratLink.Tables;

/// <summary>
/// Folds runs of rows that share one depth (replicate measurements, e.g. two species picked from one
/// sample) into one sample, as the core's <c>repeated_depths</c> says. Only adjacent rows are folded:
/// a repeat further down the table is a depth-order problem, reported as such.
/// </summary>
internal static class ReplicateCombiner
{
    public static (double[] Depths, int[] Lines, Dictionary<string, double[]> Signals) Combine(
        double[] depths, int[] lines, Dictionary<string, double[]> signals, CoreSpec spec, TableProblems report)
    {
        var starts = new List<int>(depths.Length);
        for (int i = 0; i < depths.Length; i++)
            if (i == 0 || depths[i] != depths[i - 1]) starts.Add(i);
        int repeats = depths.Length - starts.Count;
        if (repeats == 0) return (depths, lines, signals);

        int n = starts.Count;
        var outDepths = new double[n];
        var outLines = new int[n];
        for (int g = 0; g < n; g++)
        {
            outDepths[g] = depths[starts[g]];
            outLines[g] = lines[starts[g]];
        }
        var outSignals = new Dictionary<string, double[]>(StringComparer.Ordinal);
        var buffer = new List<double>();
        foreach (var (name, values) in signals)
        {
            var folded = new double[n];
            for (int g = 0; g < n; g++)
            {
                int from = starts[g], to = g + 1 < n ? starts[g + 1] : depths.Length;
                if (spec.RepeatedDepths == RepeatedDepths.First)
                {
                    folded[g] = values[from];
                    continue;
                }
                buffer.Clear();
                for (int i = from; i < to; i++)
                    if (!double.IsNaN(values[i])) buffer.Add(values[i]);
                folded[g] = buffer.Count == 0 ? double.NaN
                    : spec.RepeatedDepths == RepeatedDepths.Mean ? buffer.Average() : Median(buffer);
            }
            outSignals[name] = folded;
        }
        string how = spec.RepeatedDepths.ToString().ToLowerInvariant();
        report.Note(ProjectCodes.TableRepeatsCombined,
            $"core '{spec.Id}': {repeats} row(s) repeat a depth (first at line {FirstRepeatLine(depths, lines)}); each depth's rows are combined by {how}, as repeated_depths says",
            null, "repeated_depths");
        return (outDepths, outLines, outSignals);
    }

    private static int FirstRepeatLine(double[] depths, int[] lines)
    {
        for (int i = 1; i < depths.Length; i++)
            if (depths[i] == depths[i - 1]) return lines[i];
        return lines[0];
    }

    /// <summary>Median of the values (the mean of the middle two for an even count).</summary>
    private static double Median(List<double> values)
    {
        values.Sort();
        int m = values.Count / 2;
        return values.Count % 2 == 1 ? values[m] : (values[m - 1] + values[m]) / 2;
    }
}
