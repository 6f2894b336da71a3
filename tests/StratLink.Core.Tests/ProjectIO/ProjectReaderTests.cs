using StratLink.Checks;
using StratLink.ProjectIO;
using StratLink.Tests.Tables;

namespace StratLink.Tests.ProjectIO;

/// <summary>Each validation message of the project file, one bad input each, with the line it must name.</summary>
public sealed class ProjectReaderTests
{
    private const string Head = "format: stratlink-project/1\ndepth_unit: cm\n";

    private static FindingList Problems(string yaml) => ProjectReader.Parse(yaml, "p.yaml").Problems;

    private static Finding Single(string yaml, string code)
    {
        var problems = Problems(yaml);
        return Assert.Single(problems, f => f.Code == code);
    }

    [Fact]
    public void Full_project_reads_without_problems()
    {
        var doc = ProjectReader.Parse(ProjectFiles.Full, "p.yaml");
        Assert.Empty(doc.Problems);
        Assert.NotNull(doc.Project);
        Assert.Equal(3, doc.Project.Cores.Count);
        Assert.Equal(4, doc.Project.Ages.Count);
    }

    [Fact]
    public void Unknown_key_names_its_line_and_a_near_spelling()
    {
        var f = Single(Head + "cores:\n  - id: A\n    table: a.csv\n    tabel: b.csv\n", ProjectCodes.UnknownKey);
        Assert.Equal(6, f.Line);
        Assert.Equal(Severity.Error, f.Severity);
        Assert.Contains("did you mean 'table'", f.Message);
    }

    [Fact]
    public void Duplicate_core_id()
    {
        var f = Single(Head + "cores:\n  - id: A\n    table: a.csv\n  - id: A\n    table: b.csv\n", ProjectCodes.DuplicateId);
        Assert.Contains("'A' is used twice", f.Message);
        Assert.NotNull(f.Line);
    }

    [Fact]
    public void Marker_naming_a_missing_core()
    {
        var f = Single(Head + "cores:\n  - id: A\n    table: a.csv\nmarkers:\n  - id: ash\n    depths: {A: 1, B: 2}\n", ProjectCodes.UnknownCore);
        Assert.Equal(8, f.Line);
        Assert.Contains("'B'", f.Message);
    }

    [Fact]
    public void Gap_with_top_below_bottom()
    {
        var f = Single(Head + "cores:\n  - id: A\n    table: a.csv\n    gaps:\n      - [10, 5]\n", ProjectCodes.IntervalInverted);
        Assert.Equal(7, f.Line);
        Assert.Equal("cores[A].gaps[0]", f.Field);
    }

    [Fact]
    public void Event_layer_with_top_below_base()
    {
        var f = Single(Head + "cores:\n  - id: A\n    table: a.csv\n    events:\n      - [10, 5]\n", ProjectCodes.IntervalInverted);
        Assert.Equal("p.yaml", f.File);
        Assert.Equal(7, f.Line);
        Assert.Equal("cores[A].events[0]", f.Field);
    }

    [Fact]
    public void Overlapping_event_layers()
    {
        var f = Single(Head + "cores:\n  - id: A\n    table: a.csv\n    events:\n      - [10, 20]\n      - [15, 25]\n", ProjectCodes.IntervalOverlap);
        Assert.Equal("p.yaml", f.File);
        Assert.Equal(8, f.Line);
        Assert.Equal("cores[A].events[1]", f.Field);
        Assert.Equal(Severity.Error, f.Severity);
    }

    private const string VarveHead = "cores:\n  - id: A\n    table: a.csv\nages:\n  - id: v\n    kind: varve-count\n    core: A\n    table: v.csv\n"
        + "    anchor_depth: 0\n    anchor_age: -69\n";

    [Theory]
    [InlineData("0")]
    [InlineData("1")]
    [InlineData("1.5")]
    [InlineData("-0.02")]
    public void Miscount_rate_outside_the_open_unit_interval(string rate)
    {
        var f = Single(Head + VarveHead + $"    miscount_rate: {rate}\n", ProjectCodes.InvalidValue);
        Assert.Equal("p.yaml", f.File);
        Assert.Equal(13, f.Line);
        Assert.Equal("ages[v].miscount_rate", f.Field);
    }

