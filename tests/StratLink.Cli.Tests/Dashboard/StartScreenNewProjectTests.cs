using StratLink.Cli.Dashboard;
using StratLink.Cli.Dashboard.Session;
using StratLink.Tests.TestSupport;

namespace StratLink.Tests.Dashboard;

/// <summary>The start screen's "new project from tables": the draft of `stratlink new`, confirmed, written, then opened.</summary>
public sealed class StartScreenNewProjectTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("stratlink-start-new-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public void A_folder_of_core_tables_becomes_the_project_that_opens()
    {
        string cores = Path.Combine(_dir, "cores");
        Directory.CreateDirectory(cores);
        foreach (string f in Directory.GetFiles(Path.Combine(RepoPaths.DemoDirectory, "cores"), "MW19-??.csv"))
            File.Copy(f, Path.Combine(cores, Path.GetFileName(f)));
        var prompts = new ScriptedPrompts();
        prompts.Choices.Enqueue(NewEntryIndex());   // "New project from tables..."
        prompts.Texts.Enqueue(cores);
        prompts.Choices.Enqueue(0);                 // "Write it and open it"
        string? chosen = DashboardLauncher.PickProject(prompts, new RecentProjects(Path.Combine(_dir, "config")), _ => Path.Combine(_dir, "work"));
        Assert.Equal(Path.Combine(cores, "cores.stratlink.yaml"), chosen);
        Assert.True(File.Exists(chosen));
        Assert.Contains("New project from tables", prompts.Asked);
    }

    [Fact]
    public void Tables_that_make_no_project_write_nothing_and_the_screen_says_why()
    {
        string folder = Path.Combine(_dir, "none");
        Directory.CreateDirectory(folder);
        var prompts = new ScriptedPrompts();
        prompts.Choices.Enqueue(NewEntryIndex());
        prompts.Texts.Enqueue(folder);
        // Then the start screen again, closed.
        Assert.Null(DashboardLauncher.PickProject(prompts, new RecentProjects(Path.Combine(_dir, "config")), _ => Path.Combine(_dir, "work")));
        Assert.Empty(Directory.GetFileSystemEntries(folder));
    }

    /// <summary>No recent projects; the shipped demo is listed when the build output carries it; then open, new, quit.</summary>
    private static int NewEntryIndex() => DemoCopy.FindShipped(AppContext.BaseDirectory) is null ? 1 : 2;
}
