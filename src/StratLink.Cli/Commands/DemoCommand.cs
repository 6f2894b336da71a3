using System.CommandLine;
using StratLink.Demo;

namespace StratLink.Cli.Commands;

/// <summary><c>stratlink demo DIR [--seed N]</c>: writes the invented demo site and its hidden truth.</summary>
internal static class DemoCommand
{
    public static Command Create(CliContext ctx)
    {
        var dir = new Argument<DirectoryInfo>("dir") { Description = "Folder to write the demo project into (created if missing)." };
        var seed = new Option<int>("--seed") { Description = "Seed of the generator: the same seed writes identical files.", DefaultValueFactory = _ => 1 };
        var cmd = new Command("demo", "Write the demo project of an invented fjord site, with the true composite depths and ages in truth/.")
        {
            dir, seed,
        };
        cmd.SetAction(parse =>
        {
            var target = parse.GetValue(dir)!;
            try
            {
                string project = DemoSiteWriter.Write(DemoSiteGenerator.Generate(parse.GetValue(seed)), target.FullName);
                ctx.Out.WriteLine($"Demo project written: {project}");
                ctx.Out.WriteLine($"Open it with: stratlink {project}");
                return ExitCodes.Success;
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                ctx.Fail($"cannot write {target.FullName}: {e.Message}");
                return ExitCodes.Usage;
            }
        });
        return cmd;
    }
}
