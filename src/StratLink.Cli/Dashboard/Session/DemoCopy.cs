namespace StratLink.Cli.Dashboard.Session;

/// <summary>
/// The demo site is opened from a working copy in the user's data folder
/// ($XDG_DATA_HOME/stratlink/demo, else ~/.local/share/stratlink/demo), so edits never touch the
/// shipped files. The shipped demo is the <c>projects-demo</c> folder found beside the program or
/// above it (a source checkout).
/// </summary>
public static class DemoCopy
{
    public const string FolderName = "projects-demo";

    /// <summary>The shipped demo folder, or null when this installation has none.</summary>
    public static string? FindShipped(string startDirectory)
    {
        for (var dir = new DirectoryInfo(startDirectory); dir is not null; dir = dir.Parent)
        {
            string candidate = Path.Combine(dir.FullName, FolderName);
            if (Directory.Exists(candidate) && FindProjectFile(candidate) is not null) return candidate;
        }
        return null;
    }

    public static string WorkingFolder(Func<string, string?> getEnv)
    {
        string? xdg = getEnv("XDG_DATA_HOME");
        string baseDir = !string.IsNullOrWhiteSpace(xdg) && Path.IsPathRooted(xdg)
            ? xdg
            : Path.Combine(getEnv("HOME") ?? Environment.GetFolderPath(Environment.SpecialFolder.UserProfile), ".local", "share");
        return Path.Combine(baseDir, "stratlink", "demo");
    }

    /// <summary>Copies the shipped demo into <paramref name="workingFolder"/> unless a copy is there already; returns the copy's project file.</summary>
    public static string? Prepare(string shipped, string workingFolder)
    {
        if (FindProjectFile(workingFolder) is { } existing) return existing;
        foreach (string file in Directory.EnumerateFiles(shipped, "*", SearchOption.AllDirectories))
        {
            string target = Path.Combine(workingFolder, Path.GetRelativePath(shipped, file));
            Directory.CreateDirectory(Path.GetDirectoryName(target)!);
            File.Copy(file, target, overwrite: false);
        }
        return FindProjectFile(workingFolder);
    }

    /// <summary>The project file of a demo folder: the first YAML file at its top level or one level down.</summary>
    public static string? FindProjectFile(string folder)
    {
        if (!Directory.Exists(folder)) return null;
        return Directory.EnumerateFiles(folder, "*.yaml").Where(f => !Path.GetFileName(f).StartsWith('.')).Order(StringComparer.Ordinal).FirstOrDefault()
            ?? Directory.EnumerateDirectories(folder).Order(StringComparer.Ordinal)
                .SelectMany(d => Directory.EnumerateFiles(d, "*.yaml").Where(f => !Path.GetFileName(f).StartsWith('.')).Order(StringComparer.Ordinal))
                .FirstOrDefault();
    }
}
