using StratLink.Checks;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Tables;

namespace StratLink.Tests.Tables;

public sealed class IntervalTableReaderTests : IDisposable
{
    private readonly TempFolder _dir = new();
    private readonly FindingList _problems = [];

    public void Dispose() => _dir.Dispose();

    private IntervalTable? Read(string text) => IntervalTableReader.Read(_dir.Write("v.csv", text), DepthUnit.Millimetre, _problems, CancellationToken.None);

    [Fact]
    public void Rows_are_sorted_by_top()
    {
        var t = Read("depth_top,depth_bottom,quality\n1.2,2.0,good\n0,0.5,good\n0.5,1.2,poor\n");
        Assert.NotNull(t);
        Assert.Empty(_problems);
        Assert.Equal([0, 0.5, 1.2], t.Tops);
        Assert.Equal([0.5, 1.2, 2.0], t.Bottoms);
        Assert.Equal([3, 4, 2], t.SourceLines);
        Assert.Equal(0.7, t[1].Length, 12);
    }

    [Fact]
    public void Top_not_above_bottom_is_an_error_with_line()
    {
        Assert.Null(Read("depth_top;depth_bottom\n0;0,5\n0,9;0,7\n"));
        var f = Assert.Single(_problems);
        Assert.Equal((ProjectCodes.TableIntervalInverted, 3), (f.Code, f.Line));
    }

    [Fact]
    public void Overlap_is_an_error_naming_both_lines()
    {
        Assert.Null(Read("depth_top,depth_bottom\n0,0.5\n0.4,0.9\n"));
        var f = Assert.Single(_problems);
        Assert.Equal((ProjectCodes.TableIntervalOverlap, 3), (f.Code, f.Line));
        Assert.Contains("line 2", f.Message);
    }

    [Fact]
    public void Missing_bottom_column_is_an_error()
    {
        Assert.Null(Read("depth_top,thickness\n0,0.5\n"));
        Assert.Equal(ProjectCodes.TableMissingColumn, Assert.Single(_problems).Code);
    }
}
