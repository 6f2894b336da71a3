using System.CommandLine;
using StratLink.Checks;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Workflows;

namespace StratLink.Cli.Commands;

/// <summary>
/// <c>stratlink check PROJECT [--format table|csv|json]</c>: every problem of the project file, its
/// tables and the consistency checks. Exit 0 when none is an error, 1 when some are, 2 when the
/// project file cannot be read at all.
/// </summary>
internal static class CheckCommand
{
    public static Command Create(CliContext ctx)
    {
        var project = ProjectArgument.Create();
        var format = new Option<string>("--format") { Description = "Output form: table (people), csv or json (scripts).", DefaultValueFactory = _ => "table" };
        format.AcceptOnlyFromAmong(FindingsPrinter.Formats);
        var cmd = new Command("check", "Report every problem in a project: file, tables, marker ties and age controls.") { project, format };
        cmd.SetAction(parse =>
        {
            string path = parse.GetValue(project)!.FullName;
            using var progress = new ConsoleProgress(ctx);
            var loaded = ProjectLoader.Load(path, ctx.Cancellation);
            if (loaded.Problems.Any(p => p.Code == ProjectCodes.Unreadable))
            {
                foreach (var p in loaded.Problems) ctx.Error.WriteLine(p.ToString());
                return ExitCodes.Usage;
            }
            var findings = CheckWorkflow.Run(loaded, progress, ctx.Cancellation);
            FindingsPrinter.Print(findings, parse.GetValue(format)!, loaded.Project.DepthUnit.Symbol(), ctx.Out);
            return findings.Any(f => f.Severity == Severity.Error) ? ExitCodes.Findings : ExitCodes.Success;
        });
        return cmd;
    }
}
