using System.CommandLine;

namespace StratLink.Cli.Commands;

/// <summary><c>stratlink [PROJECT]</c>: the dashboard on a project.</summary>
internal static class DashboardCommand
{
    public static void Attach(RootCommand root, CliContext ctx)
    {
        var project = new Argument<FileInfo?>("project")
        {
            Description = "Project file to open in the dashboard.",
            Arity = ArgumentArity.ZeroOrOne,
        };
        root.Arguments.Add(project);
        root.SetAction(parse =>
        {
            ctx.Fail("the dashboard is not part of this build yet; use the verbs (stratlink --help).");
            return ExitCodes.Usage;
        });
    }
}
