using System.Collections.Immutable;
using StratLink.Alignment;
using StratLink.Checks;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Tables;
using StratLink.Workflows;

namespace StratLink.Tests.AgeModelling;

/// <summary>Builds small projects, tables and hand-made alignments for age-model tests (no alignment method needed).</summary>
internal static class AgeModelFixture
{
    public const DepthUnit Unit = DepthUnit.Centimetre;

    public static CoreDepth D(double v) => CoreDepth.From(v, Unit);

    public static CalendarAgeControl Calendar(string id, string core, double depth, double age, double error, bool exclude = false) =>
        new() { Id = id, Core = core, Depth = D(depth), Age = CalendarAge.FromYearsBP(age), Error = error, Exclude = exclude };

    public static LoadedProject Project(IEnumerable<AgeControlSpec> ages, IReadOnlyDictionary<string, double[]> sampleDepths,
        int iterations = 1000, int seed = 7, string interpolation = "linear", IEnumerable<MarkerSpec>? markers = null, double step = 1.0,
        double rateVariability = AgeModelSettings.DefaultRateVariability)
    {
        var project = new Project
        {
            DepthUnit = Unit,
            Cores = [.. sampleDepths.Keys.Select(id => new CoreSpec { Id = id, Table = $"{id}.csv" })],
            Markers = [.. markers ?? []],
            Ages = [.. ages],
            AgeModel = new AgeModelSettings { Iterations = iterations, Seed = seed, Interpolation = interpolation, RateVariability = rateVariability },
            Composite = new CompositeSettings { Step = step },
        };
        var tables = sampleDepths.ToDictionary(kv => kv.Key, kv => new CoreTable(kv.Key, Unit, kv.Value, new Dictionary<string, double[]>()));
        string file = Path.Combine(Path.GetTempPath(), "stratlink-age-tests", "site.yaml");
        var doc = new ProjectDocument(file, project, new FindingList(), new SourceMap(file));
        return new LoadedProject(doc, project, tables, new FindingList());
    }

    public static double[] Range(double from, double to, double step) =>
        Enumerable.Range(0, (int)Math.Round((to - from) / step) + 1).Select(k => from + k * step).ToArray();

    /// <summary>Core mapped to composite by composite = scale x depth + offset (one answer, no members).</summary>
    public static MappingEnsemble Affine(string core, double scale, double offset) =>
        new(new DepthMapping(core, Unit, [0, 1000], [offset, offset + 1000 * scale]), []);

    /// <summary>Like <see cref="Affine"/> with members whose offsets spread evenly over +- <paramref name="spread"/>.</summary>
    public static MappingEnsemble AffineWithMembers(string core, double scale, double offset, double spread, int members)
    {
        var list = new List<DepthMapping>();
        for (int m = 0; m < members; m++)
        {
            double o = offset + spread * (2.0 * m / (members - 1) - 1);
            list.Add(new DepthMapping(core, Unit, [0, 1000], [o, o + 1000 * scale]));
        }
        return new MappingEnsemble(new DepthMapping(core, Unit, [0, 1000], [offset, offset + 1000 * scale]), list);
    }

    public static AlignmentResult Aligned(params MappingEnsemble[] ensembles) =>
        new(ensembles[0].CoreId, "ties", ensembles.ToDictionary(e => e.CoreId));

    public static readonly IReadOnlyDictionary<string, (double[] Tops, double[] Bottoms)> NoVarves =
        new Dictionary<string, (double[], double[])>();

    public static ImmutableArray<T> Arr<T>(params T[] items) => [.. items];
}
