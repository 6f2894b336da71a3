using System.Diagnostics;

namespace StratLink.Tests.TestSupport;

/// <summary>Locations the tests rely on: the repository root, the shared open datasets beside it, the demo project.</summary>
public static class RepoPaths
{
    private static readonly Lazy<string> RootLazy = new(() =>
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
            if (File.Exists(Path.Combine(dir.FullName, "StratLink.sln"))) return dir.FullName;
        throw new InvalidOperationException($"StratLink.sln not found above {AppContext.BaseDirectory}.");
    });

    public static string Root => RootLazy.Value;

    /// <summary>The open datasets (../shared/data from the repository root). Missing data fails the test loudly.</summary>
    public static string SharedData
    {
        get
        {
            string dir = Path.GetFullPath(Path.Combine(Root, "..", "shared", "data"));
            if (!Directory.Exists(dir))
                throw new DirectoryNotFoundException($"The shared open datasets are missing: expected {dir} (see the README: tests read ../shared/data).");
            return dir;
        }
    }

    public static string Data(params string[] parts) => Path.Combine([SharedData, .. parts]);

    public static string DemoDirectory => Path.Combine(Root, "projects-demo");

    /// <summary>Makes sure Debian packages a test drives are installed (installs them when running as root).</summary>
    public static void EnsureAptPackages(params string[] packages)
    {
        var psi = new ProcessStartInfo("bash", [Path.Combine(Root, "tests", "tools", "ensure-apt.sh"), .. packages])
        {
            RedirectStandardError = true,
            RedirectStandardOutput = true,
        };
        using var p = Process.Start(psi)!;
        string err = p.StandardError.ReadToEnd();
        p.StandardOutput.ReadToEnd();
        p.WaitForExit();
        if (p.ExitCode != 0)
            throw new InvalidOperationException($"Could not install {string.Join(", ", packages)}: {err}");
    }
}
