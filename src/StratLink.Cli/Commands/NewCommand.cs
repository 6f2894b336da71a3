using System.CommandLine;
using StratLink.Workflows;

namespace StratLink.Cli.Commands;

/// <summary>
/// <c>stratlink new DIR|FILES... [--out PROJECT] [--yes]</c>: drafts a project file from core tables.
/// Shows what it found and asks before writing when stdin is a terminal; <c>--yes</c> writes without asking.
/// Exit 0 when written, 1 when the user declined, 2 when the tables cannot make a project (nothing written).
/// </summary>
internal static class NewCommand
{
    public static Command Create(CliContext ctx)
    {
        var inputs = new Argument<string[]>("tables") { Description = "A folder of core tables, or the table files.", Arity = ArgumentArity.OneOrMore };
        var output = new Option<FileInfo>("--out") { Description = "Project file to write (default: FOLDER/FOLDER.stratlink.yaml in the tables' folder)." };
        var yes = new Option<bool>("--yes") { Description = "Write without asking (batch use)." };
        var cmd = new Command("new", "Draft a project file from a folder or a list of core tables.") { inputs, output, yes };
        cmd.SetAction(parse =>
        {
            var plan = NewProjectWorkflow.Draft(parse.GetValue(inputs)!, parse.GetValue(output)?.FullName, ctx.Cancellation);
            if (!plan.CanWrite)
            {
                foreach (var p in plan.Problems.Where(p => p.Severity == Checks.Severity.Error)) ctx.Error.WriteLine(p.ToString());
                ctx.Fail("no project written: the tables cannot make one as they are (above).");
                return ExitCodes.Usage;
            }
            ctx.Out.WriteLine($"{plan.Cores.Count} core(s), depths in {plan.Unit.ToString().ToLowerInvariant()}:");
            foreach (var c in plan.Cores)
                ctx.Out.WriteLine($"  {c.Spec.Id,-14} {Path.GetFileName(c.File)}  depth column '{c.Spec.DepthColumn}', {c.Rows} samples"
                    + (c.Repeats > 0 ? $", {c.Repeats} repeated depths (mean)" : "") + (c.Spec.Id == plan.Reference ? "  [reference]" : ""));
            ctx.Out.WriteLine($"Signals common to every core: {string.Join(", ", plan.Signals)}");
            foreach (string s in plan.Skipped) ctx.Out.WriteLine($"Left out: {s}");
            if (File.Exists(plan.ProjectPath))
            {
                ctx.Fail($"{plan.ProjectPath} exists; nothing written (name another file with --out)");
                return ExitCodes.Usage;
            }
            if (!parse.GetValue(yes) && !Console.IsInputRedirected)
            {
                ctx.Out.Write($"Write {plan.ProjectPath}? [y/N] ");
                string? answer = Console.ReadLine();
                if (answer?.Trim().ToLowerInvariant() is not ("y" or "yes"))
                {
                    ctx.Out.WriteLine("Nothing written.");
                    return ExitCodes.Findings;
                }
            }
            try
            {
                NewProjectWorkflow.Write(plan);
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                ctx.Fail($"cannot write {plan.ProjectPath}: {e.Message}");
                return ExitCodes.Usage;
            }
            ctx.Out.WriteLine($"Wrote {plan.ProjectPath}");
            ctx.Out.WriteLine($"Next: stratlink check {plan.ProjectPath}");
            return ExitCodes.Success;
        });
        return cmd;
    }
}
