using StratLink.Checks;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Tables;

namespace StratLink.Tests.Tables;

public sealed class CoreTableReaderTests : IDisposable
{
    private readonly TempFolder _dir = new();
    private readonly FindingList _problems = [];

    public void Dispose() => _dir.Dispose();

    private static CoreSpec Spec(params SectionSpec[] sections) => new() { Id = "GS-1", Table = "t.csv", Sections = [.. sections] };

    private CoreTable? Read(string text, CoreSpec spec, DepthUnit unit = DepthUnit.Centimetre) =>
        CoreTableReader.Read(_dir.Write("t.csv", text), spec, unit, _problems, CancellationToken.None);

    [Fact]
    public void Signals_default_to_every_numeric_column_but_depth_and_section()
    {
        var t = Read("depth,id,ms,rho\n1,a,2,3\n2,b,4,5\n", Spec());
        Assert.NotNull(t);
        Assert.Equal(["ms", "rho"], t.SignalNames);
        Assert.Equal([2, 3], t.SourceLines!);
    }

    [Fact]
    public void Listed_signals_only()
    {
        var t = Read("depth,ms,rho\n1,2,3\n", Spec() with { Signals = ["rho"] });
        Assert.NotNull(t);
        Assert.Equal(["rho"], t.SignalNames);
    }

    [Fact]
    public void Listed_text_signal_is_an_error()
    {
        var t = Read("depth,ms,colour\n1,2,grey\n", Spec() with { Signals = ["colour"] });
        Assert.Null(t);
        var f = Assert.Single(_problems);
        Assert.Equal((ProjectCodes.TableNotNumeric, "colour", 1), (f.Code, f.Field, f.Line));
    }

    [Fact]
    public void Decreasing_depth_is_an_error_naming_the_line()
    {
        var t = Read("depth;ms\n1;1\n2;1\n1,5;1\n3;1\n", Spec());
        Assert.Null(t);
        var f = Assert.Single(_problems);
        Assert.Equal((ProjectCodes.TableDepthOrder, 4, Severity.Error), (f.Code, f.Line, f.Severity));
        Assert.Contains("1.5 at line 4 lies above the depth 2 at line 3", f.Message);
    }

    [Fact]
    public void Sort_true_sorts_rows_with_their_values_and_lines()
    {
        var t = Read("depth,ms\n3,30\n1,10\n2,20\n", Spec() with { Sort = true });
        Assert.NotNull(t);
        Assert.Empty(_problems);
        Assert.Equal([1.0, 2, 3], t.Depths);
        Assert.Equal([10.0, 20, 30], t.Signals["ms"]);
        Assert.Equal([3, 4, 2], t.SourceLines!);
    }

    [Fact]
    public void Sort_true_still_refuses_a_repeated_depth()
    {
        var t = Read("depth,ms\n3,30\n1,10\n3,31\n", Spec() with { Sort = true });
        Assert.Null(t);
        var f = Assert.Single(_problems);
        Assert.Equal((ProjectCodes.TableDepthOrder, 4), (f.Code, f.Line));
        Assert.Contains("repeats the depth at line 2", f.Message);
    }

    [Fact]
    public void Section_relative_depths_become_absolute()
    {
        // Section 2 starts at 150 cm: 10 cm into it is 160 cm.
        var spec = Spec(new SectionSpec("1", CoreDepth.From(0, DepthUnit.Centimetre)), new SectionSpec("2", CoreDepth.From(150, DepthUnit.Centimetre)));
        var t = Read("section,depth,ms\n1,0,1\n1,140.5,2\n2,10,3\n2,20,4\n", spec);
        Assert.NotNull(t);
        Assert.Empty(_problems);
        Assert.Equal([0, 140.5, 160, 170], t.Depths);
        Assert.Equal(["ms"], t.SignalNames);
    }

    [Fact]
    public void Section_tops_convert_to_the_table_unit()
    {
        // A top given in metres (1.5 m) reads 150 cm in a centimetre project.
        var spec = Spec(new SectionSpec("A", CoreDepth.From(1.5, DepthUnit.Metre)));
        var t = Read("section\tdepth\tms\nA\t2\t1\n", spec);
        Assert.NotNull(t);
        Assert.Equal([152.0], t.Depths);
    }

    [Fact]
    public void Unknown_section_is_an_error_with_its_line()
    {
        var spec = Spec(new SectionSpec("1", CoreDepth.From(0, DepthUnit.Centimetre)));
        var t = Read("section,depth,ms\n1,0,1\n7,10,3\n", spec);
        Assert.Null(t);
        var f = Assert.Single(_problems);
        Assert.Equal((ProjectCodes.TableUnknownSection, 3, "section"), (f.Code, f.Line, f.Field));
        Assert.Contains("'7'", f.Message);
    }

    [Fact]
    public void Sections_without_a_section_column_is_an_error()
    {
        var spec = Spec(new SectionSpec("1", CoreDepth.From(0, DepthUnit.Centimetre)));
        Assert.Null(Read("depth,ms\n1,2\n", spec));
        Assert.Equal(ProjectCodes.TableMissingColumn, Assert.Single(_problems).Code);
    }

    [Fact]
    public void Section_column_without_sections_is_a_warning()
    {
        var t = Read("section,depth,ms\n1,0,1\n1,5,1\n", Spec());
        Assert.NotNull(t);
        var f = Assert.Single(_problems);
        Assert.Equal((ProjectCodes.TableSectionsIgnored, Severity.Warning), (f.Code, f.Severity));
    }

    [Fact]
    public void Missing_values_become_NaN_and_a_row_without_depth_is_left_out()
    {
        var t = Read("depth,ms\n1,-999\n,5\n2,NA\n3,4\n", Spec() with { MissingValues = ["-999"] });
        Assert.NotNull(t);
        var f = Assert.Single(_problems);
        Assert.Equal((ProjectCodes.TableMissingDepth, 3, Severity.Warning), (f.Code, f.Line, f.Severity));
        Assert.Equal([1.0, 2, 3], t.Depths);
        Assert.Equal([double.NaN, double.NaN, 4], t.Signals["ms"]);
    }

    [Fact]
    public void Custom_depth_column_and_header_line()
    {
        var t = Read("Core GS-1\nmcd ms\nx y\ncm SI\n0.5 12\n1.5 13\n", Spec() with { DepthColumn = "mcd", HeaderLine = 2 });
        // Lines 3 and 4 (units) are text under a numeric column: errors naming the lines.
        Assert.NotNull(t);
        Assert.Equal([3, 4, 3, 4], _problems.Where(f => f.Code == ProjectCodes.TableBadCell).Select(f => f.Line ?? 0));
    }
}
