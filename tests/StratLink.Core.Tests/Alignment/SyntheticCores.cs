using System.Collections.Immutable;
using StratLink.Checks;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Tables;
using StratLink.Workflows;

namespace StratLink.Tests.Alignment;

/// <summary>
/// A small invented two-core site with a known warp: the reference record is a sum of random
/// smooth bumps; the core records the same signal through a known monotone mapping f (composite
/// depth of each core depth) plus noise, with a gap. Truth is f itself.
/// </summary>
internal sealed class SyntheticCores
{
    public required LoadedProject Project { get; init; }
    public required Func<double, double> TrueComposite { get; init; }
    public required CoreTable Core { get; init; }
    public required DepthInterval Gap { get; init; }

    public static SyntheticCores Make(int seed, double noise = 0.15, int markers = 2, double uncertainty = 0)
    {
        var rng = new Random(seed);
        const double refLength = 600;
        int bumps = 60;
        var centres = Enumerable.Range(0, bumps).Select(_ => rng.NextDouble() * (refLength + 40) - 20).ToArray();
        var widths = Enumerable.Range(0, bumps).Select(_ => 3 + rng.NextDouble() * 9).ToArray();
        var heights = Enumerable.Range(0, bumps).Select(_ => rng.NextDouble() * 2 - 1).ToArray();
        double Ms(double z) { double s = 0; for (int b = 0; b < bumps; b++) { double u = (z - centres[b]) / widths[b]; s += heights[b] * Math.Exp(-0.5 * u * u); } return s; }
        double Density(double z) => Math.Sin(z / 17.0) + 0.5 * Math.Sin(z / 5.3 + 1);
        static double F(double z) => 1.3 * z + 25 * Math.Sin(2 * Math.PI * z / 230);

        var refDepths = Enumerable.Range(0, 601).Select(i => (double)i).ToArray();
        var reference = new CoreTable("REF", DepthUnit.Centimetre, refDepths, new Dictionary<string, double[]>
        {
            ["ms"] = refDepths.Select(z => Ms(z) + noise * Gauss(rng)).ToArray(),
            ["density"] = refDepths.Select(z => Density(z) + noise * Gauss(rng)).ToArray(),
        });
        double coreBottom = 450;
        var coreDepths = Enumerable.Range(0, (int)coreBottom + 1).Select(i => (double)i).ToArray();
        var gap = DepthInterval.FromTopBottom(200, 212, DepthUnit.Centimetre);
        var core = new CoreTable("CORE", DepthUnit.Centimetre, coreDepths, new Dictionary<string, double[]>
        {
            ["ms"] = coreDepths.Select(z => gap.ContainsValue(z) ? double.NaN : Ms(F(z)) + noise * Gauss(rng)).ToArray(),
            ["density"] = coreDepths.Select(z => gap.ContainsValue(z) ? double.NaN : Density(F(z)) + noise * Gauss(rng)).ToArray(),
        });
        var markerList = ImmutableList.CreateBuilder<MarkerSpec>();
        for (int k = 0; k < markers; k++)
        {
            double z = coreBottom * (k + 1) / (markers + 1);
            markerList.Add(new MarkerSpec
            {
                Id = $"ash-{k + 1}",
                Kind = MarkerKind.Tephra,
                Uncertainty = uncertainty,
                Depths = [new MarkerDepth("REF", CoreDepth.From(F(z), DepthUnit.Centimetre)), new MarkerDepth("CORE", CoreDepth.From(z, DepthUnit.Centimetre))],
            });
        }
        var project = new Project
        {
            DepthUnit = DepthUnit.Centimetre,
            Cores = [new CoreSpec { Id = "REF", Table = "ref.csv" }, new CoreSpec { Id = "CORE", Table = "core.csv", Gaps = [gap] }],
            Markers = markerList.ToImmutable(),
            Alignment = new AlignmentSettings { Reference = "REF", Signals = [new SignalWeight("ms", 1), new SignalWeight("density", 0.5)] },
            AgeModel = new AgeModelSettings { Seed = 7 },
        };
        var tables = new Dictionary<string, CoreTable> { ["REF"] = reference, ["CORE"] = core };
        var doc = new ProjectDocument("synthetic.yaml", project, new FindingList(), new SourceMap("synthetic.yaml"));
        return new SyntheticCores
        {
            Project = new LoadedProject(doc, project, tables, new FindingList()),
            TrueComposite = F,
            Core = core,
            Gap = gap,
        };
    }

    private static double Gauss(Random rng) =>
        Math.Sqrt(-2 * Math.Log(1 - rng.NextDouble())) * Math.Cos(2 * Math.PI * rng.NextDouble());
}
