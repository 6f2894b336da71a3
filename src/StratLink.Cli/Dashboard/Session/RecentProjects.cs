namespace StratLink.Cli.Dashboard.Session;

/// <summary>
/// The projects opened lately, newest first, one absolute path a line in the file <c>recent</c> of
/// the settings folder. A missing or unreadable list is an empty one: it is a convenience only.
/// </summary>
public sealed class RecentProjects
{
    public const int Capacity = 8;

    public RecentProjects(string configDirectory) => FilePath = Path.Combine(configDirectory, "recent");

    public string FilePath { get; }

    /// <summary>Recent projects whose files still exist.</summary>
    public IReadOnlyList<string> Read()
    {
        try
        {
            if (!File.Exists(FilePath)) return [];
            return File.ReadAllLines(FilePath)
                .Select(l => l.Trim())
                .Where(l => l.Length > 0 && File.Exists(l))
                .Distinct(StringComparer.Ordinal)
                .Take(Capacity)
                .ToList();
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            return [];
        }
    }

    /// <summary>Puts <paramref name="projectPath"/> first; returns false (and leaves the list) when it cannot be written.</summary>
    public bool Add(string projectPath)
    {
        string full = Path.GetFullPath(projectPath);
        var list = new List<string> { full };
        list.AddRange(Read().Where(p => p != full));
        try
        {
            ProjectIO.AtomicFile.WriteAllText(FilePath, string.Join('\n', list.Take(Capacity)) + "\n", keepBackup: false);
            return true;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            return false;
        }
    }
}
