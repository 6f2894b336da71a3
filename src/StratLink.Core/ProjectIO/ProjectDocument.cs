using StratLink.Checks;
using StratLink.Model;

namespace StratLink.ProjectIO;

/// <summary>A project as read from its file: the model (null when unreadable), every problem, and the lines of its keys.</summary>
public sealed record ProjectDocument(string FilePath, Project? Project, FindingList Problems, SourceMap Lines)
{
    /// <summary>Folder that relative paths in the file are resolved against.</summary>
    public string Directory => Path.GetDirectoryName(Path.GetFullPath(FilePath)) ?? ".";

    public string Resolve(string relativeOrAbsolute) => Path.GetFullPath(Path.Combine(Directory, relativeOrAbsolute));
}
