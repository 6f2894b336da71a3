using StratLink.Alignment;
using StratLink.Cli.Dashboard.Views;
using StratLink.Quantities;
using Terminal.Gui.Input;
using Xunit.Abstractions;

namespace StratLink.Tests.Dashboard;

/// <summary>Sites of six and eight cores: every core on screen, paging, ties between logs far apart, the tie detail line.</summary>
[Collection("TerminalGui")]
public sealed class SiteViewTests(ITestOutputHelper output)
{
    /// <summary>Cores T-1..T-n of 200 cm; three ties join only the first and the last core, one all of them.</summary>
    public static string Site(int cores) => $$"""
        format: stratlink-project/1
        site:
          name: Testmere Basin
        depth_unit: cm
        cores:
        {{string.Join("\n", Enumerable.Range(1, cores).Select(i => $"  - id: T-{i}\n    table: t{i}.csv"))}}
        markers:
          - id: a-1
            depths: {T-1: 10, T-{{cores}}: 12}
          - id: a-2
            uncertainty: 2
            depths: {T-1: 50, T-{{cores}}: 60}
          - id: a-3
            depths: {T-1: 100, T-{{cores}}: 110}
          - id: all
            depths: { {{string.Join(", ", Enumerable.Range(1, cores).Select(i => $"T-{i}: 150"))}} }
        """;

    [Fact]
    public void Six_cores_are_all_on_the_first_screen_at_80x24()
    {
        using var project = new TestProject(yaml: Site(6));
        using var h = new DashboardHarness(project);
        output.WriteLine(h.ScreenText);
        Assert.Equal(6, h.Window.Logs.Slots.Count);
        Assert.Contains("6 of 6 cores shown", h.Row(1));
        for (int i = 1; i <= 6; i++) Assert.Contains($"T-{i}", h.Row(3));
    }

    [Fact]
    public void Eight_cores_show_six_list_all_in_the_strip_and_page_across()
    {
        using var project = new TestProject(yaml: Site(8));
        using var h = new DashboardHarness(project);
        output.WriteLine(h.ScreenText);
        Assert.Contains("6 of 8 cores shown", h.Row(1));
        // Too many for spans on every core: the shown ones by name, the others with their spans.
        Assert.Contains("[T-1]", h.Row(2));
        Assert.Contains(" T-7 0-200 ", h.Row(2));
        Assert.Contains(" T-8 0-200 ", h.Row(2));
        h.Type(">");
        Assert.Equal(["T-3", "T-4", "T-5", "T-6", "T-7", "T-8"], h.Window.Logs.Slots.Select(s => s.CoreId));
        Assert.Contains("[T-8]", h.Row(2));
        h.Type(">");
        Assert.Contains("last cores", h.Window.Message);
        h.Type("<");
        Assert.Equal("T-1", h.Window.Logs.Slots[0].CoreId);
    }

    [Fact]
    public void A_narrower_terminal_drops_logs_from_the_right_and_keeps_the_active_one()
    {
        using var project = new TestProject(yaml: Site(8));
        using var h = new DashboardHarness(project, 200, 60);
        Assert.Contains("8 of 8 cores shown", h.Row(1));
        for (int i = 0; i < 7; i++) h.Press(Key.CursorRight);
        h.App.Driver!.SetScreenSize(80, 24);
        h.App.LayoutAndDraw();
        Assert.Equal(6, h.Window.Logs.Slots.Count);
        Assert.Equal("T-8", h.Window.Logs.ActiveSlot!.CoreId);
        Assert.Contains("6 of 8 cores shown", h.Row(1));
    }

    [Fact]
    public void A_tie_between_the_first_and_last_log_crosses_every_gutter_and_marks_the_logs_between()
    {
        using var project = new TestProject(yaml: Site(6));
        using var h = new DashboardHarness(project);
        // Six logs at 80 columns: 7 axis + 4 plot + 2 gutter columns each. 20 cm per row: a-2 at 50 cm in T-1 is
        // plot row 2 (screen 6), at 60 cm in T-6 row 3; the straight line between them crosses each gutter on row 6 or 7.
        var layout = LogLayout.For(80, 6);
        Assert.Equal((4, 2), (layout.PlotWidth, layout.GutterWidth));
        for (int g = 0; g < 5; g++)
        {
            int x = layout.GutterLeft(g);
            Assert.True(Enumerable.Range(x, 2).Any(c => CorrelationViewTests.IsBraille(h.Cell(6, c)) || CorrelationViewTests.IsBraille(h.Cell(7, c))), $"no tie line in gutter {g}");
        }
        for (int log = 1; log < 5; log++)
            Assert.True(h.Cell(6, layout.SlotLeft(log) + 6) == "┄" || h.Cell(7, layout.SlotLeft(log) + 6) == "┄", $"no pass mark in log {log}");
    }

