using StratLink.Cli.Dashboard.Results;
using StratLink.Cli.Dashboard.Views;
using StratLink.Model;
using StratLink.Quantities;
using Terminal.Gui.Input;
using Xunit.Abstractions;

namespace StratLink.Tests.Dashboard;

[Collection("TerminalGui")]
public sealed class ResultViewsTests(ITestOutputHelper output)
{
    [Fact]
    public void Ages_screen_draws_the_band_the_curve_and_the_controls()
    {
        using var project = new TestProject();
        using var h = new DashboardHarness(project);
        h.State.SetResults(TestResults.Full(project.Loaded));
        h.Type("2");
        output.WriteLine(h.ScreenText);
        string screen = h.ScreenText;
        Assert.Contains("Age model", h.Row(2));
        Assert.Contains("▒", screen);
        Assert.Contains("●", screen);
        Assert.Contains(screen, ch => ch is >= '\u2801' and <= '\u28FF');
        // Control list: calibrated 95 % range from the run.
        Assert.Contains("1160..1240", screen);
        // The age axis starts at the youngest 95 % bound: the coring-year control's -70 cal BP.
        Assert.Contains("-70 cal BP", screen);
    }

    [Fact]
    public void Age_control_lines_mark_cut_texts_and_give_a_varve_count_its_anchor_depth()
    {
        using var project = new TestProject();
        using var h = new DashboardHarness(project);
        var varves = new VarveCountControl
        {
            Id = "varves-main-core",
            Core = "T-1",
            Table = "t1-varves.csv",
            AnchorDepth = CoreDepth.From(12.5, DepthUnit.Centimetre),
            AnchorAge = CalendarAge.FromYearsBP(-69),
        };
        string line = h.Window.Ages.ListLine(varves, null);
        output.WriteLine(AgesView.ListHeader());
        output.WriteLine(line);
        // Columns of ListHeader: use (3), control (10), kind (8), where (12), given (14).
        Assert.Equal("varves-ma…", line.Substring(4, 10));
        Assert.Equal("varve-c…", line.Substring(15, 8));
        Assert.Equal("T-1 12.5", line.Substring(24, 12).TrimEnd());
        Assert.Equal("from -69 BP", line.Substring(37, 14).TrimEnd());
    }

    [Fact]
    public void Ages_screen_of_a_project_dated_by_a_target_names_the_target_not_no_controls()
    {
        string yaml = TestProject.Yaml[..TestProject.Yaml.IndexOf("ages:", StringComparison.Ordinal)] + """
            target:
              table: stacks/benthic-stack.txt
              age_column: age
              signal: ms
            alignment:
              reference: T-1
              signals: {ms: 1.0}
            """;
        using var project = new TestProject(yaml: yaml);
        using var h = new DashboardHarness(project);
        h.Type("2");
        Assert.Contains("No controls in the file; a run dates the cores by benthic-stack.txt.", h.ScreenText);
        var results = TestResults.Full(project.Loaded);
        h.State.SetResults(results with { Controls = [new ControlOutcome("target:T-1:20", 20, 300, 250, 350, ""), new ControlOutcome("target:T-1:40", 40, 500, 450, 550, "")] });
        h.App.LayoutAndDraw();
        output.WriteLine(h.ScreenText);
        Assert.Contains("No controls in the file: dated by benthic-stack.txt (2 transferred ages).", h.ScreenText);
        Assert.DoesNotContain("no age controls", h.ScreenText);
    }

    [Fact]
    public void Composite_screen_draws_band_splice_strip_and_switches_to_age()
    {
        using var project = new TestProject();
        using var h = new DashboardHarness(project);
        h.Type("3");
        Assert.Contains("Composite not run yet", h.ScreenText);
        h.State.SetResults(TestResults.Full(project.Loaded));
        h.App.LayoutAndDraw();
        output.WriteLine(h.ScreenText);
        string screen = h.ScreenText;
        Assert.Contains("against composite depth (cm)", h.Row(2));
        Assert.Contains("splice: A=T-1 B=T-2", screen);
        Assert.Equal("A", h.Cell(3, 7));
        // 200 cm of composite in 16 rows: 20 cm per row (next 1-2-5 step), so T-2's part from 100 cm starts on row 5.
        Assert.Equal("B", h.Cell(3 + 5, 7));
        Assert.Equal("A", h.Cell(3 + 4, 7));
        Assert.Contains("Cycles and regime shifts: not analysed yet (p analyses this signal).", screen);
        h.Type("a");
        Assert.Contains("against age (cal BP)", h.Row(2));
        // 0-2000 cal BP in 16 rows: 200 yr per row. Row 6 (1200-1400 cal BP, 120-140 cm) is T-2's; from row 10 on
        // the rows are past the oldest age, where no core is spliced.
        Assert.Equal("B", h.Cell(3 + 6, 7));
        Assert.All(Enumerable.Range(10, 6), r => Assert.Equal(" ", h.Cell(3 + r, 7)));
    }

    [Fact]
    public void Composite_screen_stacks_every_signal_side_by_side()
    {
        using var project = new TestProject();
        using var h = new DashboardHarness(project);
        var results = TestResults.Full(project.Loaded);
        var ms = results.Composite!.Signals[0];
        var density = ms with { Name = "density", Mean = ms.Mean.Select(v => 1.5 + 0.1 * v).ToArray() };
        h.State.SetResults(results with { Composite = results.Composite with { Signals = [ms, density] } });
        h.Type("3");
        h.Type("m");
        output.WriteLine(h.ScreenText);
        Assert.Contains("Composite all signals (mean and 95% band)", h.Row(2));
        // Each panel has its own value range; both are listed under the plot.
        Assert.Matches(@"ms -?[0-9.]+\.\.[0-9.]+ +density 1\.[0-9]+\.\.1\.[0-9]+", h.ScreenText);
        // Two panels of curve cells, left and right of the middle.
        int Braille(int from, int to) => Enumerable.Range(3, 14).Sum(r => Enumerable.Range(from, to - from).Count(c => CorrelationViewTests.IsBraille(h.Cell(r, c))));
        Assert.True(Braille(10, 44) > 10 && Braille(45, 78) > 10, "the two panels are not both drawn");
        h.Type("m");
        Assert.Contains("Composite ms (mean", h.Row(2));
    }

    [Fact]
    public void Findings_screen_lists_file_problems_with_their_place()
    {
        using var project = new TestProject();
        project.Loaded.Problems.AddWarning("project.test", "a test warning", project.FilePath, 12, "markers");
        using var h = new DashboardHarness(project);
        h.Type("4");
        Assert.Contains("testmere.yaml:12", h.ScreenText);
        h.Press(Key.Enter);
        Assert.Contains("no place in the logs", h.Row(22));
    }
}
