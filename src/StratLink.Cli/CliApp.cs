using System.CommandLine;
using StratLink.Cli.Commands;

namespace StratLink.Cli;

/// <summary>Parses the command line and dispatches to one verb; all science stays in the core library.</summary>
public static class CliApp
{
    public static int Run(string[] args, TextWriter stdout, TextWriter stderr, bool stderrIsTerminal)
    {
        using var cts = new CancellationTokenSource();
        ConsoleCancelEventHandler onCancel = (_, e) => { e.Cancel = true; cts.Cancel(); };
        Console.CancelKeyPress += onCancel;
        try
        {
            var ctx = new CliContext(stdout, stderr, stderrIsTerminal, cts.Token);
            var root = BuildRoot(ctx);
            var parsed = root.Parse(args);
            if (parsed.Errors.Count > 0)
            {
                foreach (var e in parsed.Errors) ctx.Fail(e.Message);
                stderr.WriteLine("Try 'stratlink --help'.");
                return ExitCodes.Usage;
            }
            int code = parsed.Invoke(new InvocationConfiguration { Output = stdout, Error = stderr });
            return cts.IsCancellationRequested ? ExitCodes.Cancelled : code;
        }
        catch (OperationCanceledException)
        {
            stderr.WriteLine("stratlink: cancelled");
            return ExitCodes.Cancelled;
        }
        finally
        {
            Console.CancelKeyPress -= onCancel;
        }
    }

    internal static RootCommand BuildRoot(CliContext ctx)
    {
        var root = new RootCommand(
            "StratLink: align, date, splice and composite the parallel cores of one site.\n" +
            "With a project file and no verb, opens the dashboard on it.");
        foreach (var command in Verbs(ctx)) root.Subcommands.Add(command);
        DashboardCommand.Attach(root, ctx);
        return root;
    }

    private static IEnumerable<Command> Verbs(CliContext ctx) =>
    [
        CheckCommand.Create(ctx),
        BuildCommand.Create(ctx),
        ExportCommand.Create(ctx),
        AnalyseCommand.Create(ctx),
        CalibrateCommand.Create(ctx),
        PairCommand.Create(ctx),
        DemoCommand.Create(ctx),
        NewCommand.Create(ctx),
    ];
}
