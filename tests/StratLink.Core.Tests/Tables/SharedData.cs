namespace StratLink.Tests.Tables;

/// <summary>
/// The open datasets in ../shared/data beside the repository (see PROVENANCE.md there). A test that
/// cannot find them fails: a silent skip would hide that the checks against real files never ran.
/// </summary>
internal static class SharedData
{
    public static string Folder { get; } = Find();

    public static string File(string relative)
    {
        string path = Path.Combine(Folder, relative);
        if (!System.IO.File.Exists(path)) throw new FileNotFoundException($"shared data file missing: {path}");
        return path;
    }

    private static string Find()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            if (!System.IO.File.Exists(Path.Combine(dir.FullName, "StratLink.sln"))) continue;
            string data = Path.GetFullPath(Path.Combine(dir.FullName, "..", "shared", "data"));
            if (Directory.Exists(data)) return data;
            throw new DirectoryNotFoundException($"shared data folder missing: expected {data} beside the repository root {dir.FullName}");
        }
        throw new DirectoryNotFoundException($"no StratLink.sln above {AppContext.BaseDirectory}, so ../shared/data cannot be located");
    }
}
