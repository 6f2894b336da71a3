using System.CommandLine;
using StratLink.Checks;
using StratLink.Model;
using StratLink.Workflows;

namespace StratLink.Cli.Commands;

/// <summary>
/// <c>stratlink build PROJECT --out DIR</c>: the whole pipeline, headless and reproducible; writes the
/// tables, figures and run.json. Exit 0 when the build has no error findings, 1 when it has, 2 when
/// the project cannot be read or has input errors.
/// </summary>
internal static class BuildCommand
{
    public static Command Create(CliContext ctx)
    {
        var project = ProjectArgument.Create();
        var output = new Option<DirectoryInfo>("--out") { Description = "Folder for the outputs (created if missing).", Required = true };
        var verbose = new Option<bool>("--verbose") { Description = "Print the seconds spent in each stage (also in run.json)." };
        var cmd = new Command("build", "Align the cores, model ages, build the composite and splice, check consistency; write tables, figures and run.json.")
        {
            project, output, verbose,
        };
        cmd.SetAction(parse =>
        {
            string dir = parse.GetValue(output)!.FullName;
            var stages = StageTimes.Start();
            if (StageTimes.Measure("load", () => LoadForRun.Load(parse.GetValue(project)!, ctx, "nothing was built")) is not { } loaded) return ExitCodes.Usage;
            BuildResult result;
            using (var progress = new ConsoleProgress(ctx))
                result = BuildWorkflow.Run(loaded, progress, ctx.Cancellation);
            var files = BuildWorkflow.WriteOutputs(result, dir);
            ctx.Out.WriteLine($"Wrote {files.Count} files to {dir}:");
            foreach (string f in files) ctx.Out.WriteLine("  " + f);
            int errors = result.Findings.Count(f => f.Severity == Severity.Error);
            int warnings = result.Findings.Count(f => f.Severity == Severity.Warning);
            ctx.Out.WriteLine($"{errors} error(s), {warnings} warning(s) in checks.csv.");
            if (result.Findings.FirstOrDefault(f => f.Code == AgeModelling.AgeModelCodes.NoControls) is { } noAges) ctx.Out.WriteLine("Note: " + noAges.Message);
            if (parse.GetValue(verbose)) PrintStages(ctx.Out, stages);
            if (loaded.Project.Markers.Any(m => m.Kind is MarkerKind.Turbidite or MarkerKind.Flood or MarkerKind.Event))
                ctx.Out.WriteLine("Caution: " + Dashboard.HelpText.EventLayerCaution);
            return errors > 0 ? ExitCodes.Findings : ExitCodes.Success;
        });
        return cmd;
    }

    private static void PrintStages(TextWriter o, StageTimes stages)
    {
        var inv = System.Globalization.CultureInfo.InvariantCulture;
        o.WriteLine("stage        seconds (summed over the cores aligned in parallel)");
        foreach (var (stage, seconds) in stages.Snapshot())
            o.WriteLine($"{stage,-12} {seconds.ToString("0.000", inv),8}");
        o.WriteLine($"{"wall",-12} {stages.WallSeconds.ToString("0.000", inv),8}");
    }
}
