using System.CommandLine;
using StratLink.Cli.Dashboard;

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
        root.SetAction(parse => DashboardLauncher.Run(parse.GetValue(project)?.FullName, ctx));
    }
}
