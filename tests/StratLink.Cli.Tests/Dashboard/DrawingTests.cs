using StratLink.Cli.Dashboard.Drawing;

namespace StratLink.Tests.Dashboard;

public sealed class DrawingTests
{
    // Braille dot numbering and bit values: The Unicode Standard, block U+2800..U+28FF (dot n = bit n-1;
    // dots 1-3 down the left column, 4-6 down the right, 7 and 8 below them).
    [Theory]
    [InlineData(0, 0, 0x2801)]
    [InlineData(0, 1, 0x2802)]
    [InlineData(0, 2, 0x2804)]
    [InlineData(1, 0, 0x2808)]
    [InlineData(1, 2, 0x2820)]
    [InlineData(0, 3, 0x2840)]
    [InlineData(1, 3, 0x2880)]
    public void A_single_dot_gives_the_braille_pattern_of_its_position(int x, int y, int expected)
    {
        var canvas = new DotCanvas(1, 1);
        canvas.Set(x, y);
        Assert.Equal(expected, canvas.CellRune(0, 0, unicode: true, '*').Value);
        Assert.Equal('*', canvas.CellRune(0, 0, unicode: false, '*').Value);
    }

    [Fact]
    public void A_line_inks_every_cell_between_its_ends_and_nothing_else()
    {
        var canvas = new DotCanvas(6, 3);
        canvas.Line(0, 10, 11, 9);
        // Dot rows 9 and 10 both lie in cell row 2.
        for (int c = 0; c < 6; c++) Assert.True(canvas.IsInked(c, 2), $"column {c}");
        for (int c = 0; c < 6; c++) Assert.False(canvas.IsInked(c, 0) || canvas.IsInked(c, 1));
    }

    [Fact]
    public void Bins_hold_min_and_max_per_dot_row_and_skip_missing_values()
    {
        double[] depths = [0, 0.4, 0.6, 1.2, 1.9, 2.5, 9];
        double[] values = [5, 1, 3, double.NaN, 7, 2, 100];
        var bins = SignalBins.FromSorted(depths, values, top: 0, binDepth: 1, binCount: 3);
        Assert.Equal([1, 7, 2], bins.Min);
        Assert.Equal([5, 7, 2], bins.Max);
    }

    [Fact]
    public void Bins_with_no_sample_are_empty()
    {
        var bins = SignalBins.FromSorted([0, 10], [1, 2], top: 2, binDepth: 1, binCount: 3);
        Assert.All(bins.Min, v => Assert.True(double.IsNaN(v)));
    }

    [Fact]
    public void Nearest_sample_respects_the_tolerance()
    {
        double[] depths = [0, 1, 2, 3];
        Assert.Equal(2, SignalBins.NearestSorted(depths, 2.2, 0.5));
        Assert.Equal(-1, SignalBins.NearestSorted(depths, 5, 0.5));
    }

    // POSIX (IEEE Std 1003.1, 8.2 Internationalization Variables): LC_ALL overrides LC_CTYPE, which overrides LANG.
    [Theory]
    [InlineData("C", "en_GB.UTF-8", "en_GB.UTF-8", false)]
    [InlineData(null, "C.UTF-8", "C", true)]
    [InlineData(null, null, "de_DE.utf8", true)]
    [InlineData(null, null, null, false)]
    [InlineData("", "", "POSIX", false)]
    public void Braille_is_used_only_when_the_effective_locale_is_utf8(string? lcAll, string? lcCtype, string? lang, bool unicode)
    {
        var env = new Dictionary<string, string?> { ["LC_ALL"] = lcAll, ["LC_CTYPE"] = lcCtype, ["LANG"] = lang };
        Assert.Equal(unicode, GlyphSet.FromLocale(n => env.GetValueOrDefault(n)).Unicode);
    }
}
