using StratLink.Model;
using StratLink.ProjectIO;

namespace StratLink.Tests.ProjectIO;

/// <summary>The optional <c>age_model.rate_variability</c> and <c>age_model.rate_window</c> keys: default, round trip, bad values.</summary>
public sealed class AgeModelSectionTests
{
    private const string Head = "format: stratlink-project/1\ndepth_unit: cm\ncores:\n  - id: A\n    table: a.csv\nage_model:\n  iterations: 100\n";

    [Fact]
    public void Default_is_not_written_and_other_values_round_trip()
    {
        var plain = ProjectReader.Parse(Head, "p.yaml");
        Assert.Empty(plain.Problems);
        Assert.Equal(AgeModelSettings.DefaultRateVariability, plain.Project!.AgeModel.RateVariability);
        Assert.DoesNotContain("rate_variability", ProjectWriter.ToYaml(plain.Project));

        foreach (double v in new[] { 0, 0.35 })
        {
            var doc = ProjectReader.Parse(Head + $"  rate_variability: {v.ToString(System.Globalization.CultureInfo.InvariantCulture)}\n", "p.yaml");
            Assert.Empty(doc.Problems);
            Assert.Equal(v, doc.Project!.AgeModel.RateVariability);
            string text = ProjectWriter.ToYaml(doc.Project);
            Assert.Contains("rate_variability", text);
            var again = ProjectReader.Parse(text, "p.yaml");
            Assert.Empty(again.Problems);
            Assert.Equal(v, again.Project!.AgeModel.RateVariability);
        }
    }

    [Fact]
    public void Negative_variability_names_its_line()
    {
        var problems = ProjectReader.Parse(Head + "  rate_variability: -0.5\n", "p.yaml").Problems;
        var f = Assert.Single(problems, f => f.Code == ProjectCodes.InvalidValue);
        Assert.Equal(8, f.Line);
        Assert.Contains("rate_variability", f.Field);
    }

    [Fact]
    public void Rate_window_is_absent_by_default_and_round_trips()
    {
        var plain = ProjectReader.Parse(Head, "p.yaml");
        Assert.Null(plain.Project!.AgeModel.RateWindow);
        Assert.DoesNotContain("rate_window", ProjectWriter.ToYaml(plain.Project));

        var doc = ProjectReader.Parse(Head + "  rate_window: 2,5\n", "p.yaml");
        Assert.Empty(doc.Problems);
        Assert.Equal(2.5, doc.Project!.AgeModel.RateWindow);
        var again = ProjectReader.Parse(ProjectWriter.ToYaml(doc.Project), "p.yaml");
        Assert.Equal(2.5, again.Project!.AgeModel.RateWindow);
    }

    [Theory]
    [InlineData("0")]
    [InlineData("-1")]
    [InlineData(".inf")]
    public void Rate_window_that_holds_no_depth_names_its_line(string value)
    {
        var problems = ProjectReader.Parse(Head + $"  rate_window: {value}\n", "p.yaml").Problems;
        var f = Assert.Single(problems, f => f.Code == ProjectCodes.InvalidValue);
        Assert.Equal(8, f.Line);
        Assert.Contains("rate_window", f.Field);
    }
}
