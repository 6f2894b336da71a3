using StratLink.Alignment;
using StratLink.Model;
using StratLink.Tables;
using StratLink.Workflows;

namespace StratLink.Checks;

/// <summary>Runs the aligner on edited copies of a project for the checks that compare alignments.</summary>
internal static class AlignmentRuns
{
    /// <summary>
    /// Aligns <paramref name="edited"/> with the loaded tables. The checks mostly use only the best
    /// mapping, so no ensemble is asked for unless <paramref name="ensemble"/> members are. An aligner failure on the edited project (e.g. a core left with nothing
    /// to align on) is returned as text, not thrown: the other checks still report.
    /// </summary>
    public static AlignmentResult? TryAlign(Func<LoadedProject, CancellationToken, AlignmentResult> aligner, LoadedProject loaded,
        Project edited, CancellationToken ct, out string? failure, int ensemble = 0)
    {
        edited = edited with { Alignment = edited.Alignment with { Ensemble = ensemble } };
        try
        {
            failure = null;
            return aligner(loaded.WithProject(edited), ct);
        }
        catch (Exception e) when (e is not OperationCanceledException)
        {
            failure = e.Message;
            return null;
        }
    }

    /// <summary>
    /// The finest depth the alignment can resolve in a core: the largest of the composite step, the
    /// alignment grid step (when set) and the core's median sample spacing. Used as the floor of a tie
    /// uncertainty, so an exact tie (uncertainty 0) is not held to a precision no alignment has.
    /// </summary>
    public static double GridStep(Project p, CoreTable? table)
    {
        double step = Math.Max(p.Composite.Step, p.Alignment.Step ?? 0);
        if (table is { Count: > 1 })
        {
            var spacing = new double[table.Count - 1];
            for (int i = 0; i < spacing.Length; i++) spacing[i] = table.Depths[i + 1] - table.Depths[i];
            Array.Sort(spacing);
            step = Math.Max(step, Statistics.PercentileSorted(spacing, 50));
        }
        return step;
    }
}
