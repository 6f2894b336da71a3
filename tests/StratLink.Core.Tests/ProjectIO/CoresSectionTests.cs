using StratLink.Model;
using StratLink.ProjectIO;

namespace StratLink.Tests.ProjectIO;

/// <summary>The core keys for tables as they come and archive metadata: read, checked, and written back unchanged.</summary>
public sealed class CoresSectionTests
{
    private const string Head = "format: stratlink-project/1\nsite: {name: Gullhaven Sound}\ndepth_unit: cm\ncores:\n";

    [Fact]
    public void Replicate_renaming_unit_and_metadata_keys_read_and_survive_a_save()
    {
        const string core = """
              - id: GS-1
                table: cores/GS-1.txt
                repeated_depths: median
                columns: {"o18(o/oo PDB)": d18O}
                units: {d18O: permil VPDB}
                citation: "Author, A. (2021): Isotopes of GS-1"
                latitude: 60.12
                longitude: -5.34
                coring_year: 2021
            """;
        var doc = ProjectReader.Parse(Head + core, "site.stratlink.yaml");
        Assert.Empty(doc.Problems);
        var c = doc.Project!.Cores.Single();
        Assert.Equal(RepeatedDepths.Median, c.RepeatedDepths);
        Assert.Equal("o18(o/oo PDB)", c.ColumnOf("d18O"));
        Assert.Equal("d18O", c.Columns["o18(o/oo PDB)"]);
        Assert.Equal("permil VPDB", c.Units["d18O"]);
        Assert.Equal("Author, A. (2021): Isotopes of GS-1", c.Citation);
        Assert.Equal((60.12, -5.34), (c.Latitude, c.Longitude));
        Assert.Equal(2021, c.CoringYear);

        var again = ProjectReader.Parse(ProjectWriter.ToYaml(doc.Project), "site.stratlink.yaml");
        Assert.Empty(again.Problems);
        Assert.Equal(ProjectWriter.ToYaml(doc.Project), ProjectWriter.ToYaml(again.Project!));
        Assert.Equal(c.Columns, again.Project!.Cores.Single().Columns);
    }

    [Theory]
    [InlineData("repeated_depths: average", "cores[GS-1].repeated_depths", "error, mean, median or first")]
    [InlineData("repeated_depths: 1", "cores[GS-1].repeated_depths", "error, mean, median or first")]
    [InlineData("columns: {a: x, b: x}", "cores[GS-1].columns", "both mapped onto signal 'x'")]
    [InlineData("columns: [a, b]", "cores[GS-1].columns", "mapping of names")]
    [InlineData("latitude: 91", "cores[GS-1].latitude", "outside -90..90")]
    [InlineData("coring_year: 19", "cores[GS-1].coring_year", "not a year CE")]
    [InlineData("coring_year: 2019.5", "cores[GS-1].coring_year", "whole number")]
    public void Bad_values_name_the_key_and_the_line(string line, string field, string message)
    {
        var doc = ProjectReader.Parse(Head + "  - id: GS-1\n    table: t.csv\n    " + line + "\n", "site.stratlink.yaml");
        var e = Assert.Single(doc.Problems);
        Assert.Equal(field, e.Field);
        Assert.Equal(7, e.Line);
        Assert.Contains(message, e.Message);
    }
}
