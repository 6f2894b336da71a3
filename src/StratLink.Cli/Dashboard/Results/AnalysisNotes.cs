using System.Globalization;
using StratLink.Analysis;
using StratLink.Quantities;
using StratLink.Workflows;

namespace StratLink.Cli.Dashboard.Results;

/// <summary>
/// Reads what <see cref="AnalysisWorkflow"/> computed for one composite signal into notes: one per period
/// asked for (its power against the 95 % red-noise level, and in how many age-model members it stays
/// above), then one per regime shift (strongest first), placed at the composite depth of its first younger sample.
/// </summary>
public static class AnalysisNotes
{
    public static IReadOnlyList<AnalysisNote> Read(BuildResult build, AnalysisResult analysis, bool useSplice)
    {
        string signal = analysis.SignalName;
        var notes = new List<AnalysisNote>();
        string level = analysis.Spectrum.LevelSource;
        foreach (var p in analysis.Periods)
        {
            if (double.IsNaN(p.PowerOverLevel95))
            {
                // No frequency of the spectrum lies within the period's band: too short for the sampling, or too long for the record.
                double shortest = 1 / analysis.Spectrum.NyquistFrequency, longest = analysis.Series.SpanYears;
                notes.Add(new AnalysisNote(signal, null, Invariant($"{p.PeriodYears:0.#} yr: not testable, the spectrum covers {shortest:0.#} to {longest:0} yr")));
                continue;
            }
            string share = p.ShareOfMembersAbove95 is double s ? $", above it in {Num(s * 100)} % of members" : "";
            notes.Add(new AnalysisNote(signal, null, Invariant(
                $"{p.PeriodYears:0.#} yr: {p.PowerOverLevel95:0.0} x the 95 % red-noise level ({level}) at {p.PeakPeriodYears:0.#} yr{share}")));
        }
        var rowDepths = AnalysedRowDepths(build, signal, useSplice);
        var spreads = analysis.Ensemble?.Shifts ?? [];
        var shifts = analysis.Regimes.Shifts;
        if (shifts.Count == 0)
            notes.Add(new AnalysisNote(signal, null, Invariant($"No regime shift at p < {analysis.Regimes.Options.Probability:0.##} (cut-off {analysis.Regimes.Options.CutoffLength} samples).")));
        // Strongest first: the screen lists only the first few; every shift is marked on the plot.
        foreach (var shift in shifts.OrderByDescending(s => Math.Abs(s.Rsi)).ThenBy(s => s.AgeBP))
        {
            double? depth = null;
            if (shift.Index >= 0 && shift.Index < analysis.Series.Count)
            {
                int source = analysis.Series.SourceIndex[shift.Index];
                if (source >= 0 && source < rowDepths.Count) depth = rowDepths[source];
            }
            var spread = spreads.FirstOrDefault(s => s.Shift == shift);
            string members = spread is null ? ""
                : Invariant($", members {spread.AgeLoBP:0}..{spread.AgeHiBP:0} cal BP in {spread.ShareMatched * 100:0} %");
            string where = depth is double d ? Invariant($" ({d:0.#} {build.Composite.Grid.Unit.Symbol()})") : "";
            notes.Add(new AnalysisNote(signal, depth, Invariant(
                $"shift{(shift.Tentative ? " (tentative)" : "")} at {shift.AgeBP:0} cal BP{where}: mean {shift.MeanBefore:0.##} -> {shift.MeanAfter:0.##}, RSI {shift.Rsi:0.##}{members}")));
        }
        return notes;
    }

    /// <summary>Composite depth of each value the analysis took in: the grid rows where the analysed column has a value, as the workflow selects them.</summary>
    private static List<double> AnalysedRowDepths(BuildResult build, string signal, bool useSplice)
    {
        var record = build.Composite.Record(signal);
        var depths = new List<double>();
        if (record is null) return depths;
        var source = useSplice ? record.Spliced : record.Mean;
        for (int row = 0; row < build.Composite.Grid.Count; row++)
            if (!double.IsNaN(source[row])) depths.Add(build.Composite.Grid.ValueAt(row));
        return depths;
    }

    private static string Num(double v) => v.ToString("0", CultureInfo.InvariantCulture);

    private static string Invariant(FormattableString s) => FormattableString.Invariant(s);
}
