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
        var f = Assert.Single(Parse("  table: stack.txt\n  signal: d18o\n  age_unit: Ma\n").Problems);
        Assert.Equal((ProjectCodes.InvalidValue, "p.yaml", 9, "target.age_unit"), (f.Code, f.File, f.Line, f.Field));
        Assert.Contains("'Ma'", f.Message);
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
}
