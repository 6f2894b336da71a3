using StratLink.Cli.Dashboard;
using StratLink.Cli.Dashboard.Editing;
using StratLink.Cli.Dashboard.Keys;
using StratLink.Cli.Dashboard.Results;
using StratLink.Cli.Dashboard.Session;
using StratLink.Cli.Dashboard.Views;
using Terminal.Gui.Drivers;

namespace StratLink.Tests.Dashboard;

public sealed class ModelTests
{
    [Fact]
    public void Every_key_means_one_thing_on_each_screen()
    {
        foreach (var screen in Screens.All)
        {
            var keys = KeyTable.Entries.Where(e => e.AppliesTo(screen))
                .SelectMany(e => e.Keys.Select(k => (Key: k, e.Everywhere, e.Command)))
                .ToList();
            // Screen rows may override a global row for the same key; two rows of the same scope may not share a key.
            foreach (var group in keys.GroupBy(k => (k.Key.Code, k.Key.Character, k.Everywhere)))
                Assert.True(group.Count() == 1, $"{screen}: key {group.Key} bound to {string.Join(", ", group.Select(g => g.Command))}");
        }
    }

    [Fact]
    public void Toolkit_reserved_keys_are_not_bound_to_commands()
    {
        // Terminal.Gui defaults (toolkit notes, pitfall 3): F5 refresh, F6 focus group, F10 menu, Ctrl+Z suspend.
        var reserved = new[] { KeyCode.F5, KeyCode.F6, KeyCode.F10, KeyCode.Z | KeyCode.CtrlMask };
        Assert.DoesNotContain(KeyTable.Entries.SelectMany(e => e.Keys), k => reserved.Contains(k.Code) && k.Character is null);
        // Esc is bound, but only to the harmless Back, so it never quits the dashboard.
        Assert.Equal(DashCommand.Back, Assert.Single(KeyTable.Entries, e => e.Keys.Any(k => k.Code == KeyCode.Esc)).Command);
    }

    [Fact]
    public void Status_line_keeps_quit_within_80_columns_on_every_screen()
    {
        foreach (var screen in Screens.All)
        {
            string line = KeyTable.StatusLine(screen, 79);
            Assert.True(line.Length <= 79);
            Assert.Contains("q Quit", line);
            Assert.StartsWith("F1 Keys", line);
        }
    }

    [Fact]
    public void Undo_and_redo_walk_the_snapshots_and_track_saved_and_stale()
    {
        using var project = new TestProject();
        var state = new DashboardState(project.Loaded);
        var p0 = state.Project;
        state.SetResults(new RunResults { Project = p0, FinishedAt = DateTimeOffset.UnixEpoch });
        Assert.Equal(ResultsState.Current, state.ResultsState);
        var p1 = TieEdits.AddTie(p0, "T-1", 10, "T-2", 12).Project!;
        state.Apply(p1, "add tie tie-1");
        Assert.False(state.IsSaved);
        Assert.Equal(ResultsState.Stale, state.ResultsState);
        Assert.Equal("add tie tie-1", state.Undo());
        Assert.Same(p0, state.Project);
        Assert.True(state.IsSaved);
        Assert.Equal(ResultsState.Current, state.ResultsState);
        Assert.Equal("add tie tie-1", state.Redo());
        Assert.Same(p1, state.Project);
        state.MarkSaved(p1);
        Assert.True(state.IsSaved);
        Assert.Null(state.Redo());
        // A new edit clears the redo stack.
        state.Undo();
        state.Apply(TieEdits.SetKind(state.Project, "ash-1", StratLink.Model.MarkerKind.Event).Project!, "kind");
        Assert.False(state.CanRedo);
    }

