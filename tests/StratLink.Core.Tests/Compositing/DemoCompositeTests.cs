using System.Globalization;
using StratLink.Alignment;
using StratLink.Compositing;
using StratLink.Model;
using StratLink.Tests.TestSupport;
using StratLink.Workflows;

namespace StratLink.Tests.Compositing;

/// <summary>The committed demo site composited through its hidden true mappings (no alignment error involved).</summary>
public class DemoCompositeTests
{
    private static DepthMapping TrueMapping(string core)
    {
        // truth/<core>-truth.csv: depth_cm, true_composite_depth_cm, true_age_bp per sample (generator's hidden truth).
        var rows = File.ReadAllLines(Path.Combine(RepoPaths.DemoDirectory, "truth", $"{core}-truth.csv")).Skip(1)
            .Select(l => l.Split(',')).Select(c => (Depth: double.Parse(c[0], CultureInfo.InvariantCulture), Composite: double.Parse(c[1], CultureInfo.InvariantCulture)))
            .ToArray();
        return new DepthMapping(core, StratLink.Quantities.DepthUnit.Centimetre, [.. rows.Select(r => r.Depth)], [.. rows.Select(r => r.Composite)]);
    }

    [Fact]
    public void Demo_composite_covers_every_core_and_counts_cores_correctly_at_gaps()
    {
        var loaded = ProjectLoader.Load(Path.Combine(RepoPaths.DemoDirectory, "mirrowick-fjord.stratlink.yaml"));
        Assert.False(loaded.Problems.HasErrors, string.Join("\n", loaded.Problems));
        var project = loaded.Project;
        var mappings = project.Cores.ToDictionary(c => c.Id, c => new MappingEnsemble(TrueMapping(c.Id), []));
        var result = CompositeBuilder.Build(loaded, new AlignmentResult(project.ReferenceCoreId, AlignmentMethods.Ties, mappings), null, null, CancellationToken.None);

        // Coverage: the grid reaches every core's true composite top and base, and ends within one step of the outermost ones.
        double step = project.Composite.Step, deepest = double.NegativeInfinity, shallowest = double.PositiveInfinity;
        foreach (var core in project.Cores)
        {
            var table = loaded.Tables[core.Id];
            double top = mappings[core.Id].Median.ToCompositeValue(table.Depths[0]), bottom = mappings[core.Id].Median.ToCompositeValue(table.Depths[^1]);
            Assert.True(result.Grid.ValueAt(0) <= top, $"{core.Id}'s top at {top} cm is above the composite");
            shallowest = Math.Min(shallowest, top);
            Assert.True(result.Grid.ValueAt(result.Grid.Count - 1) >= bottom, $"{core.Id}'s base at {bottom} cm is below the composite");
            deepest = Math.Max(deepest, bottom);
        }
        Assert.InRange(result.Grid.ValueAt(result.Grid.Count - 1), deepest, deepest + step);
        Assert.InRange(result.Grid.ValueAt(0), shallowest - step, shallowest);

        // Expected n by an independent per-row count with the mappings' own inverse, CoreSpec.IsUnusable and the event layers.
        // Rows within 1.5 cm (core depth) of a core's end or of a gap/disturbed edge are left out: there the
        // outcome depends on sample spacing (interpolation needs samples on both sides).
        const double margin = 1.5;
        int checkedRows = 0, refGapRows = 0;
        foreach (var record in result.Records)
        {
            for (int r = 0; r < result.Grid.Count; r++)
            {
                double z = result.Grid.ValueAt(r);
                int expected = 0;
                bool ambiguous = false;
                bool refInGap = false;
                foreach (var core in project.Cores)
                {
                    var table = loaded.Tables[core.Id];
                    double d = mappings[core.Id].Median.ToCoreValue(z);
                    var edges = core.Gaps.Concat(core.Disturbed).Concat(core.Events).SelectMany(i => new[] { i.Top.In(project.DepthUnit), i.Bottom.In(project.DepthUnit) })
                        .Append(table.Depths[0]).Append(table.Depths[^1]);
                    if (edges.Any(e => Math.Abs(e - d) < margin)) { ambiguous = true; break; }
                    // Event layers are left out of the stacks by default (composite.keep_events).
                    bool inside = d >= table.Depths[0] && d <= table.Depths[^1] && !core.IsUnusable(d) && !core.Events.Any(e => e.ContainsValue(d));
                    if (inside) expected++;
                    if (core.Id == project.ReferenceCoreId && core.IsInGap(d)) refInGap = true;
                }
                if (ambiguous) continue;
                checkedRows++;
                if (refInGap) refGapRows++;
                Assert.True(expected == record.N[r], $"{record.Signal} at {z} cm: n = {record.N[r]}, expected {expected}");
            }
        }
        // Most rows are checked, and among them rows where the reference has a gap and the others bridge it.
        Assert.True(checkedRows > 0.8 * result.Grid.Count * result.Records.Count, $"only {checkedRows} rows checked");
        Assert.True(refGapRows > 0, "no checked row lies in a gap of the reference core");
        Assert.Equal(["ms", "density", "ca_ti"], result.Records.Select(r => r.Signal));
    }
}
