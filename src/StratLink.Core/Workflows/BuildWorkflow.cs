using StratLink.AgeModelling;
using StratLink.Alignment;
using StratLink.Checks;
using StratLink.Compositing;
using StratLink.Export;

namespace StratLink.Workflows;

/// <summary>
/// The pipeline behind <c>stratlink build</c> and the dashboard's run: align every core to the
/// reference (and the cores a dated target dates to the target, for ages), model ages on composite depth, build the composite and splice, check consistency.
/// It works on one snapshot and returns only when every stage is complete, so a cancelled run
/// leaves the caller's previous results untouched.
/// </summary>
public static class BuildWorkflow
{
    // Shares of the progress bar; alignment with its ensembles dominates the run time.
    private static readonly (string Stage, double Share)[] Stages =
        [("alignment", 0.45), ("ages", 0.25), ("composite", 0.15), ("checks", 0.15)];

    public static BuildResult Run(LoadedProject project, IProgress<WorkProgress>? progress, CancellationToken ct)
    {
        if (project.Problems.HasErrors)
            throw new InvalidOperationException("The project has errors; 'stratlink check' lists them. Fix them before a build.");
        var alignment = CoreAligner.Align(project, Stage(progress, 0), ct);
        var targetFindings = new FindingList();
        var dated = StageTimes.Measure("alignment", () => WithTargetAges(project, targetFindings, ct));
        var varveProblems = new FindingList();
        var varves = StageTimes.Measure("ages", () => VarveLayerLoader.Load(dated, varveProblems, ct));
        var ages = StageTimes.Measure("ages", () => AgeModeller.Run(dated, alignment, varves, Stage(progress, 1), ct));
        var composite = StageTimes.Measure("composite", () => CompositeBuilder.Build(project, alignment, ages.IsBuilt ? ages : null, Stage(progress, 2), ct));
        var checks = StageTimes.Measure("checks", () => ChecksFor(dated, alignment, ages, Stage(progress, 3), ct));
        progress?.Report(new WorkProgress("done", 1));

        var findings = new List<Finding>();
        findings.AddRange(project.Problems);
        findings.AddRange(alignment.Findings);
        findings.AddRange(targetFindings);
        findings.AddRange(varveProblems);
        findings.AddRange(ages.Findings);
        findings.AddRange(composite.Findings);
        findings.AddRange(checks);
        return new BuildResult(project, alignment, ages, composite, findings);
    }

    /// <summary>Writes every output of a build into <paramref name="directory"/>; returns the files written, relative to it.</summary>
    public static IReadOnlyList<string> WriteOutputs(BuildResult result, string directory)
    {
        Directory.CreateDirectory(directory);
        var files = new List<string>();
        using (StageTimes.Measure("write"))
        {
            // The composite's files and the ages' are independent: written side by side, listed in this order
            // (WhenAll waits for both and rethrows a failure unwrapped).
            var composite = Task.Run(() => CompositeOutputs.WriteAll(result.Project, result.Composite, directory));
            var ages = Task.Run(() =>
            {
                var written = new List<string>();
                foreach (var series in result.Ages.Cores.Values.OrderBy(s => s.Id, StringComparer.Ordinal))
                    written.Add(AgesCsvWriter.WriteFile(directory, series));
                if (result.Ages.Composite is { } compositeAges) written.Add(AgesCsvWriter.WriteFile(directory, compositeAges));
                if (AgeFigures.Write(result.Ages, Path.Combine(directory, "figures")) is { } ageFigure) written.Add(ageFigure);
                written.Add(ChecksCsvWriter.WriteFile(directory, result.Findings, result.Project.Project.DepthUnit));
                return written;
            });
            Task.WhenAll(composite, ages).GetAwaiter().GetResult();
            files.AddRange(composite.Result);
            files.AddRange(ages.Result);
        }
        var relative = files.Select(f => Path.GetRelativePath(directory, f).Replace('\\', '/')).Order(StringComparer.Ordinal).ToList();
        relative.Add("run.json");
        RunManifest.Write(Path.Combine(directory, "run.json"), result.Project.Document, result.Project.Project, result.Methods, relative,
            StageTimes.Current?.Snapshot());
        return relative;
    }

    /// <summary>The project with the ages transferred from its dated target added to its age controls (unchanged without a target).</summary>
    private static LoadedProject WithTargetAges(LoadedProject project, FindingList findings, CancellationToken ct)
    {
        var transferred = TargetAgeControls.For(project, findings, ct);
        return transferred.Count == 0 ? project : project.WithProject(project.Project with { Ages = project.Project.Ages.AddRange(transferred) });
    }

    private static IReadOnlyList<Finding> ChecksFor(LoadedProject project, AlignmentResult alignment, AgeModelResult ages,
        IProgress<WorkProgress>? progress, CancellationToken ct) =>
        ProjectChecks.Run(project, alignment, CheckWorkflow.Context(ages.IsBuilt ? ages : null, progress), ct);

    private static ScaledProgress? Stage(IProgress<WorkProgress>? progress, int index)
    {
        if (progress is null) return null;
        double start = Stages.Take(index).Sum(s => s.Share);
        return new ScaledProgress(progress, Stages[index].Stage, start, Stages[index].Share);
    }
}
