using System.Collections.Immutable;
using StratLink.Alignment;
using StratLink.AgeModelling;
using StratLink.Checks;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Tables;
using StratLink.Workflows;

namespace StratLink.Tests.Compositing;

/// <summary>Hand-built cores, mappings and projects for compositing tests (everything in cm).</summary>
internal static class CompositeFixture
{
    public const DepthUnit Cm = DepthUnit.Centimetre;

    /// <summary>Depths from <paramref name="top"/> to <paramref name="bottom"/> every <paramref name="step"/> cm.</summary>
    public static double[] Depths(double top, double bottom, double step) =>
        [.. Enumerable.Range(0, (int)Math.Round((bottom - top) / step) + 1).Select(i => top + i * step)];

    public static CoreTable Table(string id, double[] depths, params (string Name, Func<double, double> Value)[] signals) =>
        new(id, Cm, depths, signals.ToDictionary(s => s.Name, s => depths.Select(s.Value).ToArray()));

    public static CoreSpec Spec(string id, (double Top, double Bottom)[]? gaps = null, (double Top, double Bottom)[]? disturbed = null) => new()
    {
        Id = id,
        Table = $"cores/{id}.csv",
        Gaps = [.. (gaps ?? []).Select(g => DepthInterval.FromTopBottom(g.Top, g.Bottom, Cm))],
        Disturbed = [.. (disturbed ?? []).Select(g => DepthInterval.FromTopBottom(g.Top, g.Bottom, Cm))],
    };

    /// <summary>Composite = core depth + offset, over the given core depths (extrapolated beyond with slope 1).</summary>
    public static DepthMapping Shift(string id, double offset, double top = 0, double bottom = 100) =>
        new(id, Cm, [top, bottom], [top + offset, bottom + offset]);

    public static MappingEnsemble Ensemble(DepthMapping median, params DepthMapping[] members) => new(median, members);

    public static LoadedProject Load(Project project, params CoreTable[] tables)
    {
        const string file = "/virtual/site.yaml";
        var doc = new ProjectDocument(file, project, new FindingList(), new SourceMap(file));
        return new LoadedProject(doc, project, tables.ToDictionary(t => t.CoreId), new FindingList());
    }

    public static Project Project(string reference, double step, params CoreSpec[] cores) => new()
    {
        DepthUnit = Cm,
        Cores = [.. cores],
        Alignment = new AlignmentSettings { Reference = reference },
        Composite = new CompositeSettings { Step = step },
    };

    public static AlignmentResult Aligned(string reference, params MappingEnsemble[] ensembles) =>
        new(reference, AlignmentMethods.Dtw, ensembles.ToDictionary(e => e.CoreId));

    /// <summary>An age scale linear in composite depth: age = a + b * depth, with a fixed 95 % half-range.</summary>
    public sealed class LinearAgeScale(double a, double b, double halfRange) : ICompositeAgeScale
    {
        public (double MedianBP, double LoBP, double HiBP) AgeAt(CompositeDepth depth)
        {
            double age = a + b * depth.In(Cm);
            return (age, age - halfRange, age + halfRange);
        }

        public int MemberCount => 1;
        public double MemberAgeAt(int member, CompositeDepth depth) => AgeAt(depth).MedianBP;
    }
}