    [Fact]
    public void Tie_edits_validate_names_and_round_depths()
    {
        using var project = new TestProject();
        var p = project.Loaded.Project;
        var added = TieEdits.AddTie(p, "T-1", 10.123456, "T-3", 9.5);
        Assert.Equal(10.12, added.Project!.FindMarker("tie-1")!.DepthIn("T-1")!.Value.In(p.DepthUnit));
        Assert.False(TieEdits.AddTie(p, "T-1", 1, "T-1", 2).Succeeded);
        Assert.False(TieEdits.RenameTie(p, "ash-1", "tb-1").Succeeded);
        Assert.False(TieEdits.RenameTie(p, "ash-1", "bad name").Succeeded);
        Assert.False(TieEdits.DeleteTie(p, "ash-1").Succeeded);
        Assert.True(TieEdits.DeleteTie(p, "tb-1").Succeeded);
        // Extending a tie to a core it lacks adds that core.
        var extended = TieEdits.MoveTie(p, "ash-1", "T-3", 40).Project!;
        Assert.Equal(3, extended.FindMarker("ash-1")!.Depths.Count);
        Assert.Equal("tie-2", TieEdits.NextTieId(added.Project!));
    }

    [Fact]
    public void Recent_list_keeps_existing_files_newest_first()
    {
        using var project = new TestProject();
        string config = Path.Combine(project.Folder, "config");
        var recent = new RecentProjects(config);
        Assert.Empty(recent.Read());
        string other = Path.Combine(project.Folder, "other.yaml");
        File.WriteAllText(other, "x");
        Assert.True(recent.Add(project.FilePath));
        Assert.True(recent.Add(other));
        Assert.True(recent.Add(project.FilePath));
        Assert.Equal([project.FilePath, other], recent.Read());
        File.Delete(other);
        Assert.Equal([project.FilePath], recent.Read());
    }

    [Fact]
    public void Config_folder_follows_xdg_and_falls_back_to_home()
    {
        Assert.Equal("/x/cfg/stratlink", ConfigDirectory.Resolve(n => n == "XDG_CONFIG_HOME" ? "/x/cfg" : null));
        Assert.Equal("/home/u/.config/stratlink", ConfigDirectory.Resolve(n => n == "HOME" ? "/home/u" : null));
        // XDG base directory spec: a relative XDG_CONFIG_HOME is invalid and ignored.
        Assert.Equal("/home/u/.config/stratlink", ConfigDirectory.Resolve(n => n switch { "HOME" => "/home/u", "XDG_CONFIG_HOME" => "rel", _ => null }));
    }

    [Fact]
    public void Recovery_offer_restores_the_edits_as_one_undoable_step()
    {
        using var project = new TestProject();
        var recovery = new RecoveryFile(project.FilePath);
        var edited = TieEdits.AddTie(project.Loaded.Project, "T-1", 30, "T-2", 28).Project!;
        recovery.Write(edited);
        var state = new DashboardState(project.Loaded);
        var prompts = new ScriptedPrompts();
        prompts.Choices.Enqueue(0);
        Assert.NotNull(DashboardLauncher.OfferRecovery(prompts, recovery, state));
        Assert.NotNull(state.Project.FindMarker("tie-1"));
        Assert.False(state.IsSaved);
        state.Undo();
        Assert.Null(state.Project.FindMarker("tie-1"));
    }

    [Fact]
    public void Nice_steps_follow_the_1_2_5_ladder()
    {
        Assert.Equal(20, CorrelationView.NiceAtLeast(11.1), 9);
        Assert.Equal(0.5, CorrelationView.NiceAtLeast(0.31), 9);
        Assert.Equal(10, CorrelationView.NiceStep(20, -1), 9);
        Assert.Equal(5, CorrelationView.NiceStep(10, -1), 9);
        Assert.Equal(50, CorrelationView.NiceStep(20, 1), 9);
    }

    [Fact]
    public void Without_a_terminal_the_dashboard_says_so_and_exits_2()
    {
        // Test runs have no terminal on stdin/stdout (redirected by the runner).
        if (Driver.IsAttachedToTerminal(out _, out _)) return;
        var err = new StringWriter();
        int code = StratLink.Cli.CliApp.Run([], new StringWriter(), err, stderrIsTerminal: false);
        Assert.Equal(2, code);
        Assert.Contains("needs a terminal", err.ToString());
    }
}
