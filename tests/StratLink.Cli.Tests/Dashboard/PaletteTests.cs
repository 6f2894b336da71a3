using StratLink.Checks;
using StratLink.Cli.Dashboard.Drawing;
using StratLink.Cli.Dashboard.Views;
using Terminal.Gui.Drawing;
using Terminal.Gui.Input;
using Xunit.Abstractions;
using Attribute = Terminal.Gui.Drawing.Attribute;

namespace StratLink.Tests.Dashboard;

/// <summary>
/// Colour checks: the palette uses only the sixteen named terminal colours (ECMA-48 SGR 30-37 and
/// their bright forms, the set every colour terminal has), and in monochrome every meaning is still
/// on screen as a glyph or a style: gaps, disturbed intervals, ties, the selected tie, the cursor, the active log, splice pieces, excluded age controls, severities.
/// </summary>
[Collection("TerminalGui")]
public sealed class PaletteTests(ITestOutputHelper output)
{
    private static readonly Attribute Normal = new(Color.White, Color.Black);

    [Fact]
    public void Sixteen_colour_palette_uses_only_the_named_colours()
    {
        var named = Enum.GetValues<ColorName16>().Select(n => new Color(n)).ToHashSet();
        foreach (var a in Palette.From(Normal, ColourMode.Sixteen).All())
        {
            Assert.Contains(a.Foreground, named);
            Assert.Contains(a.Background, named);
            Assert.NotEqual(a.Foreground, a.Background);
        }
    }

    [Fact]
    public void Monochrome_palette_uses_only_the_terminal_default_colours_with_styles_for_emphasis()
    {
        var p = Palette.From(Normal, ColourMode.Monochrome);
        foreach (var a in p.All()) Assert.Equal((Normal.Foreground, Normal.Background), (a.Foreground, a.Background));
        Assert.True(p.CursorRow.Style.HasFlag(TextStyle.Reverse));
        Assert.True(p.ActiveHeader.Style.HasFlag(TextStyle.Reverse));
        Assert.NotEqual(p.Tie.Style, p.SelectedTie.Style);
    }

    [Fact]
    public void No_colour_from_NO_COLOR()
    {
        Assert.Equal(ColourMode.Monochrome, ColourModes.FromEnvironment(n => n == "NO_COLOR" ? "1" : null));
        Assert.Equal(ColourMode.Sixteen, ColourModes.FromEnvironment(n => n == "NO_COLOR" ? "" : null));
        Assert.Equal(ColourMode.Sixteen, ColourModes.FromEnvironment(_ => null));
    }

    [Theory]
    [InlineData(true)]
    [InlineData(false)]
    public void Every_meaning_reads_without_colour(bool unicode)
    {
        var glyphs = unicode ? GlyphSet.Utf8 : GlyphSet.Ascii;
        using var project = new TestProject();
        project.Loaded.Problems.AddWarning("project.test", "a test warning", project.FilePath, 3, "site");
        using var h = new DashboardHarness(project, glyphs: glyphs, colours: ColourMode.Monochrome);
        h.State.SetResults(TestResults.Full(project.Loaded));
        h.Type("]");
        h.App.LayoutAndDraw();
        string logs = h.ScreenText;
        output.WriteLine(logs);
        // One pair of colours on the whole screen: the terminal's (theme's) own foreground and background.
        var pairs = Enumerable.Range(0, h.Rows)
            .SelectMany(r => Enumerable.Range(0, h.App.Driver!.Cols).Select(c => h.Attr(r, c)))
            .Where(a => a is not null).Select(a => (a!.Value.Foreground, a.Value.Background)).Distinct().ToList();
        Assert.Single(pairs);
        Assert.Contains(glyphs.Gap, logs);
        Assert.Contains(glyphs.Disturbed, logs);
        Assert.Contains(glyphs.EventLayer, logs); // T-3's turbidite at 98-104 cm
        Assert.Contains(glyphs.SelectedTieMark, logs); // ash-1, selected
        Assert.Contains(glyphs.EventTieMark, logs); // tb-1, a turbidite
        Assert.Contains(glyphs.ActiveLog + "T-1", logs);
        Assert.Contains(unicode ? "▶" : ">", logs);
        Assert.True(h.Attr(3, 0)!.Value.Style.HasFlag(TextStyle.Reverse), "the active log's header is not in reverse video");
        h.Press(Key.Esc);
        Assert.Null(h.Window.Logs.SelectedTie);
        Assert.Contains(glyphs.TieMark, h.ScreenText); // ash-1, a tephra, no longer selected

        h.Type("2");
        h.Type("]");
        h.Press(Key.Space);
        Assert.Contains(glyphs.ExcludedControlMark, h.ScreenText);
        Assert.Contains(glyphs.ControlMark, h.ScreenText);
        Assert.Contains(glyphs.Band, h.ScreenText);

        h.Type("3");
        // Splice pieces by letter, not by colour alone.
        Assert.Equal("A", h.Cell(3, 7));
        Assert.Equal("B", h.Cell(3 + 5, 7));
        Assert.Contains("splice: A=T-1 B=T-2", h.ScreenText);

        h.Type("4");
        Assert.Contains("warning", h.ScreenText);
    }
}
