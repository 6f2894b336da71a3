using System.Diagnostics;
using Xunit.Abstractions;

namespace StratLink.Tests.EndToEnd;

/// <summary>
/// The dashboard in a real terminal: tests/e2e/dashboard-tmux.sh drives the built program under tmux
/// (every core on the first screen, a tie between the first and last core, run, ages, the composite
/// scrolled to its deepest part and zoomed, the longest finding in full, save, quit) at 80x24 and 200x60.
/// In the TerminalGui collection so no headless UI test shares the machine's two cores meanwhile.
/// </summary>
[Collection("TerminalGui")]
public sealed class DashboardTmuxTests(ITestOutputHelper output)
{
    [Fact]
    public void The_dashboard_works_in_a_real_terminal()
    {
        string root = RepositoryRoot();
        var ensure = Execute(root, "bash", ["tests/tools/ensure-apt.sh", "tmux"], TimeSpan.FromMinutes(5));
        Assert.True(ensure.ExitCode == 0, "tmux is needed and could not be installed: " + ensure.Output);

        var e2e = Execute(root, "bash", ["tests/e2e/dashboard-tmux.sh"], TimeSpan.FromMinutes(8));
        output.WriteLine(e2e.Output);
        Assert.True(e2e.ExitCode == 0, $"dashboard-tmux.sh exited with {e2e.ExitCode}:\n{e2e.Output}");
        Assert.Contains("all checks passed", e2e.Output);
    }

    /// <summary>The folder holding StratLink.sln, found by walking up from the test assembly.</summary>
    private static string RepositoryRoot()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
            if (File.Exists(Path.Combine(dir.FullName, "StratLink.sln"))) return dir.FullName;
        throw new InvalidOperationException($"No StratLink.sln above {AppContext.BaseDirectory}.");
    }

    /// <summary>Runs a command with stdin closed, stdout and stderr merged; kills it after <paramref name="limit"/>.</summary>
    private static (int ExitCode, string Output) Execute(string workingDirectory, string file, string[] arguments, TimeSpan limit)
    {
        var start = new ProcessStartInfo(file)
        {
            WorkingDirectory = workingDirectory,
            RedirectStandardInput = true,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        foreach (string a in arguments) start.ArgumentList.Add(a);
        // The headless tests' setting must not reach the program the script starts under tmux (it would draw nothing).
        start.Environment.Remove("DisableRealDriverIO");
        using var process = Process.Start(start) ?? throw new InvalidOperationException($"Could not start {file}.");
        process.StandardInput.Close();
        var text = new System.Text.StringBuilder();
        var gate = new object();
        process.OutputDataReceived += (_, e) => { if (e.Data is not null) lock (gate) text.AppendLine(e.Data); };
        process.ErrorDataReceived += (_, e) => { if (e.Data is not null) lock (gate) text.AppendLine(e.Data); };
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
        if (!process.WaitForExit(limit))
        {
            process.Kill(entireProcessTree: true);
            process.WaitForExit();
            lock (gate) return (-1, text + $"\n(killed after {limit.TotalSeconds:0} s)");
        }
        process.WaitForExit();
        lock (gate) return (process.ExitCode, text.ToString());
    }
}
