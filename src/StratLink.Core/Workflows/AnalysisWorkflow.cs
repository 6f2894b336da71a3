using StratLink.Analysis;
using StratLink.Quantities;

namespace StratLink.Workflows;

/// <summary>Analyses one composite signal of a finished build across its age-model ensemble.</summary>
public static class AnalysisWorkflow
{
    /// <summary>
    /// Runs the periodogram, filters and regime-shift test on <paramref name="signal"/>'s composite
    /// (the stack mean, or the splice with <paramref name="useSplice"/>), rows without a value left out.
    /// </summary>
    public static AnalysisResult Run(BuildResult build, string signal, bool useSplice, AnalysisOptions options,
        IProgress<WorkProgress>? progress, CancellationToken ct)
    {
        var record = build.Composite.Record(signal)
            ?? throw new ArgumentException($"The composite has no signal '{signal}' (it has: {string.Join(", ", build.Composite.Records.Select(r => r.Signal))}).", nameof(signal));
        if (!build.Ages.IsBuilt)
            throw new InvalidOperationException("The project has no usable age controls, so the composite has no ages to analyse on.");
        var grid = build.Composite.Grid;
        var source = useSplice ? record.Spliced : record.Mean;
        var depths = new List<CompositeDepth>();
        var values = new List<double>();
        for (int row = 0; row < grid.Count; row++)
        {
            if (double.IsNaN(source[row])) continue;
            depths.Add(grid.DepthAt(row));
            values.Add(source[row]);
        }
        string? unit = record.Standardised ? "z-score" : null;
        var input = AnalysisInput.FromComposite(signal, unit, depths, values.ToArray(), build.Ages);
        return RecordAnalysis.Run(input, options, progress, ct);
    }
}