    [Fact]
    public void Space_makes_the_last_log_the_partner_and_t_ties_the_first_to_it()
    {
        using var project = new TestProject(yaml: Site(6));
        using var h = new DashboardHarness(project);
        for (int i = 0; i < 5; i++) h.Press(Key.CursorRight);
        h.Press(Key.Space);
        Assert.Equal("T-6", h.Window.Logs.PartnerCore);
        for (int i = 0; i < 5; i++) h.Press(Key.CursorLeft);
        Assert.Contains("⇔T-6", h.Row(3));
        h.Press(Key.CursorDown, Key.CursorDown, Key.CursorDown, Key.CursorDown);
        h.Type("t");
        var tie = h.State.Project.FindMarker("tie-1")!;
        Assert.Equal(80, tie.DepthIn("T-1")!.Value.In(h.State.Project.DepthUnit));
        Assert.Equal(0, tie.DepthIn("T-6")!.Value.In(h.State.Project.DepthUnit));
        // The detail line describes the new tie; its mark is the selected one in both logs.
        Assert.Contains("tie-1 other ±0 cm: T-1 80, T-6 0", h.Row(21));
        Assert.Equal("◈", h.Cell(8, 6));
        Assert.Equal("◈", h.Cell(4, LogLayout.For(80, 6).SlotLeft(5) + 6));
    }

    [Fact]
    public void Alignment_lines_join_the_active_log_to_a_partner_further_on()
    {
        using var project = new TestProject(yaml: Site(6));
        using var h = new DashboardHarness(project);
        // T-1..T-5 map by identity; T-6 sits 60 cm deeper on the composite scale, so its lines to T-1 slope.
        var mappings = Enumerable.Range(1, 6).ToDictionary(i => $"T-{i}", i => new MappingEnsemble(i < 6
            ? DepthMapping.Identity($"T-{i}", DepthUnit.Centimetre, 0, 200)
            : new DepthMapping("T-6", DepthUnit.Centimetre, [0, 200], [60, 260]), []));
        h.State.SetResults(TestResults.Full(project.Loaded) with { Alignment = new AlignmentResult("T-1", "ties", mappings) });
        var layout = LogLayout.For(80, 6);
        int Inked(int gutter) => Enumerable.Range(4, 16).Sum(r => Enumerable.Range(layout.GutterLeft(gutter), 2).Count(c => CorrelationViewTests.IsBraille(h.Cell(r, c))));
        h.App.LayoutAndDraw();
        int before = Inked(2);
        for (int i = 0; i < 5; i++) h.Press(Key.CursorRight);
        h.Press(Key.Space);
        for (int i = 0; i < 5; i++) h.Press(Key.CursorLeft);
        Assert.True(Inked(2) > before, $"the middle gutter has {Inked(2)} inked cells with the partner T-6, {before} without");
    }

    // Leave-one-out worked by hand (the standard two-point linear interpolation formula): without a-2, a-1 (10 -> 12) and a-3 (100 -> 110) put 50 cm of T-1 at
    // 12 + (50 - 10) x (110 - 12) / (100 - 10) = 55.556 cm of T-6; a-2 says 60, a misfit of +4.444 cm = 2.22 x its 2 cm.
    [Fact]
    public void The_detail_line_gives_depths_uncertainty_and_the_leave_one_out_misfit()
    {
        using var project = new TestProject(yaml: Site(6));
        var p = project.Loaded.Project;
        Assert.Equal(55.556, TieDetail.LeaveOneOut(p, "a-2", "T-1", 50, "T-6")!.Value, 3);
        // Beyond the outermost other ties: the line through the nearest two (a-2 and a-3 without a-1).
        Assert.Equal(60 + (10 - 50) * 50.0 / 50, TieDetail.LeaveOneOut(p, "a-1", "T-1", 10, "T-6")!.Value, 9);
        Assert.Null(TieDetail.LeaveOneOut(p, "all", "T-2", 150, "T-3"));
        string line = TieDetail.Line(p, p.FindMarker("a-2")!, "T-1", "T-6");
        Assert.Equal("a-2 other ±2 cm: T-1 50, T-6 60 | left out: T-6 +4.44 cm (2.22×±) from T-1", line);

        using var h = new DashboardHarness(project);
        h.Press(Key.CursorDown, Key.CursorDown);
        h.Type("]");
        Assert.Equal("a-2", h.Window.Logs.SelectedTie);
        Assert.Contains("a-2 other ±2 cm: T-1 50, T-6 60 | left out:", h.Row(21));
    }
}
