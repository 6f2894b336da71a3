using System.Reflection;
using System.Security.Cryptography;
using System.Text.Json;
using StratLink.Model;
using StratLink.ProjectIO;

namespace StratLink.Export;

/// <summary>
/// <c>run.json</c>: what is needed to reproduce a build bit for bit: program version, SHA-256 of
/// the project file and of every input table, the settings and the random seed. No clock time but
/// the optional stage table (seconds per stage, <c>stages_seconds</c>, last), so two runs of the
/// same inputs write files that differ in those figures only.
/// </summary>
public static class RunManifest
{
    public static string ProgramVersion =>
        typeof(RunManifest).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion.Split('+')[0]
        ?? typeof(RunManifest).Assembly.GetName().Version?.ToString() ?? "0";

    public static void Write(string path, ProjectDocument document, Project project, IReadOnlyDictionary<string, string> methods,
        IEnumerable<string> outputFiles, IReadOnlyList<(string Stage, double Seconds)>? stages = null)
    {
        using var stream = new MemoryStream();
        using (var w = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true }))
        {
            w.WriteStartObject();
            w.WriteString("program", "stratlink");
            w.WriteString("version", ProgramVersion);
            w.WriteString("project_file", Path.GetFileName(document.FilePath));
            w.WriteString("project_sha256", Sha256(document.FilePath));
            w.WriteString("depth_unit", Quantities.DepthUnits.Symbol(project.DepthUnit));
            w.WriteNumber("seed", project.AgeModel.Seed);
            w.WriteStartObject("inputs");
            foreach (var core in project.Cores)
            {
                string full = document.Resolve(core.Table);
                w.WriteString(core.Table, File.Exists(full) ? Sha256(full) : "missing");
            }
            foreach (var extra in project.Ages.OfType<VarveCountControl>().Select(v => v.Table)
                         .Concat(project.Ages.OfType<RadiocarbonAgeControl>().Select(r => r.Curve))
                         .Concat(TargetTables(project.Target)).Distinct())
            {
                string full = document.Resolve(extra);
                w.WriteString(extra, File.Exists(full) ? Sha256(full) : "missing");
            }
            w.WriteEndObject();
            w.WriteStartObject("methods");
            foreach (var (stage, method) in methods) w.WriteString(stage, method);
            w.WriteEndObject();
            w.WriteString("settings_yaml", ProjectWriter.ToYaml(project with { Cores = [], Markers = [], Ages = [] }));
            w.WriteStartArray("outputs");
            foreach (string f in outputFiles) w.WriteStringValue(f);
            w.WriteEndArray();
            if (stages is not null)
            {
                w.WriteStartObject("stages_seconds");
                foreach (var (stage, seconds) in stages) w.WriteNumber(stage, Math.Round(seconds, 3));
                w.WriteEndObject();
            }
            w.WriteEndObject();
        }
        AtomicFile.WriteAllText(path, System.Text.Encoding.UTF8.GetString(stream.ToArray()) + "\n", keepBackup: false);
    }

    // A dated target's record (and its age model) dates cores as much as their own controls do.
    private static IEnumerable<string> TargetTables(DatedTargetSpec? target) =>
        target is null ? [] : target.AgeModel is { } model ? [target.Table, model.Table] : [target.Table];

    public static string Sha256(string path)
    {
        using var fs = File.OpenRead(path);
        return Convert.ToHexStringLower(SHA256.HashData(fs));
    }
}
