using System.CommandLine;
using StratLink.Export;
using StratLink.ProjectIO;
using StratLink.Workflows;

namespace StratLink.Cli.Commands;

/// <summary>
/// <c>stratlink export PROJECT --what composite|splice|mappings|ages|lipd --out FILE [--tsv]</c>: one table of a
/// build, comma- or tab-separated, with units in the header; or the composite and age model as one LiPD file.
/// </summary>
internal static class ExportCommand
{
    private static readonly string[] Tables = ["composite", "splice", "mappings", "ages", "lipd"];

    public static Command Create(CliContext ctx)
    {
        var project = ProjectArgument.Create();
        var what = new Option<string>("--what") { Description = "Which table: composite, splice, mappings (every core), ages (every core), or lipd (composite and age model with its ensemble as a LiPD file).", Required = true };
        what.AcceptOnlyFromAmong(Tables);
        var output = new Option<FileInfo>("--out") { Description = "File to write.", Required = true };
        var tsv = new Option<bool>("--tsv") { Description = "Tab-separated instead of comma-separated." };
        var archiveType = new Option<string>("--archive-type")
        {
            Description = "LiPD archiveType of the cores (lipd only), e.g. MarineSediment or LakeSediment.", DefaultValueFactory = _ => "MarineSediment",
        };
        var cmd = new Command("export", "Build the project and write one of its tables.") { project, what, output, tsv, archiveType };
        cmd.SetAction(parse =>
        {
            if (LoadForRun.Load(parse.GetValue(project)!, ctx, "nothing was exported") is not { } loaded) return ExitCodes.Usage;
            BuildResult build;
            using (var progress = new ConsoleProgress(ctx))
                build = BuildWorkflow.Run(loaded, progress, ctx.Cancellation);
            var format = parse.GetValue(tsv) ? TableFormat.Tsv : TableFormat.Csv;
            string table = parse.GetValue(what)!;
            string file = parse.GetValue(output)!.FullName;
            if (table == "lipd")
            {
                AtomicFile.WriteBytes(file, s => LipdWriter.Write(s, loaded.Project, build.Composite, build.Ages, parse.GetValue(archiveType)!), keepBackup: false);
                ctx.Out.WriteLine($"Wrote the composite and age model as LiPD to {file}.");
                return ExitCodes.Success;
            }
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
