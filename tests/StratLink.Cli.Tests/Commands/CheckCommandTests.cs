using System.Text.Json;
using StratLink.Tests.TestSupport;

namespace StratLink.Tests.Commands;

public sealed class CheckCommandTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("stratlink-check-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public void The_demo_has_no_errors()
    {
        var (code, output, err) = CliRunner.Run("check", CliRunner.CopyDemo(_dir));
        Assert.True(code == 0, output + err);
        Assert.Contains("0 error(s)", output);
    }

    [Fact]
    public void An_error_in_the_project_exits_1_and_names_file_line_and_key()
    {
        string project = CliRunner.CopyDemo(_dir);
        File.WriteAllText(project, File.ReadAllText(project).Replace("  window: 0.15", "  windw: 0.15"));
        var (code, output, _) = CliRunner.Run("check", project, "--format", "json");
        Assert.Equal(1, code);
        using var doc = JsonDocument.Parse(output);
        var finding = doc.RootElement.EnumerateArray().Single(f => f.GetProperty("code").GetString() == "project.unknown-key");
        Assert.Equal("alignment.windw", finding.GetProperty("field").GetString());
        Assert.EndsWith(".stratlink.yaml", finding.GetProperty("file").GetString());
        int line = finding.GetProperty("line").GetInt32();
        Assert.Contains("windw", File.ReadAllLines(project)[line - 1]);
        Assert.Contains("did you mean 'window'", finding.GetProperty("message").GetString());
    }

    [Fact]
    public void A_missing_project_file_is_exit_2_on_stderr()
    {
        var (code, output, err) = CliRunner.Run("check", Path.Combine(_dir, "nowhere.stratlink.yaml"));
        Assert.Equal(2, code);
        Assert.Equal("", output);
        Assert.Contains("nowhere.stratlink.yaml", err);
    }

    [Fact]
    public void Bad_usage_is_exit_2()
    {
        Assert.Equal(2, CliRunner.Run("check").Code);
        Assert.Equal(2, CliRunner.Run("check", "x.yaml", "--format", "xml").Code);
    }

    [Fact]
    public void Csv_form_has_the_checks_columns()
    {
        string project = CliRunner.CopyDemo(_dir);
        File.WriteAllText(project, File.ReadAllText(project).Replace("depth_unit: cm", "depth_unit: inch"));
        var (code, output, _) = CliRunner.Run("check", project, "--format", "csv");
        Assert.Equal(1, code);
        var lines = output.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.StartsWith("severity,code,core,item,depth_", lines[0]);
        Assert.Contains(lines, l => l.StartsWith("error,project.unknown-unit,", StringComparison.Ordinal));
    }
}
