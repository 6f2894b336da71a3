using System.Globalization;
using System.Text;
using StratLink.Tests.TestSupport;

namespace StratLink.Tests.Commands;

/// <summary><c>stratlink new</c>: from the tables a lab has to a project that checks and builds without hand edits.</summary>
public sealed class NewCommandTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("stratlink-new-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public void The_demo_cores_folder_alone_becomes_a_project_that_checks_and_builds()
    {
        string cores = Path.Combine(_dir, "cores");
        foreach (string f in Directory.GetFiles(Path.Combine(RepoPaths.DemoDirectory, "cores")))
            Copy(f, cores);
        var (code, output, err) = CliRunner.Run("new", cores, "--yes");
        Assert.True(code == 0, output + err);
        string project = Path.Combine(cores, "cores.stratlink.yaml");
        string text = File.ReadAllText(project);
        Assert.StartsWith("# yaml-language-server: $schema=stratlink-project.schema.json\n", text);
        Assert.True(File.Exists(Path.Combine(cores, "stratlink-project.schema.json")));
        // The longest core is the reference; the varve tables are layer tables, not cores.
        Assert.Contains("reference: MW19-P1", text);
        Assert.Contains("signals: {ms: 1.0, density: 1.0, ca_ti: 1.0}", text);
        Assert.DoesNotContain("id: MW19-P1-varves", text);
        Assert.Contains("MW19-F4-varves.csv", output);

        AssertChecksAndBuilds(project, "ms_mean", "density_mean", "ca_ti_mean");
    }

    /// <summary>
    /// The Ceara Rise files as published (Bickert, Curry and Wefer 1997, Proc. ODP Sci. Results 154:239-254;
    /// ../shared/data/PROVENANCE.md): free-text preambles, blank-separated, depths in mcd (metres), sample-id
    /// columns, ODP 925 repeating 98 depths and ODP 927 49 (replicates on two species; counted with a
    /// Python one-liner over the mcd column), beside the authors' age-model tables, which are left out.
    /// </summary>
    [Fact]
    public void A_folder_of_the_Ceara_Rise_files_becomes_a_project_that_checks_and_builds()
    {
        string folder = Path.Combine(_dir, "ceara");
        foreach (string f in Directory.GetFiles(RepoPaths.Data("ceara-rise"))) Copy(f, folder);
        var (code, output, err) = CliRunner.Run("new", folder, "--yes", "--out", Path.Combine(folder, "ceara.stratlink.yaml"));
        Assert.True(code == 0, output + err);
        string project = Path.Combine(folder, "ceara.stratlink.yaml");
        string text = File.ReadAllText(project);
        Assert.Contains("depth_unit: m", text);
        Assert.Contains("- id: ODP925", text);
        Assert.Contains("- id: ODP927", text);
        Assert.Contains("depth_column: mcd", text);
        Assert.Contains("repeated_depths: mean          # 98 rows repeat a depth", text);
        Assert.Contains("repeated_depths: mean          # 49 rows repeat a depth", text);
        Assert.Contains("signals: {d18O: 1.0, d13C: 1.0}", text);
        Assert.Contains("agemodel", output);

        AssertChecksAndBuilds(project, "d18O_mean", "d13C_mean");

        // Without age controls the LiPD export holds the composite alone, depths in the project's unit.
        string lpd = Path.Combine(_dir, "ceara.lpd");
        var export = CliRunner.Run("export", project, "--what", "lipd", "--out", lpd);
        Assert.True(export.Code == 0, export.Out + export.Err);
        using var zip = System.IO.Compression.ZipFile.OpenRead(lpd);
        using var meta = System.Text.Json.JsonDocument.Parse(zip.GetEntry("bag/data/metadata.jsonld")!.Open());
        Assert.False(meta.RootElement.TryGetProperty("chronData", out _));
        var columns = meta.RootElement.GetProperty("paleoData")[0].GetProperty("measurementTable")[0].GetProperty("columns");
        Assert.Equal("m", columns[0].GetProperty("units").GetString());
    }

    [Fact]
    public void Two_cores_with_replicates_and_differently_named_columns_and_no_age_controls_build_with_exit_0()
    {
        string folder = Path.Combine(_dir, "lab");
        Directory.CreateDirectory(folder);
        // Core A: comma-separated, "d18O", two replicate rows every tenth depth. Core B: semicolon-separated
        // with decimal commas, depth in cm, the isotope column named as an older lab sheet would.
        var a = new StringBuilder("depth,d18O\n");
        for (int i = 0; i < 150; i++)
        {
            a.Append(Inv($"{i},{Signal(i):0.000}\n"));
            if (i % 10 == 5) a.Append(Inv($"{i},{Signal(i) + 0.1:0.000}\n"));
        }
        var b = new StringBuilder("depth_cm;o18(o/oo PDB)\n");
        for (int i = 0; i < 160; i++) b.Append(Inv($"{i};{Signal(i * 0.93 + 3):0.000}\n").Replace('.', ','));
        File.WriteAllText(Path.Combine(folder, "GS-A.csv"), a.ToString());
        File.WriteAllText(Path.Combine(folder, "GS-B.txt"), b.ToString());

        var (code, output, err) = CliRunner.Run("new", folder, "--yes");
        Assert.True(code == 0, output + err);
        string project = Path.Combine(folder, "lab.stratlink.yaml");
        string text = File.ReadAllText(project);
        Assert.Contains("columns: {\"o18(o/oo PDB)\": d18O}", text);
        Assert.Contains("repeated_depths: mean          # 15 rows repeat a depth", text);
        Assert.Contains("depth_unit: cm", text);
        Assert.Contains("ages: []", text);
        string outDir = AssertChecksAndBuilds(project, "d18O_mean");
        Assert.Contains("age-model.no-controls", File.ReadAllText(Path.Combine(outDir, "checks.csv")));

        // The same project written by hand, with the keys in block style, builds too.
        File.WriteAllText(Path.Combine(folder, "hand.stratlink.yaml"), """
            format: stratlink-project/1
            site: {name: Lab site}
            depth_unit: cm
            cores:
              - id: A
                table: GS-A.csv
                repeated_depths: median
              - id: B
                table: GS-B.txt
                depth_column: depth_cm
                columns:
                  "o18(o/oo PDB)": d18O
            alignment: {reference: B, signals: {d18O: 1.0}}
            """);
        AssertChecksAndBuilds(Path.Combine(folder, "hand.stratlink.yaml"), "d18O_mean");
    }

    [Fact]
    public void A_list_of_table_files_becomes_a_project_wherever_it_is_written()
    {
        string cores = Path.Combine(_dir, "lab", "cores");
        foreach (string id in new[] { "MW19-P1", "MW19-G3" }) Copy(Path.Combine(RepoPaths.DemoDirectory, "cores", id + ".csv"), cores);
        string project = Path.Combine(_dir, "lab", "site.stratlink.yaml");
        var (code, output, err) = CliRunner.Run("new", Path.Combine(cores, "MW19-P1.csv"), Path.Combine(cores, "MW19-G3.csv"), "--out", project, "--yes");
        Assert.True(code == 0, output + err);
        string text = File.ReadAllText(project);
        Assert.Contains("table: cores/MW19-P1.csv", text);
        Assert.Contains("table: cores/MW19-G3.csv", text);
        AssertChecksAndBuilds(project, "ms_mean");
    }

    [Fact]
    public void A_folder_without_tables_is_refused_naming_it_and_nothing_is_written()
    {
        string empty = Path.Combine(_dir, "empty");
        Directory.CreateDirectory(empty);
        File.WriteAllText(Path.Combine(empty, "notes.md"), "no tables here\n");
        var (code, _, err) = CliRunner.Run("new", empty, "--yes");
        Assert.Equal(2, code);
        Assert.Contains("no table files", err);
        Assert.Contains(empty, err);
        Assert.Equal(["notes.md"], Directory.GetFiles(empty).Select(Path.GetFileName));
    }

    [Fact]
    public void A_table_without_a_depth_like_column_is_refused_naming_the_file_and_nothing_is_written() =>
        AssertRefusedLeavingOnlyTheTables(TwoTables("nodepth", "depth,ms\n0,1\n1,2\n2,3\n", "position,ms\n0,1\n1,2\n"),
            "B.csv", "no column named like a depth");

    [Fact]
    public void Two_tables_with_no_common_signal_are_refused_listing_their_signals_and_nothing_is_written() =>
        AssertRefusedLeavingOnlyTheTables(TwoTables("nocommon", "depth,ms\n0,1\n1,2\n2,3\n", "depth,density\n0,1.1\n1,1.2\n"),
            "share no signal", "A.csv has ms", "B.csv has density");

    /// <summary>A folder holding A.csv and B.csv with the given texts.</summary>
    private string TwoTables(string name, string a, string b)
    {
        string folder = Path.Combine(_dir, name);
        Directory.CreateDirectory(folder);
        File.WriteAllText(Path.Combine(folder, "A.csv"), a);
        File.WriteAllText(Path.Combine(folder, "B.csv"), b);
        return folder;
    }

    private static void AssertRefusedLeavingOnlyTheTables(string folder, params string[] messages)
    {
        var (code, _, err) = CliRunner.Run("new", folder, "--yes");
        Assert.Equal(2, code);
        foreach (string m in messages) Assert.Contains(m, err);
        Assert.Equal(["A.csv", "B.csv"], Directory.GetFiles(folder).Select(Path.GetFileName).Order());
    }

    [Fact]
    public void An_existing_project_file_is_never_replaced()
    {
        string folder = Path.Combine(_dir, "exists");
        Directory.CreateDirectory(folder);
        File.WriteAllText(Path.Combine(folder, "A.csv"), "depth,ms\n0,1\n1,2\n2,3\n");
        string project = Path.Combine(folder, "site.stratlink.yaml");
        File.WriteAllText(project, "mine\n");
        var (code, _, err) = CliRunner.Run("new", folder, "--out", project, "--yes");
        Assert.Equal(2, code);
        Assert.Contains("exists", err);
        Assert.Equal("mine\n", File.ReadAllText(project));
    }

    /// <summary>check exits 0, build exits 0 and writes the composite with the given columns; returns the output folder.</summary>
    private string AssertChecksAndBuilds(string project, params string[] compositeColumns)
    {
        var check = CliRunner.Run("check", project);
        Assert.True(check.Code == 0, check.Out + check.Err);
        string outDir = Path.Combine(_dir, "out-" + Path.GetFileNameWithoutExtension(project) + "-" + Guid.NewGuid().ToString("N")[..6]);
        var build = CliRunner.Run("build", project, "--out", outDir);
        Assert.True(build.Code == 0, build.Out + build.Err);
        string header = File.ReadLines(Path.Combine(outDir, "composite.csv")).First();
        foreach (string c in compositeColumns) Assert.Contains(c, header.Split(','));
        return outDir;
    }

    private static double Signal(double depth) => Math.Sin(depth / 7.0) + 0.4 * Math.Sin(depth / 2.3);

    private static string Inv(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);

    private static void Copy(string file, string folder)
    {
        Directory.CreateDirectory(folder);
        File.Copy(file, Path.Combine(folder, Path.GetFileName(file)));
    }
}