    [Fact]
    public void Uncertain_count_interval_with_a_bad_rate()
    {
        var f = Single(Head + VarveHead + "    uncertain:\n      - [10, 20, 1.2]\n", ProjectCodes.InvalidValue);
        Assert.Equal(14, f.Line);
        Assert.Equal("ages[v].uncertain[0]", f.Field);
    }

    [Fact]
    public void Outlier_prior_outside_the_unit_interval()
    {
        var f = Single(Head + VarveHead + "    outlier_prior: 1\n", ProjectCodes.InvalidValue);
        Assert.Equal(13, f.Line);
        Assert.Equal("ages[v].outlier_prior", f.Field);
    }

    [Fact]
    public void Event_uncertain_count_and_outlier_keys_read_back()
    {
        var doc = ProjectReader.Parse(Head + "cores:\n  - id: A\n    table: a.csv\n    events:\n      - [30, 34.5]\n      - [10, 12]\n"
            + "ages:\n  - id: v\n    kind: varve-count\n    core: A\n    table: v.csv\n    anchor_depth: 0\n    anchor_age: -69\n"
            + "    miscount_rate: 0.03\n    uncertain:\n      - [40, 50, 0.1]\n    outlier_prior: 0.1\n", "p.yaml");
        Assert.Empty(doc.Problems);
        var core = doc.Project!.Cores[0];
        Assert.Equal([10.0, 30.0], core.Events.Select(e => e.Top.In(StratLink.Quantities.DepthUnit.Centimetre)));
        var v = Assert.IsType<StratLink.Model.VarveCountControl>(doc.Project.Ages[0]);
        Assert.Equal(0.03, v.MiscountRate);
        Assert.Equal(0.1, v.Uncertain[0].MiscountRate);
        Assert.Equal(0.1, v.OutlierPrior);
        Assert.Equal(0.05, ProjectReader.Parse(Head + VarveHead, "p.yaml").Project!.Ages[0].OutlierPrior);
    }

    [Fact]
    public void Unknown_unit()
    {
        var f = Single("format: stratlink-project/1\ndepth_unit: inch\ncores:\n  - id: A\n    table: a.csv\n", ProjectCodes.UnknownUnit);
        Assert.Equal(2, f.Line);
        Assert.Contains("'inch'", f.Message);
    }

    // Writing is canonical: parse, write, parse, write must give the same text and no problems.
    [Fact]
    public void Round_trip_is_stable()
    {
        var first = ProjectReader.Parse(ProjectFiles.Full, "p.yaml");
        Assert.Empty(first.Problems);
        string text1 = ProjectWriter.ToYaml(first.Project!);
        var second = ProjectReader.Parse(text1, "p.yaml");
        Assert.Empty(second.Problems);
        string text2 = ProjectWriter.ToYaml(second.Project!);
        Assert.Equal(text1, text2);
        // The model survives too (records compare by value; immutable lists by reference, so compare the text of each core).
        Assert.Equal(first.Project!.Cores.Select(c => c.Id), second.Project!.Cores.Select(c => c.Id));
        Assert.Equal(first.Project.Cores[1].Sections, second.Project.Cores[1].Sections);
        Assert.Equal(first.Project.Cores[0].Gaps, second.Project.Cores[0].Gaps);
    }

    [Fact]
    public void Save_is_atomic_and_keeps_a_backup()
    {
        using var dir = new TempFolder();
        string path = dir.Write("site.yaml", ProjectFiles.Full);
        var project = ProjectReader.Load(path).Project!;
        ProjectWriter.Save(project with { Site = project.Site with { Name = "Renamed" } }, path);
        Assert.Equal(ProjectFiles.Full, File.ReadAllText(path + ".bak"));
        var reread = ProjectReader.Load(path);
        Assert.Empty(reread.Problems);
        Assert.Equal("Renamed", reread.Project!.Site.Name);
        // No temporary file is left beside the project.
        Assert.Equal(["site.yaml", "site.yaml.bak"], Directory.GetFiles(dir.Path).Select(Path.GetFileName).Order());
    }
}
