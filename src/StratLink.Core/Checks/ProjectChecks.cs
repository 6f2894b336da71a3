using StratLink.Alignment;
using StratLink.Workflows;

namespace StratLink.Checks;

/// <summary>
/// The scientific consistency checks of a loaded project (ties, alignments, ages); codes in
/// <see cref="CheckCodes"/>. Input problems (file syntax, tables) are the loader's: they stay in
/// <see cref="LoadedProject.Problems"/> and are not repeated here.
/// </summary>
public static class ProjectChecks
{
    /// <param name="alignment">The project's alignment, when one has been made: needed for the age checks across cores and reused by the loop-closure check.</param>
    /// <returns>Findings, errors first, then by code, core and depth.</returns>
    public static IReadOnlyList<Finding> Run(LoadedProject project, AlignmentResult? alignment, CheckContext ctx, CancellationToken ct)
    {
        var r = new CheckReporter(project);
        ctx.Progress?.Report(new WorkProgress("checks: ties", 0));
        TieChecks.Run(r);
        ct.ThrowIfCancellationRequested();

        bool tied = project.Project.Markers.Any(m => m.Depths.Count(d => project.Tables.ContainsKey(d.CoreId)) >= 2);
        if (ctx.Aligner is { } aligner)
        {
            if (tied) TieMisfitCheck.Run(r, project, aligner, ctx.Progress, ct);
            LoopClosureCheck.Run(r, project, alignment, aligner, ctx.Progress, ct);
        }
        else if (project.Tables.Count >= 2)
        {
            r.Add(Severity.Note, CheckCodes.CheckNotRun,
                "The ties were not tested against the signals and the loop closure was not checked: no aligner was given to the checks.", null, null, null, null);
        }

        ctx.Progress?.Report(new WorkProgress("checks: ages", 0));
        AgeChecks.Run(r, project, alignment, ctx, ct);
        ctx.Progress?.Report(new WorkProgress("checks: ages", 1));

        return r.Findings
            .OrderByDescending(f => f.Severity)
            .ThenBy(f => f.Code, StringComparer.Ordinal)
            .ThenBy(f => f.Core, StringComparer.Ordinal)
            .ThenBy(f => f.Depth)
            .ToList();
    }
}
