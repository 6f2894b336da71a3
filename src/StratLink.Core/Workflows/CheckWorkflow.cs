using StratLink.AgeModelling;
using StratLink.Alignment;
using StratLink.Checks;

namespace StratLink.Workflows;

/// <summary>
/// The checks behind <c>stratlink check</c>: the input problems of the project and its tables, then
/// (when those allow) an alignment and the consistency checks of ties, loops and age controls.
/// </summary>
public static class CheckWorkflow
{
    public static IReadOnlyList<Finding> Run(LoadedProject project, IProgress<WorkProgress>? progress, CancellationToken ct)
    {
        var findings = new List<Finding>(project.Problems);
        if (project.Problems.HasErrors || project.Tables.Count == 0) return findings;
        // The site's mappings as the build makes them (the ensemble's median and band, not the optimal
        // path alone): the checks judge the alignment the outputs carry.
        var alignment = CoreAligner.Align(project, null, ct);
        findings.AddRange(alignment.Findings);
        findings.AddRange(ProjectChecks.Run(project, alignment, Context(null, progress), ct));
        return findings;
    }

    /// <summary>What the checks may call on: the aligner for leave-one-out and loop closure, and the age model when there is one.</summary>
    public static CheckContext Context(ICompositeAgeScale? ages, IProgress<WorkProgress>? progress) =>
        new() { Aligner = Realign, AgeScale = ages, Progress = progress };

    // Each check asks for the ensemble it needs (mostly none: they compare best mappings).
    private static AlignmentResult Realign(LoadedProject project, CancellationToken ct) => CoreAligner.Align(project, null, ct);
}
