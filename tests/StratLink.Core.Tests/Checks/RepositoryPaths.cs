namespace StratLink.Tests.Checks;

/// <summary>Folders the checks tests need: the repository root and the shared open data beside it.</summary>
internal static class RepositoryPaths
{
    /// <summary>The folder holding StratLink.sln, found by walking up from the test assembly.</summary>
    public static string Root
    {
        get
        {
            for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
                if (File.Exists(Path.Combine(dir.FullName, "StratLink.sln"))) return dir.FullName;
            throw new InvalidOperationException($"No StratLink.sln above {AppContext.BaseDirectory}.");
        }
    }

    /// <summary>../shared/data relative to the repository root; fails loudly when it is missing.</summary>
    public static string SharedData
    {
        get
        {
            string path = Path.GetFullPath(Path.Combine(Root, "..", "shared", "data"));
            if (!Directory.Exists(path)) throw new DirectoryNotFoundException($"Shared open data not found at {path}.");
            return path;
        }
    }

    /// <summary>
    /// The built save-stress program: same configuration and framework folders as this test assembly,
    /// under tests/StratLink.SaveStress (the test project builds it first without referencing it).
    /// </summary>
    public static string SaveStressDll
    {
        get
        {
            string testDir = AppContext.BaseDirectory.TrimEnd(Path.DirectorySeparatorChar);
            string framework = Path.GetFileName(testDir);
            string configuration = Path.GetFileName(Path.GetDirectoryName(testDir)!);
            string dll = Path.Combine(Root, "tests", "StratLink.SaveStress", "bin", configuration, framework, "StratLink.SaveStress.dll");
            if (!File.Exists(dll)) throw new FileNotFoundException($"The save-stress program is not built at {dll}.", dll);
            return dll;
        }
    }
}
