using System.CommandLine;
using StratLink.Export;
using StratLink.ProjectIO;
using StratLink.Workflows;

namespace StratLink.Cli.Commands;

/// <summary>
/// <c>stratlink export PROJECT --what composite|splice|mappings|ages --out FILE [--tsv]</c>: one table of a
/// build, comma- or tab-separated, with units in the header.
/// </summary>
internal static class ExportCommand
{
    private static readonly string[] Tables = ["composite", "splice", "mappings", "ages"];

    public static Command Create(CliContext ctx)
    {
        var project = ProjectArgument.Create();
        var what = new Option<string>("--what") { Description = "Which table: composite, splice, mappings (every core) or ages (every core).", Required = true };
        what.AcceptOnlyFromAmong(Tables);
        var output = new Option<FileInfo>("--out") { Description = "File to write.", Required = true };
        var tsv = new Option<bool>("--tsv") { Description = "Tab-separated instead of comma-separated." };
        var cmd = new Command("export", "Build the project and write one of its tables.") { project, what, output, tsv };
        cmd.SetAction(parse =>
        {
            if (LoadForRun.Load(parse.GetValue(project)!, ctx, "nothing was exported") is not { } loaded) return ExitCodes.Usage;
            BuildResult build;
            using (var progress = new ConsoleProgress(ctx))
                build = BuildWorkflow.Run(loaded, progress, ctx.Cancellation);
            var format = parse.GetValue(tsv) ? TableFormat.Tsv : TableFormat.Csv;
            string table = parse.GetValue(what)!;
            string file = parse.GetValue(output)!.FullName;
            AtomicFile.Write(file, w =>
            {
                switch (table)
                {
                    case "ages":
                        AgesCsvWriter.WriteAll(w, build.Ages.Cores.Values.OrderBy(s => s.Id, StringComparer.Ordinal), loaded.Project.DepthUnit, format);
                        break;
                    default:
                        CompositeOutputs.WriteTable(build.Composite, Enum.Parse<CompositeTableKind>(table, ignoreCase: true), w, format);
                        break;
                }
            }, keepBackup: false);
            ctx.Out.WriteLine($"Wrote the {table} table to {file}.");
            return ExitCodes.Success;
        });
        return cmd;
    }
}
