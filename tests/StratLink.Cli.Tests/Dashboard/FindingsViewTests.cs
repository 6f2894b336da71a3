using StratLink.Checks;
using StratLink.Cli.Dashboard;
using StratLink.Cli.Dashboard.Views;
using Terminal.Gui.Input;
using Xunit.Abstractions;

namespace StratLink.Tests.Dashboard;

[Collection("TerminalGui")]
public sealed class FindingsViewTests(ITestOutputHelper output)
{
    private static readonly string LongMessage = string.Join(" ", Enumerable.Range(1, 60).Select(i => $"word{i}")) + " end-of-message.";

    private static TestProject WithFindings()
    {
        var project = new TestProject();
        project.Loaded.Problems.Add(new Finding { Severity = Severity.Note, Code = "test.note", Message = "a note on T-1", Core = "T-1", Depth = 10 });
        project.Loaded.Problems.Add(new Finding { Severity = Severity.Warning, Code = "test.long", Message = LongMessage, Core = "T-2", Depth = 60 });
        project.Loaded.Problems.Add(new Finding { Severity = Severity.Error, Code = "test.error", Message = "an error in the file", File = project.FilePath, Line = 7 });
        project.Loaded.Problems.Add(new Finding { Severity = Severity.Warning, Code = "test.tie", Message = "about a tie", Item = "tb-1" });
        return project;
    }

    [Fact]
    public void The_selected_finding_is_shown_in_full_below_the_list()
    {
        using var project = WithFindings();
        using var h = new DashboardHarness(project);
        h.Type("4");
        h.Press(Key.CursorDown);
        output.WriteLine(h.ScreenText);
        Assert.Contains("finding 2 of 4", h.ScreenText);
        // The pane's lines, joined, hold the whole message (wrapped at word boundaries within 78 columns).
        var lines = h.ScreenText.Split('\n').Select(l => l.TrimEnd()).ToList();
        int rule = lines.FindIndex(l => l.Contains("finding 2 of 4"));
        string pane = string.Join(" ", lines.Skip(rule + 1).Select(l => l.Trim()).Where(l => l.Length > 0));
        Assert.Contains(LongMessage, pane);
        Assert.Contains("warning · test.long · T-2 60", pane);
        Assert.All(lines.Skip(rule + 1), l => Assert.True(l.Length <= 80));
        // Enter still goes to the place.
        h.Press(Key.Enter);
        Assert.Equal(Screen.Logs, h.Window.Current);
        Assert.Equal("T-2", h.Window.Logs.ActiveSlot!.CoreId);
        Assert.Equal(60, h.Window.Logs.ActiveSlot!.Cursor);
    }

    [Fact]
    public void Findings_filter_by_severity_and_by_core()
    {
        using var project = WithFindings();
        using var h = new DashboardHarness(project);
        h.Type("4");
        Assert.Equal(4, h.Window.Findings.Items.Count);
        h.Type("l");
        Assert.Equal(["test.long", "test.error", "test.tie"], h.Window.Findings.Items.Select(f => f.Code));
        h.Type("l");
        Assert.Equal(["test.error"], h.Window.Findings.Items.Select(f => f.Code));
        Assert.Contains("1 shown (errors, every core)", h.Row(2));
        h.Type("l");
        h.Type("c");
        Assert.Equal(["test.note", "test.tie"], h.Window.Findings.Items.Select(f => f.Code));
        h.Type("c");
        Assert.Equal(["test.long", "test.tie"], h.Window.Findings.Items.Select(f => f.Code));
        h.Type("c");
        Assert.Equal(["test.tie"], h.Window.Findings.Items.Select(f => f.Code));
        h.Type("c");
        Assert.Equal(4, h.Window.Findings.Items.Count);
    }

    [Fact]
    public void Header_and_the_empty_filter_message_fit_80_columns()
    {
        using var project = WithFindings();
        using var h = new DashboardHarness(project);
        h.Type("4");
        // Too long with the hint on Enter (the key line names it): the counts alone, whole.
        Assert.Equal(" Findings: 4 from the files, checks not run yet.", h.Row(2).TrimEnd());
        h.Type("l");
        h.Type("l");
        h.Type("c");
        output.WriteLine(h.ScreenText);
        Assert.Empty(h.Window.Findings.Items);
        Assert.EndsWith($"0 shown ({h.Window.Findings.FilterText()}).", h.Row(2).TrimEnd());
        // The message, wrapped below the header, names the filters in full.
        string message = string.Join(" ", Enumerable.Range(4, 4).Select(r => h.Row(r).Trim()).Where(l => l.Length > 0));
        Assert.Equal($"No finding passes the filters ({h.Window.Findings.FilterText()}); l and c change them.", message);
    }

    [Fact]
    public void Wrapping_keeps_every_word_and_splits_only_overlong_ones()
    {
        var lines = FindingsView.Wrap("aaa bbb ccccccccccccccccccccc dd", 10).ToList();
        Assert.Equal(["aaa bbb", "cccccccccc", "cccccccccc", "c dd"], lines);
    }
}
