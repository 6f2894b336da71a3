using StratLink.Checks;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Tests.Tables;
using StratLink.Workflows;

namespace StratLink.Tests.Workflows;

/// <summary>Drafting a project from archive files keeps their metadata in the project.</summary>
public sealed class NewProjectWorkflowTests : IDisposable
{
    private readonly TempFolder _dir = new();

    public void Dispose() => _dir.Dispose();

    /// <summary>
    /// Two files of our own in the /* */ description-block layout (PANGAEA wiki, "Metaheader": the block
    /// opens with "/* DATA DESCRIPTION:" and closes with "*/", then a tab-separated table of "Name [unit]"
    /// columns); one names its isotope column "δ18O [‰ PDB]", the other "d18O [per mil]". Values invented.
    /// </summary>
    [Fact]
    public void Description_block_files_give_a_project_holding_their_citation_position_and_units()
    {
        Write("GS-7.tab", "GS-7", 60.12, 5.43, "δ18O [‰ PDB]", 0);
        Write("GS-8.tab", "GS-8", 60.15, 5.40, "d18O [per mil]", 0.4);
        var plan = NewProjectWorkflow.Draft([_dir.Path], Path.Combine(_dir.Path, "site.stratlink.yaml"));
        Assert.True(plan.CanWrite, string.Join("\n", plan.Problems));
        Assert.Equal(DepthUnit.Metre, plan.Unit);
        Assert.Equal(["d18O"], plan.Signals);
        NewProjectWorkflow.Write(plan);

        var loaded = ProjectLoader.Load(plan.ProjectPath);
        Assert.False(loaded.Problems.HasErrors, string.Join("\n", loaded.Problems));
        var gs7 = loaded.Project.FindCore("GS-7")!;
        Assert.Equal("δ18O [‰ PDB]", gs7.ColumnOf("d18O"));
        Assert.Equal("‰ PDB", gs7.Units["d18O"]);
        Assert.StartsWith("Author, A (2021): Stable isotopes of core GS-7.", gs7.Citation);
        Assert.Equal(60.12, gs7.Latitude);
        Assert.Equal(5.43, gs7.Longitude);
        Assert.Equal("per mil", loaded.Project.FindCore("GS-8")!.Units["d18O"]);
        Assert.Equal(loaded.Tables["GS-7"].Count, loaded.Tables["GS-8"].Count);
        Assert.True(File.Exists(Path.Combine(_dir.Path, ProjectSchema.FileName)));
    }

    [Fact]
    public void A_draft_with_problems_cannot_be_written()
    {
        var plan = NewProjectWorkflow.Draft([_dir.Path], null);
        Assert.False(plan.CanWrite);
        Assert.Contains(plan.Problems, p => p.Severity == Severity.Error && p.Message.Contains("no table files"));
        Assert.Throws<InvalidOperationException>(() => NewProjectWorkflow.Write(plan));
        Assert.Empty(Directory.GetFileSystemEntries(_dir.Path));
    }

    private void Write(string name, string site, double lat, double lon, string column, double offset)
    {
        var text = new System.Text.StringBuilder();
        text.Append("/* DATA DESCRIPTION:\n")
            .Append($"Citation:\tAuthor, A (2021): Stable isotopes of core {site}. Invented Data Archive\n")
            .Append(System.FormattableString.Invariant($"Event(s):\t{site} * LATITUDE: {lat} * LONGITUDE: {lon} * METHOD/DEVICE: Gravity corer\n"))
            .Append("Parameter(s):\tDepth, sediment/rock [m] (Depth sed) * GEOCODE\n")
            .Append($"\t{column} * PI: Author, A\n")
            .Append("*/\n")
            .Append($"Depth sed [m]\t{column}\n");
        for (int i = 0; i < 60; i++)
            text.Append(System.FormattableString.Invariant($"{i * 0.05:0.00}\t{3.5 + Math.Sin(i / 5.0 + offset):0.000}\n"));
        _dir.Write(name, text.ToString());
    }
}
