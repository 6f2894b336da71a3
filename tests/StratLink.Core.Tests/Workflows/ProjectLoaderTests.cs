using StratLink.Checks;
using StratLink.ProjectIO;
using StratLink.Tests.Tables;
using StratLink.Workflows;

namespace StratLink.Tests.Workflows;

public sealed class ProjectLoaderTests : IDisposable
{
    private readonly TempFolder _dir = new();

    public void Dispose() => _dir.Dispose();

    private const string Head = "format: stratlink-project/1\nsite:\n  name: Test Mire\ndepth_unit: cm\n";

    /// <summary>Two cores sampled 0-200 cm (A) and 0-180 cm (B), ms and rho every 10 cm.</summary>
    private void WriteTables()
    {
        string Table(int bottom) => "depth,ms,rho\n" + string.Concat(Enumerable.Range(0, bottom / 10 + 1).Select(i => $"{i * 10},{i},{i * 0.1}\n"));
        _dir.Write("cores/A.csv", Table(200));
        _dir.Write("cores/B.csv", Table(180));
    }

    private LoadedProject Load(string yaml)
    {
        WriteTables();
        return ProjectLoader.Load(_dir.Write("site.yaml", yaml));
    }

    private const string Cores = "cores:\n  - id: A\n    table: cores/A.csv\n  - id: B\n    table: cores/B.csv\n";

    [Fact]
    public void Good_project_loads_every_table()
    {
        var p = Load(Head + Cores + "markers:\n  - id: t1\n    kind: tephra\n    depths: {A: 50, B: 45}\nalignment:\n  signals: {ms: 1}\n");
        Assert.Empty(p.Problems);
        Assert.Equal(["A", "B"], p.Tables.Keys.Order());
        Assert.Equal(19, p.Tables["B"].Count);
        Assert.Equal(180.0, p.Tables["B"].Depths[^1]);
    }

    [Fact]
    public void Marker_depth_outside_the_core_is_an_error_with_line()
    {
        // Line 13 holds the marker's depths; B's samples end at 180 cm.
        var p = Load(Head + Cores + "markers:\n  - id: t1\n    kind: tephra\n    depths: {A: 50, B: 450}\n");
        var f = Assert.Single(p.Problems);
        Assert.Equal((ProjectCodes.DepthOutsideCore, Severity.Error, 13, "B", "t1", 450.0), (f.Code, f.Severity, f.Line, f.Core, f.Item, f.Depth));
        Assert.Contains("0-180 cm", f.Message);
    }

    [Fact]
    public void Gap_and_age_outside_the_core_are_warnings_with_lines()
    {
        string yaml = Head + "cores:\n  - id: A\n    table: cores/A.csv\n    gaps:\n      - [300, 310]\n  - id: B\n    table: cores/B.csv\n"
            + "ages:\n  - id: deep\n    kind: calendar\n    core: B\n    depth: 500\n    age: 9000\n";
        var p = Load(yaml);
        Assert.Equal(2, p.Problems.Count);
        Assert.All(p.Problems, f => Assert.Equal((ProjectCodes.DepthOutsideCore, Severity.Warning), (f.Code, f.Severity)));
        Assert.Equal([9, 16], p.Problems.Select(f => f.Line ?? 0).Order());
    }

    [Fact]
    public void Missing_table_file_names_the_table_line()
    {
        var p = Load(Head + "cores:\n  - id: A\n    table: cores/A.csv\n  - id: C\n    table: cores/none.csv\n");
        var f = Assert.Single(p.Problems);
        Assert.Equal((ProjectCodes.MissingFile, 9, "cores[C].table"), (f.Code, f.Line, f.Field));
        Assert.Single(p.Tables);
    }

    [Fact]
    public void Path_outside_the_project_folder_is_a_note_and_still_read()
    {
        WriteTables();
        string yaml = Head + "cores:\n  - id: A\n    table: ../A.csv\n";
        File.Copy(Path.Combine(_dir.Path, "cores/A.csv"), Path.Combine(_dir.Path, "A.csv"));
        string projectPath = _dir.Write("sub/site.yaml", yaml);
        var p = ProjectLoader.Load(projectPath);
        var f = Assert.Single(p.Problems);
        Assert.Equal((ProjectCodes.PathOutsideProject, Severity.Note, 7), (f.Code, f.Severity, f.Line));
        Assert.True(p.Tables.ContainsKey("A"));
    }

    [Fact]
    public void Signal_missing_from_a_table_names_the_signals_line()
    {
        string yaml = Head + "cores:\n  - id: A\n    table: cores/A.csv\n    signals: [ms, mss]\nalignment:\n  signals: {rho: 1, ca_ti: 0.5}\n";
        var p = Load(yaml);
        Assert.All(p.Problems, f => Assert.Equal(ProjectCodes.UnknownSignal, f.Code));
        // 'mss' on line 8; 'rho' is not among A's listed signals and 'ca_ti' is in no table (line 10).
        Assert.Equal([(8, "mss"), (10, "rho"), (10, "ca_ti")], p.Problems.Select(f => (f.Line ?? 0, f.Item!)));
    }

    [Fact]
    public void Table_problems_keep_the_table_file_and_line()
    {
        WriteTables();
        _dir.Write("cores/B.csv", "depth,ms\n0,1\n10,x\n");
        var p = ProjectLoader.Load(_dir.Write("site.yaml", Head + Cores));
        var f = Assert.Single(p.Problems);
        Assert.Equal((ProjectCodes.TableBadCell, 3), (f.Code, f.Line));
        Assert.EndsWith("B.csv", f.File);
    }

    [Fact]
    public void Missing_or_broken_project_file_gives_findings_not_exceptions()
    {
        var missing = ProjectLoader.Load(Path.Combine(_dir.Path, "none.yaml"));
        Assert.True(missing.Problems.HasErrors);
        Assert.Empty(missing.Tables);
        var broken = ProjectLoader.Load(_dir.Write("bad.yaml", "format: [unclosed\n"));
        Assert.Equal(ProjectCodes.Syntax, Assert.Single(broken.Problems).Code);
    }

    [Fact]
    public void Cancellation_stops_loading()
    {
        WriteTables();
        string path = _dir.Write("site.yaml", Head + Cores);
        using var cts = new CancellationTokenSource();
        cts.Cancel();
        Assert.ThrowsAny<OperationCanceledException>(() => ProjectLoader.Load(path, cts.Token));
    }
}
