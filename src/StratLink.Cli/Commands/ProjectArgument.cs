using System.CommandLine;

namespace StratLink.Cli.Commands;

/// <summary>The PROJECT argument shared by the verbs that work on a project file.</summary>
internal static class ProjectArgument
{
    public static Argument<FileInfo> Create() => new("project") { Description = "The project file (YAML, format stratlink-project/1)." };
}
