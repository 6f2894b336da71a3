using StratLink.Model;
using StratLink.ProjectIO;
using Terminal.Gui.Input;

namespace StratLink.Tests.Dashboard;

[Collection("TerminalGui")]
public sealed class TieEditingKeyTests
{
    private static double? DepthIn(Project p, string marker, string core) => p.FindMarker(marker)?.DepthIn(core)?.In(p.DepthUnit);

    [Fact]
    public void Add_move_delete_undo_redo_a_tie_by_keys()
    {
        using var project = new TestProject();
        using var h = new DashboardHarness(project);
        // 20 cm per row: T-1 cursor to 60 cm, T-2 cursor to 40 cm, back to T-1, tie.
        h.Press(Key.CursorDown, Key.CursorDown, Key.CursorDown, Key.CursorRight, Key.CursorDown, Key.CursorDown, Key.CursorLeft);
        h.Type("t");
        Assert.Equal(60, DepthIn(h.State.Project, "tie-1", "T-1"));
        Assert.Equal(40, DepthIn(h.State.Project, "tie-1", "T-2"));
        Assert.Equal(MarkerKind.Other, h.State.Project.FindMarker("tie-1")!.Kind);
        Assert.Equal("tie-1", h.Window.Logs.SelectedTie);
        Assert.Contains("UNSAVED", h.Row(0));
        Assert.Contains("Add tie tie-1", h.Row(22));

        // Move: the selected tie follows the cursor in the active log, in quarter-row steps too.
        h.Press(Key.CursorDown, Key.CursorDown.WithShift);
        h.Type("m");
        Assert.Equal(85, DepthIn(h.State.Project, "tie-1", "T-1"));
        Assert.Equal(40, DepthIn(h.State.Project, "tie-1", "T-2"));

        h.Press(Key.Delete);
        Assert.Null(h.State.Project.FindMarker("tie-1"));
        Assert.Null(h.Window.Logs.SelectedTie);

        h.Type("u");
        Assert.Equal(85, DepthIn(h.State.Project, "tie-1", "T-1"));
        h.Type("u");
        Assert.Equal(60, DepthIn(h.State.Project, "tie-1", "T-1"));
        h.Type("u");
        Assert.Null(h.State.Project.FindMarker("tie-1"));
        Assert.True(h.State.IsSaved);
        Assert.Contains("saved", h.Row(0));
        Assert.DoesNotContain("UNSAVED", h.Row(0));
        h.Type("U");
        Assert.Equal(60, DepthIn(h.State.Project, "tie-1", "T-1"));
        h.Type("UU");
        Assert.Null(h.State.Project.FindMarker("tie-1"));
        h.Type("U");
        Assert.Contains("Nothing to redo", h.Row(22));
    }

    [Fact]
    public void Next_tie_selects_and_the_tie_can_be_renamed_and_given_a_kind()
    {
        using var project = new TestProject();
        using var h = new DashboardHarness(project);
        h.Type("]");
        Assert.Equal("ash-1", h.Window.Logs.SelectedTie);
        Assert.Equal(50, h.Window.Logs.ActiveSlot!.Cursor);
        Assert.Contains("Tie ash-1 (tephra): T-1 50, T-2 45 cm", h.Row(22));
        h.Type("]");
        Assert.Equal("tb-1", h.Window.Logs.SelectedTie);
        h.Type("[");
        Assert.Equal("ash-1", h.Window.Logs.SelectedTie);

        h.Prompts.Texts.Enqueue("ash-A");
        h.Type("n");
        Assert.Null(h.State.Project.FindMarker("ash-1"));
        Assert.NotNull(h.State.Project.FindMarker("ash-A"));
        // The age control placed at the tie follows the new name.
        Assert.Equal("ash-A", h.State.Project.Ages.OfType<CalendarAgeControl>().Single(a => a.Id == "ash-1-age").Marker);
        Assert.Equal("ash-A", h.Window.Logs.SelectedTie);

        h.Prompts.Choices.Enqueue((int)MarkerKind.Flood);
        h.Type("k");
        Assert.Equal(MarkerKind.Flood, h.State.Project.FindMarker("ash-A")!.Kind);

        // Deleting a tie that dates an age control is refused with the reason.
        h.Press(Key.Delete);
        Assert.NotNull(h.State.Project.FindMarker("ash-A"));
        Assert.Contains("ash-1-age", h.Row(22));
    }

    [Fact]
    public void Tie_edits_without_a_selection_say_how_to_select()
    {
        using var project = new TestProject();
        using var h = new DashboardHarness(project);
        h.Type("m");
        Assert.Contains("Select a tie first", h.Row(22));
        Assert.True(h.State.IsSaved);
    }

    [Fact]
    public void The_save_message_of_a_long_project_name_fits_80_columns()
    {
        using var project = new TestProject(fileName: "mirrowick-fjord.stratlink.yaml");
        using var h = new DashboardHarness(project);
        h.Press(Key.CursorDown);
        h.Type("t");
        h.Type("s");
        Assert.True(File.Exists(project.FilePath + ".bak"));
        Assert.Contains(" Saved mirrowick-fjord.stratlink.yaml (the previous version as .bak).", h.ScreenText);
    }

    [Fact]
    public void Every_edit_writes_the_recovery_file_and_saving_removes_it()
    {
        using var project = new TestProject();
        using var h = new DashboardHarness(project);
        h.Press(Key.CursorDown);
        h.Type("t");
        Assert.True(File.Exists(h.Recovery.FilePath));
        var recovered = h.Recovery.Read().Project!;
        Assert.Equal(20, DepthIn(recovered, "tie-1", "T-1"));

        h.Type("s");
        Assert.False(File.Exists(h.Recovery.FilePath));
        Assert.True(File.Exists(project.FilePath + ".bak"));
        var saved = ProjectReader.Load(project.FilePath).Project!;
        Assert.Equal(20, DepthIn(saved, "tie-1", "T-1"));
        Assert.Equal(0, DepthIn(saved, "tie-1", "T-2"));
        Assert.Contains("saved", h.Row(0));
        Assert.DoesNotContain("UNSAVED", h.Row(0));
    }

    [Fact]
    public void Space_on_the_ages_screen_toggles_a_controls_exclusion()
    {
        using var project = new TestProject();
        using var h = new DashboardHarness(project);
        h.Type("2");
        Assert.Contains("Age model not run yet", h.ScreenText);
        h.Type("]");
        h.Press(Key.Space);
        Assert.True(h.State.Project.Ages.Single(a => a.Id == "top").Exclude);
        Assert.Contains(h.ScreenText.Split('\n'), l => l.StartsWith(" out top "));
        h.Type("u");
        Assert.False(h.State.Project.Ages.Single(a => a.Id == "top").Exclude);
    }

    [Fact]
    public void Help_lists_every_key_of_the_table_and_the_caution()
    {
        using var project = new TestProject();
        using var h = new DashboardHarness(project);
        h.Press(Key.F1);
        var lines = Assert.Single(h.Prompts.Shown);
        string text = string.Join("\n", lines);
        foreach (var e in StratLink.Cli.Dashboard.Keys.KeyTable.Entries) Assert.Contains(e.KeysText, text);
        Assert.Contains("qualified specialists", text);
        // Every line fits the help page at 80 columns (the dialog's frame takes two).
        Assert.All(lines, l => Assert.True(l.Length <= 78, $"{l.Length} characters: {l}"));
    }
}
