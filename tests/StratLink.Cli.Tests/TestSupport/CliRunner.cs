using StratLink.Cli;

namespace StratLink.Tests.TestSupport;

/// <summary>Runs a verb in-process and returns its exit code and what it printed.</summary>
public static class CliRunner
{
    public static (int Code, string Out, string Err) Run(params string[] args)
    {
        var stdout = new StringWriter();
        var stderr = new StringWriter();
        int code = CliApp.Run(args, stdout, stderr, stderrIsTerminal: false);
        return (code, stdout.ToString(), stderr.ToString());
    }

    /// <summary>A fresh copy of the demo project in a temporary folder; returns the project file's path.</summary>
    public static string CopyDemo(string into)
    {
        foreach (string file in Directory.GetFiles(RepoPaths.DemoDirectory, "*", SearchOption.AllDirectories))
        {
            string target = Path.Combine(into, Path.GetRelativePath(RepoPaths.DemoDirectory, file));
            Directory.CreateDirectory(Path.GetDirectoryName(target)!);
            File.Copy(file, target);
        }
        return Directory.GetFiles(into, "*.stratlink.yaml").Single();
    }
}
