using System.Collections.Immutable;
using StratLink.Alignment;
using StratLink.Checks;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Tables;
using StratLink.Workflows;

namespace StratLink.Tests.Checks;

/// <summary>Hand-built projects, tables and stand-in aligners for the checks tests (depths in cm).</summary>
internal static class CheckFixtures
{
    public const DepthUnit Unit = DepthUnit.Centimetre;
    public static readonly string ProjectPath = Path.Combine(Path.GetTempPath(), "stratlink-checks", "site.yaml");

    public static CoreDepth D(double cm) => CoreDepth.From(cm, Unit);

    /// <summary>A core table sampled every <paramref name="step"/> cm from top to bottom, one signal.</summary>
    public static CoreTable Table(string core, double top = 0, double bottom = 100, double step = 1)
    {
        int n = (int)Math.Round((bottom - top) / step) + 1;
        var depths = Enumerable.Range(0, n).Select(i => top + i * step).ToArray();
        var ms = depths.Select(d => Math.Sin(d / 7.0)).ToArray();
        return new CoreTable(core, Unit, depths, new Dictionary<string, double[]> { ["ms"] = ms });
    }

    public static CoreSpec Core(string id) => new() { Id = id, Table = $"cores/{id}.csv" };

    public static MarkerSpec Marker(string id, double uncertainty, params (string Core, double Depth)[] depths) => new()
    {
        Id = id,
        Kind = MarkerKind.Tephra,
        Uncertainty = uncertainty,
        Depths = depths.Select(d => new MarkerDepth(d.Core, D(d.Depth))).ToImmutableList(),
    };

    public static Project Project(IEnumerable<string> cores, IEnumerable<MarkerSpec>? markers = null, IEnumerable<AgeControlSpec>? ages = null) => new()
    {
        DepthUnit = Unit,
        Cores = cores.Select(Core).ToImmutableList(),
        Markers = (markers ?? []).ToImmutableList(),
        Ages = (ages ?? []).ToImmutableList(),
        Composite = new CompositeSettings { Step = 0.5 },
    };

    /// <summary>The project with a table for every core (0-100 cm unless given).</summary>
    public static LoadedProject Load(Project p, params CoreTable[] tables)
    {
        var byId = p.Cores.ToDictionary(c => c.Id, c => tables.FirstOrDefault(t => t.CoreId == c.Id) ?? Table(c.Id));
        return new LoadedProject(new ProjectDocument(ProjectPath, p, [], new SourceMap(ProjectPath)), p, byId, []);
    }

    public static IReadOnlyList<Finding> Run(LoadedProject lp, CheckContext? ctx = null, AlignmentResult? alignment = null) =>
        ProjectChecks.Run(lp, alignment, ctx ?? new CheckContext(), CancellationToken.None);

    public static CalendarAgeControl Calendar(string id, string core, double depth, double age, double error) =>
        new() { Id = id, Core = core, Depth = D(depth), Age = CalendarAge.FromYearsBP(age), Error = error };

    public static RadiocarbonAgeControl Radiocarbon(string id, string core, double depth, double c14, double error, string curve) =>
        new() { Id = id, Core = core, Depth = D(depth), C14Age = RadiocarbonAge.FromYearsBP(c14), C14Error = error, Curve = curve };
}

/// <summary>
/// A stand-in for the signal aligner: every core is a straight line of a hidden true depth t,
/// core depth = Scale * t + Offset, and the "signals" recover that exactly. A distortion can be added to
/// one core's mapping when one reference is used, to break the loop closure on purpose.
/// </summary>
internal sealed class LinearTruthAligner(IReadOnlyDictionary<string, (double Scale, double Offset)> truth)
{
    public List<Project> Calls { get; } = [];

    /// <summary>(reference, core) to extra composite depth added at the core's knots (core depth, extra).</summary>
    public Dictionary<(string Reference, string Core), (double Depth, double Extra)[]> Distortions { get; } = [];

    /// <summary>(reference, core) to the distortion of the median when an ensemble is asked for, instead of <see cref="Distortions"/>.</summary>
    public Dictionary<(string Reference, string Core), (double Depth, double Extra)[]> SampledDistortions { get; } = [];

    /// <summary>(reference, core) whose alignment leaves the core's top or base open: it may start (stop) at any depth of the reference.</summary>
    public Dictionary<(string Reference, string Core), (bool Begin, bool End)> OpenEnds { get; } = [];

    /// <summary>(reference, core) to the half-width of the core's 95 % band when an ensemble is asked for (instead of <see cref="Band"/>).</summary>
    public Dictionary<(string Reference, string Core), double> SampledBands { get; } = [];

    /// <summary>Half-width (composite depth) of every mapping's 95 % band: half the members lie that far above the median, half below.</summary>
    public double Band { get; set; }

    public double CoreDepthOf(string core, double t) => truth[core].Scale * t + truth[core].Offset;

    public AlignmentResult Align(LoadedProject lp, CancellationToken ct)
    {
        Calls.Add(lp.Project);
        string reference = lp.Project.ReferenceCoreId;
        var maps = new Dictionary<string, MappingEnsemble>();
        var diagnostics = new Dictionary<string, CoreAlignmentDiagnostics>();
        foreach (var (id, table) in lp.Tables)
        {
            var knots = new SortedSet<double> { table.Depths[0], table.Depths[^1] };
            bool ensemble = lp.Project.Alignment.Ensemble > 0;
            if (!(ensemble && SampledDistortions.TryGetValue((reference, id), out var bumps))) Distortions.TryGetValue((reference, id), out bumps);
            foreach (var b in bumps ?? []) knots.Add(b.Depth);
            double[] core = knots.ToArray();
            double[] composite = core.Select(x =>
            {
                double t = (x - truth[id].Offset) / truth[id].Scale;
                return CoreDepthOf(reference, t) + (bumps?.FirstOrDefault(b => b.Depth == x).Extra ?? 0);
            }).ToArray();
            DepthMapping Shifted(double by) => new(id, CheckFixtures.Unit, core, composite.Select(v => v + by).ToArray());
            double band = ensemble && SampledBands.TryGetValue((reference, id), out double sampled) ? sampled : Band;
            var members = band > 0 ? Enumerable.Range(0, 200).Select(k => Shifted(k % 2 == 0 ? -band : band)).ToArray() : [];
            maps[id] = new MappingEnsemble(Shifted(0), members);
            var (begin, end) = OpenEnds.GetValueOrDefault((reference, id));
            diagnostics[id] = new CoreAlignmentDiagnostics { CoreId = id, Method = "test-truth", OpenBegin = begin, OpenEnd = end };
        }
        return new AlignmentResult(reference, "test-truth", maps, null, diagnostics);
    }
}
