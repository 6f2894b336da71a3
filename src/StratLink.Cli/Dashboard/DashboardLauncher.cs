using StratLink.Checks;
using StratLink.Cli.Dashboard.Dialogs;
using StratLink.Cli.Dashboard.Drawing;
using StratLink.Cli.Dashboard.Session;
using StratLink.Cli.Dashboard.Views;
using StratLink.Workflows;
using Terminal.Gui.App;
using Terminal.Gui.Drivers;

namespace StratLink.Cli.Dashboard;

/// <summary>
/// Starts the dashboard: refuses without a terminal, opens the given project or offers the recent
/// ones, the demo and a new project drafted from tables, offers unsaved edits from a lost session back, then runs the window.
/// </summary>
public static class DashboardLauncher
{
    public static int Run(string? projectPath, CliContext ctx)
    {
        // Without a terminal (CI, a pipe) the toolkit would draw nowhere and wait for keys forever.
        if (!Driver.IsAttachedToTerminal(out bool input, out bool output))
        {
            ctx.Fail($"the dashboard needs a terminal (standard input is {(input ? "" : "not ")}one, standard output is {(output ? "" : "not ")}one). " +
                     "In scripts use the verbs: stratlink --help.");
            return ExitCodes.Usage;
        }
        Func<string, string?> env = Environment.GetEnvironmentVariable;
        var workflows = new LibraryWorkflows();
        var glyphs = GlyphSet.FromLocale(env);
        var recent = new RecentProjects(ConfigDirectory.Resolve(env));

        LoadedProject? loaded = null;
        if (projectPath is not null)
        {
            loaded = workflows.Load(projectPath, ctx.Cancellation);
            if (Unusable(loaded, ctx)) return ExitCodes.Usage;
        }

        string? failure = null;
        using (IApplication app = Application.Create().Init())
        {
            var prompts = new DialogPrompts(app, glyphs);
            if (loaded is null)
            {
                string? chosen = PickProject(prompts, recent, env);
                if (chosen is null) return ExitCodes.Success;
                loaded = workflows.Load(chosen, ctx.Cancellation);
                if (loaded.Document.Project is null) failure = chosen;
            }
            if (failure is null)
            {
                var state = new DashboardState(loaded);
                var recovery = new RecoveryFile(loaded.FilePath);
                OfferRecovery(prompts, recovery, state);
                recent.Add(loaded.FilePath);
                using var window = new DashboardWindow(app, state, workflows, prompts, glyphs, recovery, recent);
                app.Run(window);
            }
        }
        // Reported after the toolkit has given the terminal back, so the message stays readable.
        if (failure is not null && Unusable(loaded!, ctx)) return ExitCodes.Usage;
        return ExitCodes.Success;
    }

    /// <summary>True (after printing why) when the project file could not be read at all.</summary>
    private static bool Unusable(LoadedProject loaded, CliContext ctx)
    {
        if (loaded.Document.Project is not null) return false;
        foreach (var f in loaded.Problems.Where(p => p.Severity == Severity.Error)) ctx.Error.WriteLine(f.ToString());
        ctx.Fail($"cannot open {loaded.FilePath}");
        return true;
    }

    /// <summary>The start screen when no project is named: recent projects, the demo, a path typed in, or a new project from tables.</summary>
    internal static string? PickProject(IPrompts prompts, RecentProjects recent, Func<string, string?> env)
    {
        var recentPaths = recent.Read();
        string? shipped = DemoCopy.FindShipped(AppContext.BaseDirectory);
        string working = DemoCopy.WorkingFolder(env);
        var options = recentPaths.Select(p => "Recent: " + p).ToList();
        if (shipped is not null) options.Add($"The demo site (a working copy in {working})");
        options.Add("Open a project file by its path...");
        options.Add("New project from tables...");
        options.Add("Quit");
        string message = recentPaths.Count == 0 && shipped is null
            ? "No recent projects. Type a project file's path, or start with: stratlink PROJECT.yaml"
            : "Open which project?";
        while (true)
        {
            int? pick = prompts.Choose("StratLink", message, options);
            if (pick is null || pick == options.Count - 1) return null;
            if (pick < recentPaths.Count) return recentPaths[pick.Value];
            if (shipped is not null && pick == recentPaths.Count)
            {
                try
                {
                    if (DemoCopy.Prepare(shipped, working) is { } demo) return demo;
                    message = $"The demo in {shipped} has no project file.";
                }
                catch (Exception e) when (e is IOException or UnauthorizedAccessException)
                {
                    message = $"Could not copy the demo to {working}: {e.Message}";
                }
                continue;
            }
            if (pick == options.Count - 2)
            {
                if (NewFromTables(prompts, out string problem) is { } created) return created;
                if (problem.Length > 0) message = problem;
                continue;
            }
            string? typed = prompts.AskText("Open", "Project file:", Directory.GetCurrentDirectory() + Path.DirectorySeparatorChar);
            if (typed is null) continue;
            typed = typed.Trim();
            if (File.Exists(typed)) return Path.GetFullPath(typed);
            message = $"There is no file {typed}.";
        }
    }

    /// <summary>The start screen's "new project from tables": the same draft as <c>stratlink new</c>, confirmed before it is written.</summary>
    private static string? NewFromTables(IPrompts prompts, out string problem)
    {
        problem = "";
        string? folder = prompts.AskText("New project from tables", "Folder of core tables:", Directory.GetCurrentDirectory() + Path.DirectorySeparatorChar);
        if (string.IsNullOrWhiteSpace(folder)) return null;
        var plan = NewProjectWorkflow.Draft([folder.Trim()], null);
        if (!plan.CanWrite)
        {
            problem = "No project: " + plan.Problems.First(p => p.Severity == Severity.Error);
            return null;
        }
        if (File.Exists(plan.ProjectPath))
        {
            problem = $"{plan.ProjectPath} exists already; open it instead.";
            return null;
        }
        string summary = $"{plan.Cores.Count} core(s): {string.Join(", ", plan.Cores.Select(c => c.Spec.Id))}\n" +
                         $"reference {plan.Reference}, signals {string.Join(", ", plan.Signals)}\nwrite {plan.ProjectPath}?";
        if (prompts.Choose("New project from tables", summary, ["Write it and open it", "Cancel"], 0) != 0) return null;
        try
        {
            NewProjectWorkflow.Write(plan);
            return plan.ProjectPath;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            problem = $"Could not write {plan.ProjectPath}: {e.Message}";
            return null;
        }
    }

    /// <summary>Offers the edits of a lost session back; returns the recovery time when they were restored.</summary>
    internal static string? OfferRecovery(IPrompts prompts, RecoveryFile recovery, DashboardState state)
    {
        if (!recovery.Exists) return null;
        string when = recovery.WrittenAt?.ToString("yyyy-MM-dd HH:mm", System.Globalization.CultureInfo.InvariantCulture) ?? "?";
        int? pick = prompts.Choose("Unsaved edits found",
            $"Edits to this project from {when} were never saved\n(kept in {Path.GetFileName(recovery.FilePath)}).",
            ["Restore them (then s saves them)", "Discard them", "Decide later (keep the file)"], 0);
        if (pick == 1) recovery.Delete();
        if (pick != 0) return null;
        var document = recovery.Read();
        if (document.Project is null) return null;
        state.Apply(document.Project, "restore unsaved edits from " + when);
        return when;
    }
}
