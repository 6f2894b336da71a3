using StratLink.ProjectIO;
using StratLink.Tests.Tables;

namespace StratLink.Tests.ProjectIO;

/// <summary>
/// Saving keeps the YAML language server's schema line ("# yaml-language-server: $schema=PATH" on the
/// first line, the modeline of the redhat-developer/yaml-language-server README) that new and demo projects start with.
/// </summary>
public class ProjectWriterTests
{
    [Theory]
    [InlineData("# yaml-language-server: $schema=stratlink-project.schema.json")]
    [InlineData("# yaml-language-server: $schema=../schemas/stratlink-project.schema.json")]
    public void Save_keeps_the_schema_line_of_the_file_it_replaces(string modeline)
    {
        using var dir = new TempFolder();
        string path = dir.Write("site.yaml", modeline + "\n" + ProjectFiles.Full);
        var project = ProjectReader.Load(path).Project!;
        ProjectWriter.Save(project with { Site = project.Site with { Name = "Renamed" } }, path);
        var lines = File.ReadAllLines(path);
        Assert.Equal(modeline, lines[0]);
        Assert.Equal(1, lines.Count(l => l.Contains("yaml-language-server", StringComparison.Ordinal)));
        var reread = ProjectReader.Load(path);
        Assert.Empty(reread.Problems);
        Assert.Equal("Renamed", reread.Project!.Site.Name);
    }

    [Fact]
    public void Save_adds_no_schema_line_to_a_file_without_one()
    {
        using var dir = new TempFolder();
        string path = dir.Write("site.yaml", ProjectFiles.Full);
        ProjectWriter.Save(ProjectReader.Load(path).Project!, path);
        Assert.DoesNotContain("yaml-language-server", File.ReadAllText(path), StringComparison.Ordinal);
    }
}
