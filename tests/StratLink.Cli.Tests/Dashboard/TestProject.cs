using StratLink.Checks;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Tables;
using StratLink.Workflows;

namespace StratLink.Tests.Dashboard;

/// <summary>
/// A small invented three-core project for drawing and key tests, written to a temporary folder
/// (so save, backup and recovery files have somewhere real to go). The signals are plain sine
/// waves: the tests check drawing and editing, not science.
/// </summary>
internal sealed class TestProject : IDisposable
{
    public const string Yaml = """
        format: stratlink-project/1
        site:
          name: Testmere Basin
        depth_unit: cm
        cores:
          - id: T-1
            table: t1.csv
            disturbed:
              - [0, 4]
          - id: T-2
            table: t2.csv
            gaps:
              - [80, 85]
          - id: T-3
            table: t3.csv
            events:
              - [98, 104]
        markers:
          - id: ash-1
            kind: tephra
            depths: {T-1: 50, T-2: 45}
          - id: tb-1
            kind: turbidite
            depths: {T-1: 120, T-2: 110, T-3: 100}
        ages:
          - id: ash-1-age
            kind: calendar
            marker: ash-1
            age: 1200
            error: 20
          - id: top
            kind: calendar
            core: T-1
            depth: 0
            age: -68
            error: 1
        alignment:
          reference: T-1
          signals: {ms: 1.0}
        """;

    public TestProject(int samplesPerCore = 401, double step = 0.5, string yaml = Yaml, string fileName = "testmere.yaml")
    {
        Folder = Path.Combine(Path.GetTempPath(), "stratlink-dash-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(Folder);
        FilePath = Path.Combine(Folder, fileName);
        File.WriteAllText(FilePath, yaml);
        var document = ProjectReader.Load(FilePath);
        if (document.Project is null) throw new InvalidOperationException(string.Join("\n", document.Problems));
        var tables = new Dictionary<string, CoreTable>();
        foreach (var core in document.Project.Cores)
            tables[core.Id] = Table(core.Id, samplesPerCore, step, phase: core.Id[^1] - '1');
        var problems = new FindingList();
        problems.AddRange(document.Problems);
        Loaded = new LoadedProject(document, document.Project, tables, problems);
    }

    public string Folder { get; }
    public string FilePath { get; }
    public LoadedProject Loaded { get; }

    public static CoreTable Table(string id, int count, double step, int phase)
    {
        var depths = new double[count];
        var ms = new double[count];
        var density = new double[count];
        for (int i = 0; i < count; i++)
        {
            depths[i] = i * step;
            ms[i] = 100 + 50 * Math.Sin(depths[i] / 10.0 + phase);
            density[i] = 1.5 + 0.2 * Math.Cos(depths[i] / 7.0);
        }
        return new CoreTable(id, DepthUnit.Centimetre, depths, new Dictionary<string, double[]> { ["ms"] = ms, ["density"] = density });
    }

    public void Dispose()
    {
        try { Directory.Delete(Folder, recursive: true); } catch (IOException) { }
    }
}
