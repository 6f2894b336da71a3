using StratLink.Checks;
using StratLink.Cli.Dashboard;
using StratLink.Cli.Dashboard.Drawing;
using StratLink.Cli.Dashboard.Views;
using Terminal.Gui.Input;
using Xunit.Abstractions;

namespace StratLink.Tests.Dashboard;

[Collection("TerminalGui")]
public sealed class CorrelationViewTests(ITestOutputHelper output)
{
    internal static bool IsBraille(string g) => g.Length == 1 && g[0] is >= '\u2801' and <= '\u28FF';

    [Fact]
    public void Draws_every_core_with_header_site_strip_and_keys_at_80x24()
    {
        using var project = new TestProject();
        using var h = new DashboardHarness(project);
        output.WriteLine(h.ScreenText);
        Assert.Contains("Testmere Basin", h.Row(0));
        Assert.Contains("testmere.yaml", h.Row(0));
        Assert.Contains("saved", h.Row(0));
        Assert.Contains("not run yet", h.Row(0));
        Assert.Contains("1 Logs", h.Row(1));
        Assert.Contains("3 of 3 cores shown", h.Row(1));
        // The site strip lists every core with its depth span, the shown ones in brackets.
        Assert.Contains("[T-1 0-200] [T-2 0-200] [T-3 0-200]", h.Row(2));
        Assert.Contains("▸T-1 · ms", h.Row(3));
        Assert.Contains("T-2 · ms", h.Row(3));
        Assert.Contains("T-3 · ms", h.Row(3));
        Assert.StartsWith(" F1 Keys", h.Row(23));
        Assert.Contains("+/- Zoom", h.Row(23));
        Assert.Contains("q Quit", h.Row(23));
        // The plot area of the first log (columns 7..23, rows 4..19) holds braille curve cells.
        int curveCells = Enumerable.Range(4, 16).Sum(r => Enumerable.Range(7, 17).Count(c => IsBraille(h.Cell(r, c))));
        Assert.True(curveCells > 30, $"only {curveCells} braille cells in the first log");
        // Readout row: cursor depth and value; the detail line gives the active log's value range.
        Assert.Contains("0.00 cm", h.Row(20));
        Assert.Contains("T-1 ms", h.Row(21));
        Assert.Contains("% clipped", h.Row(21));
    }

    [Fact]
    public void Gaps_disturbed_intervals_and_ties_are_marked()
    {
        using var project = new TestProject();
        using var h = new DashboardHarness(project);
        // 20 cm per row (200 cm core in 16 rows, next 1-2-5 step): T-2's gap 80-85 cm is plot row 4 (screen row 8),
        // T-1's disturbed 0-4 cm is plot row 0 (screen row 4). Three logs: 7 axis + 17 plot + 4 gutter columns each.
        Assert.Equal(20, h.Window.Logs.DepthPerRow);
        Assert.Contains("░", h.Row(8)[35..52]);
        Assert.Contains("▚", h.Row(4)[..24]);
        // ash-1 at 50 cm in T-1: row 2 (screen 6); tie mark in the axis column 6.
        Assert.Equal("◆", h.Cell(6, 6));
        // The tie line crosses the gutter (columns 24..27) between the logs on that row.
        Assert.Contains(Enumerable.Range(24, 4), c => IsBraille(h.Cell(6, c)));
    }

    [Fact]
    public void Wide_screen_shows_every_core()
    {
        using var project = new TestProject();
        using var h = new DashboardHarness(project, 160, 48);
        output.WriteLine(h.ScreenText);
        Assert.Equal(3, h.Window.Logs.Slots.Count);
        Assert.Contains("T-3 · ms", h.Row(3));
        Assert.Contains("not run yet", h.Row(0));
    }

    [Fact]
    public void Plain_ascii_is_drawn_when_the_terminal_is_not_utf8()
    {
        using var project = new TestProject();
        using var h = new DashboardHarness(project, glyphs: GlyphSet.Ascii);
        string screen = h.ScreenText;
        output.WriteLine(screen);
        Assert.DoesNotContain(screen, ch => ch > '\u007f');
        Assert.Contains("*", h.Row(6));
        Assert.Equal("#", h.Cell(6, 6));
    }

    [Fact]
    public void Cursor_scrolls_and_zooms_keep_it_on_screen()
    {
        using var project = new TestProject();
        using var h = new DashboardHarness(project);
        h.Press(Key.End);
        var slot = h.Window.Logs.ActiveSlot!;
        Assert.Equal(200, slot.Cursor);
        h.Press(new Key('+'), new Key('+'));
        Assert.Equal(5, h.Window.Logs.DepthPerRow);
        int row = (int)Math.Floor((slot.Cursor - slot.Top) / h.Window.Logs.DepthPerRow);
        Assert.InRange(row, 0, h.Window.Logs.PlotRows - 1);
        Assert.Contains("200.00 cm", h.Row(20));
        h.Press(Key.Home);
        Assert.Equal(0, slot.Cursor);
        Assert.Equal(0, slot.Top);
    }

