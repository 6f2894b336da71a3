using StratLink.Cli.Dashboard;
using Terminal.Gui.Input;

namespace StratLink.Tests.Dashboard;

/// <summary>
/// Every navigation key on every plotting screen (Logs, Ages, Composite), on the three-core test
/// project with hand-made results: composite depth 0-200 cm, age 10 yr per cm. The expected scales
/// follow from the 1-2-5 ladder: 200 cm in 16 rows (logs, composite) needs 20 cm per row, in the
/// 8 rows of the ages plot at 80x24 50 cm per row.
/// </summary>
[Collection("TerminalGui")]
public sealed class NavigationKeyTests
{
    public static TheoryData<Screen> PlotScreens => [Screen.Logs, Screen.Ages, Screen.Composite];

    private static DashboardHarness Open(TestProject project, Screen screen)
    {
        var h = new DashboardHarness(project);
        h.State.SetResults(TestResults.Full(project.Loaded));
        h.Type(((int)screen + 1).ToString());
        Assert.Equal(screen, h.Window.Current);
        return h;
    }

    /// <summary>The cursor and the scale (value per row) of the screen shown.</summary>
    private static (double Cursor, double PerRow) Axis(DashboardHarness h) => h.Window.Current switch
    {
        Screen.Logs => (h.Window.Logs.ActiveSlot!.Cursor, h.Window.Logs.DepthPerRow),
        Screen.Ages => (h.Window.Ages.DepthAxis.Cursor, h.Window.Ages.DepthAxis.PerRow),
        Screen.Composite => (h.Window.Composite.ShownAxis.Cursor, h.Window.Composite.ShownAxis.PerRow),
        _ => throw new ArgumentOutOfRangeException(nameof(h)),
    };

    private static double FitScale(Screen screen) => screen == Screen.Ages ? 50 : 20;

    [Theory, MemberData(nameof(PlotScreens))]
    public void Down_and_up_move_the_cursor_one_row(Screen screen)
    {
        using var project = new TestProject();
        using var h = Open(project, screen);
        double row = FitScale(screen);
        Assert.Equal(row, Axis(h).PerRow, 9);
        h.Press(Key.CursorDown, Key.CursorDown);
        Assert.Equal(2 * row, Axis(h).Cursor, 9);
        h.Press(Key.CursorUp);
        Assert.Equal(row, Axis(h).Cursor, 9);
        h.Press(Key.CursorDown.WithShift);
        Assert.Equal(1.25 * row, Axis(h).Cursor, 9);
        h.Press(Key.CursorUp.WithShift);
        Assert.Equal(row, Axis(h).Cursor, 9);
    }

    [Theory, MemberData(nameof(PlotScreens))]
    public void Page_keys_move_a_screen_and_home_end_go_to_the_ends(Screen screen)
    {
        using var project = new TestProject();
        using var h = Open(project, screen);
        h.Press(Key.PageDown);
        double paged = Axis(h).Cursor;
        Assert.True(paged >= 100, $"PgDn moved the cursor only to {paged}");
        h.Press(Key.PageUp);
        Assert.Equal(0, Axis(h).Cursor, 9);
        h.Press(Key.End);
        Assert.Equal(200, Axis(h).Cursor, 9);
        h.Press(Key.Home);
        Assert.Equal(0, Axis(h).Cursor, 9);
    }

    [Theory, MemberData(nameof(PlotScreens))]
    public void Plus_and_minus_zoom_around_the_cursor_and_f_fits_all(Screen screen)
    {
        using var project = new TestProject();
        using var h = Open(project, screen);
        double fit = FitScale(screen);
        // One step in on the ladder from 20 is 10 then 5; from 50 it is 20 then 10.
        double first = fit == 20 ? 10 : 20, second = fit == 20 ? 5 : 10;
        h.Press(Key.End);
        h.Type("+");
        Assert.Equal(first, Axis(h).PerRow, 9);
        h.Type("+");
        Assert.Equal(second, Axis(h).PerRow, 9);
        Assert.Contains($"{second} cm per row", h.Window.Message);
        // The deepest part stays on screen while zoomed: the cursor is still at the bottom.
        Assert.Equal(200, Axis(h).Cursor, 9);
        Assert.Contains("▶", h.ScreenText);
        h.Type("-");
        Assert.Equal(first, Axis(h).PerRow, 9);
        h.Type("f");
        Assert.Equal(fit, Axis(h).PerRow, 9);
        Assert.Contains("The whole record", h.Window.Message);
        // Zooming out past the whole record is refused, not silently ignored.
        h.Type("-");
        Assert.Equal(fit, Axis(h).PerRow, 9);
        Assert.Contains("widest", h.Window.Message);
    }

    [Theory, MemberData(nameof(PlotScreens))]
    public void G_goes_to_a_typed_depth_or_age(Screen screen)
    {
        using var project = new TestProject();
        using var h = Open(project, screen);
        h.Prompts.Texts.Enqueue("150");
        h.Type("g");
        Assert.Equal(150, Axis(h).Cursor, 9);
        // 500 cal BP is 50 cm of composite depth (10 yr per cm), which is 50 cm in T-1 (the reference, identity mapping).
        h.Prompts.Texts.Enqueue("500 BP");
        h.Type("g");
        Assert.Equal(50, Axis(h).Cursor, 1);
        h.Prompts.Texts.Enqueue("deep");
        h.Type("g");
        Assert.Contains("Not a depth or an age", h.Window.Message);
        Assert.Equal(50, Axis(h).Cursor, 1);
    }

    [Fact]
    public void The_composite_navigates_by_age_when_switched_to_age()
    {
        using var project = new TestProject();
        using var h = Open(project, Screen.Composite);
        h.Press(Key.CursorDown);
        h.Type("a");
        // The cursor stays at the same place of the record: 20 cm is 200 cal BP.
        Assert.Equal(200, Axis(h).Cursor, 6);
        Assert.Equal(200, Axis(h).PerRow, 9);
        h.Press(Key.End);
        Assert.Equal(2000, Axis(h).Cursor, 6);
        h.Prompts.Texts.Enqueue("120 cm");
        h.Type("g");
        Assert.Equal(1200, Axis(h).Cursor, 6);
    }

    [Fact]
    public void The_key_line_shows_the_navigation_keys_on_every_plotting_screen()
    {
        using var project = new TestProject();
        foreach (var screen in new[] { Screen.Logs, Screen.Ages, Screen.Composite })
        {
            using var h = Open(project, screen);
            Assert.Contains("+/- Zoom  g Go to  f Fit", h.Row(23));
        }
    }
}
