using StratLink.Cli.Dashboard.Drawing;
using StratLink.Cli.Dashboard.Views;

namespace StratLink.Tests.Dashboard;

public sealed class ScaleTests
{
    // Percentiles by linear interpolation between order statistics (Hyndman and Fan 1996, type 7;
    // numpy.percentile's default): for 0..99, P2 = 0.02 x 99 = 1.98 and P98 = 97.02; 0, 1, 98 and 99 lie outside.
    [Fact]
    public void Robust_range_is_the_2nd_to_98th_percentile_with_the_clipped_share()
    {
        var r = RobustRange.Of(Enumerable.Range(0, 100).Select(i => (double)i));
        Assert.Equal(1.98, r.Min, 9);
        Assert.Equal(97.02, r.Max, 9);
        Assert.Equal(0.04, r.ClippedShare, 9);
        Assert.Equal("2-98 %, 4.0 % clipped", r.Describe());
    }

    [Fact]
    public void Spikes_do_not_stretch_the_robust_range()
    {
        // 197 values evenly from 10 to 11 and three spikes of 355 (1.5 %): P98 is at order statistic
        // 0.98 x 199 = 195.02, between two ordinary values, so the range stays within 10..11.
        var values = Enumerable.Range(0, 197).Select(i => 10 + i / 196.0).Concat([355.0, 355.0, 355.0, double.NaN]);
        var r = RobustRange.Of(values);
        Assert.InRange(r.Max, 10.99, 11.0);
        Assert.InRange(r.Min, 10.0, 10.03);
        // Clipped: the four lowest, the highest ordinary value and the three spikes, 8 of 200.
        Assert.Equal(0.04, r.ClippedShare, 9);
    }

    [Fact]
    public void Short_or_flat_signals_use_their_full_range()
    {
        var r = RobustRange.Of([3, 1, 2]);
        Assert.Equal((1, 3, false), (r.Min, r.Max, r.Clipping));
        Assert.Equal("full range", r.Describe());
        var flat = RobustRange.Of(Enumerable.Repeat(5.0, 80));
        Assert.Equal((4.5, 5.5), (flat.Min, flat.Max));
    }

    [Theory]
    [InlineData("150", 150, JumpAxis.Shown)]
    [InlineData(" 12,5 cm", 12.5, JumpAxis.Depth)]
    [InlineData("1200 BP", 1200, JumpAxis.Age)]
    [InlineData("-50 cal BP", -50, JumpAxis.Age)]
    [InlineData("3.2m", 3.2, JumpAxis.Depth)]
    public void Go_to_reads_a_number_with_an_optional_unit(string text, double value, JumpAxis axis)
    {
        Assert.Equal(new JumpTarget(value, axis), JumpTarget.Parse(text));
    }

    [Theory]
    [InlineData("")]
    [InlineData("deep")]
    [InlineData("12 yr")]
    [InlineData("1e999")]
    public void Go_to_refuses_what_is_not_a_depth_or_age(string text) => Assert.Null(JumpTarget.Parse(text));

    [Fact]
    public void The_axis_window_zooms_around_the_cursor_and_stays_within_the_data()
    {
        var axis = new AxisWindow();
        axis.SetExtent(0, 900, 16);
        // 900 / 16 = 56.25 per row: the next 1-2-5 step is 100.
        Assert.Equal(100, axis.PerRow);
        axis.MoveTo(450);
        Assert.True(axis.Zoom(zoomIn: true));
        Assert.Equal(50, axis.PerRow);
        Assert.InRange(axis.RowOf(450), 0, 15);
        axis.ToEnd(bottom: true);
        Assert.Equal(900, axis.Cursor);
        Assert.InRange(axis.RowOf(900), 0, 15);
        Assert.True(axis.Top >= 0);
        Assert.False(axis.Zoom(zoomIn: false) && axis.Zoom(zoomIn: false));
        Assert.Equal(100, axis.PerRow);
    }
}