    [Fact]
    public void Alignment_lines_appear_after_a_run_and_line_up_uses_them()
    {
        using var project = new TestProject();
        using var h = new DashboardHarness(project);
        int Gutter() => Enumerable.Range(4, 16).Sum(r => Enumerable.Range(24, 4).Count(c => IsBraille(h.Cell(r, c))));
        int before = Gutter();
        h.State.SetResults(TestResults.Full(project.Loaded));
        h.App.LayoutAndDraw();
        Assert.True(Gutter() > before + 5, $"gutter cells {before} -> {Gutter()}");
        Assert.Contains("results current", h.Row(0));

        // T-1 at 110 cm is composite 110 cm, which is T-2 at 100 cm (composite = 1.1 x T-2 depth).
        h.Window.Logs.SetCursor(110);
        h.Press(new Key('='));
        Assert.Equal(100, h.Window.Logs.Slots[1].Cursor, 6);
    }

    [Fact]
    public void Alignment_lines_stop_where_either_core_ends()
    {
        // Cores of 0-200 cm; T-2's composite is 1.1 x its depth, so no correspondence lies below 220 cm in any log.
        using var project = new TestProject();
        using var h = new DashboardHarness(project);
        h.Press(new Key('f'));
        h.State.SetResults(TestResults.Full(project.Loaded));
        h.App.LayoutAndDraw();
        var logs = h.Window.Logs;
        var layout = LogLayout.For(logs.Viewport.Width, logs.Slots.Count);
        int Dots(Func<double, bool> rowDepth) =>
            Enumerable.Range(0, logs.PlotRows).Where(r => rowDepth(r * logs.DepthPerRow)).Sum(r =>
                Enumerable.Range(0, logs.Slots.Count - 1).Sum(k =>
                    Enumerable.Range(layout.GutterLeft(k), layout.GutterWidth).Count(c => IsBraille(h.Cell(4 + r, c)))));
        Assert.True(logs.PlotRows * logs.DepthPerRow > 300, $"the fitted view reaches {logs.PlotRows * logs.DepthPerRow} cm");
        Assert.True(Dots(top => top + logs.DepthPerRow < 180) > 10, "lines where the cores overlap");
        Assert.Equal(0, Dots(top => top > 220));
    }

    [Fact]
    public void The_tie_detail_line_names_the_cores_where_the_run_found_the_signals_misplace_the_tie()
    {
        using var project = new TestProject();
        using var h = new DashboardHarness(project);
        var misfit = new Finding { Severity = Severity.Warning, Code = CheckCodes.TieMisfit, Message = "misplaced", Core = "T-2", Item = "ash-1", Depth = 45 };
        h.State.SetResults(TestResults.Full(project.Loaded) with { Checks = [misfit] });
        h.Type("]");
        Assert.Equal("ash-1", h.Window.Logs.SelectedTie);
        // At 80 columns the shortest line: the misfit and the signals' verdict before the other depths and words.
        Assert.Contains("ash-1 ±0 cm: T-2 45 (+1) | left out +5 cm | signals misplace it in T-2", h.Row(21));
        Assert.Contains("signals misplace it in T-2", h.Window.Logs.DetailText());
        h.Type("]");
        Assert.DoesNotContain("signals misplace", h.Window.Logs.DetailText());
    }

    [Fact]
    public void At_80_columns_a_tie_of_many_cores_keeps_its_misfit_on_the_detail_line()
    {
        // The turbidite is renamed and given an uncertainty so that its full line (three cores' depths and the
        // misfit) passes 79 columns; the compact one keeps the misfit and the depth it is for.
        string yaml = TestProject.Yaml.Replace("id: tb-1\n    kind: turbidite", "id: tb-1-north-basin-megaturbidite\n    kind: turbidite\n    uncertainty: 0.25");
        Assert.NotEqual(TestProject.Yaml, yaml);
        using var project = new TestProject(yaml: yaml);
        using var h = new DashboardHarness(project);
        h.Type("]]");
        Assert.Equal("tb-1-north-basin-megaturbidite", h.Window.Logs.SelectedTie);
        string text = h.Window.Logs.DetailText();
        Assert.True(text.Length < 80, text);
        Assert.Contains(": T-2 110 (+2) | left out -5 cm (20×±)", text);
        Assert.Contains(text, h.Row(21));
        using var wide = new DashboardHarness(project, 160, 48);
        wide.Type("]]");
        Assert.Contains("T-1 120, T-2 110, T-3 100 | left out: T-2 ", wide.Window.Logs.DetailText());
    }

    [Fact]
    public void Enter_on_a_finding_shows_its_core_and_depth_in_the_logs()
    {
        using var project = new TestProject();
        project.Loaded.Problems.Add(new Finding { Severity = Severity.Warning, Code = "test.place", Message = "look here", Core = "T-3", Depth = 82 });
        using var h = new DashboardHarness(project);
        h.Press(new Key('4'));
        Assert.Equal(Screen.Findings, h.Window.Current);
        Assert.Contains("T-3 82", h.ScreenText);
        Assert.Contains("look here", h.ScreenText);
        h.Press(Key.Enter);
        Assert.Equal(Screen.Logs, h.Window.Current);
        Assert.Equal("T-3", h.Window.Logs.ActiveSlot!.CoreId);
        Assert.Equal(82, h.Window.Logs.ActiveSlot!.Cursor);
        Assert.Contains("T-3 · ms", h.Row(3));
        Assert.Contains("82.00 cm", h.ScreenText);
    }
}
