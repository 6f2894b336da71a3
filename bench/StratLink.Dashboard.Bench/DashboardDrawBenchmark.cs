using System.Collections.Immutable;
using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Running;
using StratLink.Checks;
using StratLink.Cli.Dashboard;
using StratLink.Cli.Dashboard.Dialogs;
using StratLink.Cli.Dashboard.Drawing;
using StratLink.Cli.Dashboard.Views;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Tables;
using StratLink.Workflows;
using Terminal.Gui.App;
using Terminal.Gui.Drivers;

namespace StratLink.Benchmarks;

/// <summary>
/// Time to lay out and draw the whole dashboard with six logs of 20,000 samples each, at 80x24 and
/// 200x60 (the target is under 50 ms a frame). Runs on the in-memory driver: <c>dotnet run -c
/// Release --project bench/StratLink.Dashboard.Bench</c>.
/// </summary>
[MemoryDiagnoser]
public class DashboardDrawBenchmark
{
    private IApplication _app = null!;
    private DashboardWindow _window = null!;
    private SessionToken? _token;

    [Params(80, 200)]
    public int Width { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        Environment.SetEnvironmentVariable("DisableRealDriverIO", "1");
        _app = Application.Create();
        _app.Init(DriverRegistry.Names.ANSI);
        _app.Driver!.SetScreenSize(Width, Width == 80 ? 24 : 60);
        var loaded = SixCores(20_000);
        var state = new DashboardState(loaded);
        _window = new DashboardWindow(_app, state, new NoWorkflows(loaded), new NoPrompts(), GlyphSet.Utf8, null, null);
        _token = _app.Begin(_window);
        _app.LayoutAndDraw();
        while (_window.Logs.Slots.Count < 6) _window.Logs.MoreLogs();
        _app.LayoutAndDraw();
        if (_window.Logs.Slots.Count != 6) throw new InvalidOperationException($"{_window.Logs.Slots.Count} logs shown, not six.");
    }

    /// <summary>The toolkit's cost of a full frame with a near-empty screen (the findings list), for comparison.</summary>
    [Benchmark(Baseline = true)]
    public void FrameWithoutLogs()
    {
        _window.ShowScreen(Screen.Findings);
        _app.LayoutAndDraw(forceRedraw: true);
        _window.ShowScreen(Screen.Logs);
    }

    /// <summary>One frame after the cursor moved: every log is binned and drawn again.</summary>
    [Benchmark]
    public void DrawSixLogs()
    {
        _window.Logs.MoveCursorRows(1);
        _window.Logs.SetNeedsDraw();
        _app.LayoutAndDraw(forceRedraw: true);
    }

    /// <summary>The correlation view's own drawing (binning, braille, ties), without the toolkit's frame output.</summary>
    [Benchmark]
    public void DrawSixLogsViewOnly()
    {
        _window.Logs.MoveCursorRows(1);
        _window.Logs.SetNeedsDraw();
        _window.Logs.Draw(null);
    }

    [GlobalCleanup]
    public void Cleanup()
    {
        if (_token is not null) _app.End(_token);
        _window.Dispose();
        _app.Dispose();
    }

    private static LoadedProject SixCores(int samples)
    {
        const string path = "/nonexistent/bench.yaml";
        var u = DepthUnit.Centimetre;
        var ids = new[] { "B-1", "B-2", "B-3", "B-4", "B-5", "B-6" };
        var tables = new Dictionary<string, CoreTable>();
        var rng = new Random(1);
        foreach (var (id, k) in ids.Select((id, k) => (id, k)))
        {
            var depths = new double[samples];
            var ms = new double[samples];
            for (int i = 0; i < samples; i++)
            {
                depths[i] = i * 0.05;
                ms[i] = 100 + 40 * Math.Sin(depths[i] / (8 + k)) + 10 * rng.NextDouble();
            }
            tables[id] = new CoreTable(id, u, depths, new Dictionary<string, double[]> { ["ms"] = ms });
        }
        var markers = Enumerable.Range(1, 40).Select(m => new MarkerSpec
        {
            Id = $"m{m}",
            // Every other marker only in the first and last core: ties drawn across the logs between.
            Depths = ids.Select((id, k) => (id, k)).Where(x => m % 2 == 1 || x.k == 0 || x.k == ids.Length - 1)
                .Select(x => new MarkerDepth(x.id, CoreDepth.From(m * 24.0 + x.k, u))).ToImmutableList(),
        }).ToImmutableList();
        var project = new Project
        {
            Site = new SiteInfo("Bench"),
            Cores = ids.Select(id => new CoreSpec
            {
                Id = id,
                Table = id + ".csv",
                Gaps = [DepthInterval.FromTopBottom(300, 310, u)],
            }).ToImmutableList(),
            Markers = markers,
        };
        var document = new ProjectDocument(path, project, new FindingList(), new SourceMap(path));
        return new LoadedProject(document, project, tables, new FindingList());
    }

    private sealed class NoPrompts : IPrompts
    {
        public string? AskText(string title, string label, string initial) => null;
        public int? Choose(string title, string message, IReadOnlyList<string> options, int initial = 0) => null;
        public void ShowText(string title, IReadOnlyList<string> lines) { }
    }

    private sealed class NoWorkflows(LoadedProject loaded) : IDashboardWorkflows
    {
        public LoadedProject Load(string projectPath, CancellationToken cancellation) => loaded;
        public string? RunUnavailable => "benchmark";
        public Cli.Dashboard.Results.RunResults Run(LoadedProject project, IProgress<WorkProgress> progress, CancellationToken cancellation) =>
            throw new InvalidOperationException(RunUnavailable);
        public IReadOnlyList<Cli.Dashboard.Results.AnalysisNote> Analyse(Cli.Dashboard.Results.RunResults results, string signal,
            IProgress<WorkProgress> progress, CancellationToken cancellation) => throw new InvalidOperationException(RunUnavailable);
        public string? ExportUnavailable => "benchmark";
        public string Export(LoadedProject project, Cli.Dashboard.Results.RunResults results, string folder, CancellationToken cancellation) =>
            throw new InvalidOperationException(ExportUnavailable);
    }
}

public static class Program
{
    public static void Main(string[] args) => BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
}
