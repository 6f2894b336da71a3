namespace StratLink.Tests.AgeModelling;

/// <summary>Finds ../shared/data beside the repository root (the folder holding StratLink.sln); fails loudly when missing.</summary>
internal static class SharedDataFolder
{
    public static string Path(params string[] parts)
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(System.IO.Path.Combine(dir.FullName, "StratLink.sln"))) dir = dir.Parent;
        if (dir is null) throw new InvalidOperationException($"No StratLink.sln above {AppContext.BaseDirectory}: cannot find the shared data folder.");
        string data = System.IO.Path.GetFullPath(System.IO.Path.Combine(dir.FullName, "..", "shared", "data"));
        string path = System.IO.Path.Combine([data, .. parts]);
        if (!File.Exists(path) && !Directory.Exists(path))
            throw new FileNotFoundException($"Shared test data missing: {path} (expected ../shared/data beside the repository root {dir.FullName}).", path);
        return path;
    }

    public static string IntCal20 => Path("calibration-curves", "intcal20.14c");
    public static string Marine20 => Path("calibration-curves", "marine20.14c");
}
