using StratLink.Checks;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Workflows;

namespace StratLink.Tests.ProjectIO;

/// <summary>The optional <c>target</c> section: defaults, round trip, and bad input named by file, line and key.</summary>
public sealed class TargetSectionTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("stratlink-target-section-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    // Lines 1-5; the target section starts on line 6, its keys on 7 onwards.
    private const string Head = "format: stratlink-project/1\ndepth_unit: cm\ncores:\n  - id: A\n    table: a.csv\n";

    private static ProjectDocument Parse(string target) => ProjectReader.Parse(Head + "target:\n" + target, "p.yaml");

    [Fact]
    public void Defaults_and_every_key_round_trip()
    {
        var plain = Parse("  table: stack.txt\n  signal: d18o\n");
        Assert.Empty(plain.Problems);
        var t = plain.Project!.Target!;
        Assert.Equal(("age", DatedTargetAgeUnits.Years, 1.0, null, null, null), (t.AgeColumn, t.AgeUnit, t.YearsPerUnit, t.AgeError, t.Spacing, t.AgeSpan));
        Assert.Equal(["A"], plain.Project.TargetCoreIds);

        var full = Parse("  table: stack.txt\n  age_column: Time (ka)\n  age_unit: ka\n  header_line: 5\n  signal: d18o\n"
            + "  columns: {\"Benthic d18O\": d18o}\n  age_error: 4000\n  age_span: [3, 4979]\n  cores: [A]\n  spacing: 250\n");
        Assert.Empty(full.Problems);
        var again = ProjectReader.Parse(ProjectWriter.ToYaml(full.Project!), "p.yaml");
        Assert.Empty(again.Problems);
        Assert.Equal(full.Project!.Target! with { Columns = [], Cores = [] }, again.Project!.Target! with { Columns = [], Cores = [] });
        Assert.Equal(full.Project.Target!.Columns, again.Project.Target!.Columns);
        Assert.Equal(full.Project.Target!.Cores, again.Project.Target!.Cores);
        Assert.Equal(1000, again.Project.Target!.YearsPerUnit);
    }

    [Fact]
    public void Bad_age_unit_names_its_line_and_key()
    {
        var f = Assert.Single(Parse("  table: stack.txt\n  signal: d18o\n  age_unit: Myr\n").Problems);
        Assert.Equal((ProjectCodes.InvalidValue, "p.yaml", 9, "target.age_unit"), (f.Code, f.File, f.Line, f.Field));
        Assert.Contains("'Myr'", f.Message);
    }

    [Fact]
    public void Unknown_core_names_its_line_and_key()
    {
        var f = Assert.Single(Parse("  table: stack.txt\n  signal: d18o\n  cores: [A, B]\n").Problems);
        Assert.Equal((ProjectCodes.UnknownCore, 9, "target.cores"), (f.Code, f.Line, f.Field));
        Assert.Contains("'B'", f.Message);
    }

    [Fact]
    public void Unknown_key_missing_signal_and_a_backwards_span_are_errors()
    {
        var problems = Parse("  table: stack.txt\n  age_spam: [0, 10]\n  age_span: [10, 0]\n").Problems;
        Assert.Contains(problems, f => f is { Code: ProjectCodes.UnknownKey, Line: 8, Field: "target.age_spam" } && f.Message.Contains("did you mean 'age_span'"));
        Assert.Contains(problems, f => f is { Code: ProjectCodes.MissingKey, Line: 7, Field: "target.signal" });
        Assert.Contains(problems, f => f is { Code: ProjectCodes.InvalidValue, Line: 9, Field: "target.age_span" });
        Assert.Equal(3, problems.Count);
    }

    private FindingList Load(string target, string? stack) => ProjectLoader.Load(WriteProject(target, stack)).Problems;

    private string WriteProject(string target, string? stack)
    {
        File.WriteAllText(Path.Combine(_dir, "a.csv"), "depth,d18o\n" + string.Concat(Enumerable.Range(0, 11).Select(k => $"{k * 10},{3 + k % 3 * 0.4}\n")));
        if (stack is not null) File.WriteAllText(Path.Combine(_dir, "stack.txt"), stack);
        string file = Path.Combine(_dir, "p.stratlink.yaml");
        File.WriteAllText(file, Head + "target:\n" + target);
        return file;
    }

    [Fact]
    public void Missing_table_names_the_project_file_line_and_key()
    {
        var f = Assert.Single(Load("  table: stack.txt\n  signal: d18o\n", stack: null));
        Assert.Equal((ProjectCodes.MissingFile, 7, "target.table"), (f.Code, f.Line, f.Field));
        Assert.EndsWith("p.stratlink.yaml", f.File);
        Assert.Contains("target table 'stack.txt' does not exist", f.Message);
    }

    [Fact]
    public void Signal_the_target_table_lacks_names_the_signal_key()
    {
        var f = Assert.Single(Load("  table: stack.txt\n  signal: d18o\n", "age,ms\n0,1\n1000,2\n"));
        Assert.Equal((ProjectCodes.UnknownSignal, 8, "target.signal"), (f.Code, f.Line, f.Field));
        Assert.Contains("ms", f.Message);
    }

    [Fact]
    public void A_readable_target_is_kept_in_years_inside_its_span()
    {
        var loaded = ProjectLoader.Load(WriteProject("  table: stack.txt\n  age_unit: ka\n  signal: d18o\n  age_error_column: err\n  age_span: [1, 3]\n",
            "age,d18o,err\n0,3.1,1\n1,3.2,2\n2,3.3,3\n3,3.4,4\n4,3.5,5\n"));
        Assert.False(loaded.Problems.HasErrors, string.Join("\n", loaded.Problems.Select(f => f.Message)));
        var t = loaded.Target!;
        Assert.Equal([1000.0, 2000, 3000], t.AgesBP);
        Assert.Equal([3.2, 3.3, 3.4], t.Values);
        Assert.Equal(2500, t.ErrorAt(1500), 9);
        Assert.Equal(4000, t.ErrorAt(9000), 9);
    }

    [Fact]
    public void A_target_on_depth_with_its_age_model_round_trips()
    {
        var doc = Parse("  table: master.csv\n  depth_column: mcd\n  repeated_depths: mean\n  signal: d18o\n  age_unit: Ma\n"
            + "  age_model:\n    table: master-ages.txt\n    depth_column: mcd\n    age_column: age_ma\n    error_column: err\n    header_line: 2\n");
        Assert.Empty(doc.Problems);
        var t = doc.Project!.Target!;
        Assert.Equal(("mcd", RepeatedDepths.Mean, 1e6), (t.DepthColumn, t.RepeatedDepths, t.YearsPerUnit));
        Assert.Equal(new DatedTargetAgeModel { Table = "master-ages.txt", DepthColumn = "mcd", AgeColumn = "age_ma", ErrorColumn = "err", HeaderLine = 2 }, t.AgeModel);
        var again = ProjectReader.Parse(ProjectWriter.ToYaml(doc.Project), "p.yaml");
        Assert.Empty(again.Problems);
        Assert.Equal(t with { Columns = [], Cores = [] }, again.Project!.Target! with { Columns = [], Cores = [] });
    }

    [Theory]
    [InlineData("  depth_column: mcd\n", 9, "target.depth_column", "needs its age model")]
    [InlineData("  age_model: {table: ages.txt}\n", 9, "target.age_model", "depth_column")]
    [InlineData("  depth_column: mcd\n  age_column: age\n  age_model: {table: ages.txt}\n", 10, "target.age_column", "age_model")]
    [InlineData("  depth_column: mcd\n  age_error: 5\n  age_model: {table: ages.txt, error_column: e}\n", 10, "target.age_error", "once")]
    public void Contradicting_keys_of_a_target_on_depth_name_their_line_and_key(string keys, int line, string field, string says)
    {
        var f = Assert.Single(Parse("  table: master.csv\n  signal: d18o\n" + keys).Problems);
        Assert.Equal((ProjectCodes.InvalidValue, line, field), (f.Code, f.Line, f.Field));
        Assert.Contains(says, f.Message);
    }

    [Fact]
    public void A_target_on_depth_is_dated_by_its_age_model_linearly_and_not_beyond_it()
    {
        // Age model 10 m -> 1 ka, 30 m -> 5 ka: 200 yr per m between them; rows at 0 and 40 m lie outside.
        File.WriteAllText(Path.Combine(_dir, "ages.txt"), "depth age err\n10 1 0.1\n30 5 0.5\n");
        var loaded = ProjectLoader.Load(WriteProject("  table: stack.txt\n  depth_column: depth\n  signal: d18o\n  age_unit: ka\n  age_model: {table: ages.txt, error_column: err}\n",
            "depth,d18o\n0,3.0\n10,3.1\n15,3.2\n30,3.3\n40,3.4\n"));
        Assert.False(loaded.Problems.HasErrors, string.Join("\n", loaded.Problems.Select(f => f.Message)));
        var t = loaded.Target!;
        Assert.Equal([1000.0, 2000, 5000], t.AgesBP);
        Assert.Equal([3.1, 3.2, 3.3], t.Values);
        Assert.Equal(200, t.ErrorAt(2000), 9);
        var note = Assert.Single(loaded.Problems, f => f.Code == ProjectCodes.TableBeyondAgeModel);
        Assert.Contains("2 of the target's 5 rows", note.Message);
    }

    [Fact]
    public void An_age_model_whose_ages_do_not_increase_names_its_file_line_and_column()
    {
        File.WriteAllText(Path.Combine(_dir, "ages.txt"), "depth age\n10 1\n20 3\n30 2\n");
        var problems = Load("  table: stack.txt\n  depth_column: depth\n  signal: d18o\n  age_model: {table: ages.txt}\n", "depth,d18o\n10,3.1\n30,3.3\n");
        var f = Assert.Single(problems, f => f.Severity == Severity.Error);
        Assert.Equal((ProjectCodes.TableAgeOrder, 4, "age"), (f.Code, f.Line, f.Field));
        Assert.EndsWith("ages.txt", f.File);
        Assert.Contains("age 2 at depth 30 is not older than 3 at 20", f.Message);
    }
}
