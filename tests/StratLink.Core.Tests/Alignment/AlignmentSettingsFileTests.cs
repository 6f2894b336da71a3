using StratLink.Model;
using StratLink.ProjectIO;

namespace StratLink.Tests.Alignment;

/// <summary>The alignment engine's optional project keys: read, validated with line numbers, written only when not default.</summary>
public class AlignmentSettingsFileTests
{
    private const string Head = """
        format: stratlink-project/1
        depth_unit: cm
        cores:
          - id: A
            table: a.csv
          - id: B
            table: b.csv
        alignment:
          reference: A

        """;

    [Fact]
    public void New_keys_round_trip_and_defaults_are_not_written()
    {
        string text = Head + """
              pattern: asymmetric
              step: 0.5
              standardise: robust
              derivative: true
              detrend: yes
              rate_penalty: 0.25
              open_begin: true
              open_end: auto
              seed: 99
              scale: reference
            """.Replace("\n    ", "\n  ");
        var doc = ProjectReader.Parse(text, "p.yaml");
        Assert.False(doc.Problems.HasErrors, string.Join("\n", doc.Problems));
        var a = doc.Project!.Alignment;
        Assert.Equal(("asymmetric", 0.5, "robust", true, true, 0.25, true, true, 99), (a.Pattern, a.Step!.Value, a.Standardise, a.Derivative, a.Detrend, a.RatePenalty, a.OpenBegin!.Value, a.OpenEnd is null, a.Seed!.Value));
        Assert.Equal(AlignmentScales.Reference, a.Scale);
        var again = ProjectReader.Parse(ProjectWriter.ToYaml(doc.Project), "p.yaml");
        Assert.False(again.Problems.HasErrors, string.Join("\n", again.Problems));
        Assert.Equal(a, again.Project!.Alignment);

        string plain = ProjectWriter.ToYaml(ProjectReader.Parse(Head, "p.yaml").Project!);
        foreach (string key in new[] { "pattern", "step:", "standardise", "derivative", "detrend", "rate_penalty", "open_begin", "open_end", "seed", "scale" })
            Assert.DoesNotContain(key, plain.Split("alignment:")[1].Split("composite:")[0]);
        Assert.Equal(new AlignmentSettings { Reference = "A" }, ProjectReader.Parse(plain, "p.yaml").Project!.Alignment);
        Assert.Equal(AlignmentScales.Site, ProjectReader.Parse(plain, "p.yaml").Project!.Alignment.Scale);
    }

    [Theory]
    [InlineData("pattern: itakura", "alignment.pattern", "unknown step pattern")]
    [InlineData("open_begin: maybe", "alignment.open_begin", "true or false")]
    [InlineData("step: -1", "alignment.step", "positive")]
    [InlineData("standardise: minmax", "alignment.standardise", "zscore or robust")]
    [InlineData("rate_penalty: -2", "alignment.rate_penalty", "cannot be negative")]
    [InlineData("scale: global", "alignment.scale", "site or reference")]
    public void Bad_values_are_errors_naming_the_key_and_line(string lines, string field, string words)
    {
        var doc = ProjectReader.Parse(Head + "  " + lines + "\n", "p.yaml");
        var e = Assert.Single(doc.Problems, f => f.Field == field);
        Assert.Contains(words, e.Message);
        Assert.True(e.Line >= 10, $"line {e.Line}");
    }
}
