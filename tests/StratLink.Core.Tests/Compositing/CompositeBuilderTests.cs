using StratLink.Alignment;
using StratLink.Compositing;
using StratLink.Model;
using StratLink.Quantities;
using static StratLink.Tests.Compositing.CompositeFixture;

namespace StratLink.Tests.Compositing;

public class CompositeBuilderTests
{
    private static int Row(CompositeResult r, double depth)
    {
        for (int k = 0; k < r.Grid.Count; k++) if (Math.Abs(r.Grid.ValueAt(k) - depth) < 1e-9) return k;
        throw new ArgumentException($"No grid row at {depth}.");
    }

    [Fact]
    public void Composite_covers_the_union_of_all_cores_using_the_mappings_end_slopes()
    {
        // A is the reference (0-100 cm). B's mapping has knots over 0-50 cm only; beyond them it goes on
        // with the end slope (1.2, a faster-accumulating reference), so B's base at 120 cm maps to
        // 10 + 1.2 * 120 = 154 cm. C sits 5 cm higher than the reference (-5 cm at its top).
        var a = Table("A", Depths(0, 100, 1), ("ms", d => d));
        var b = Table("B", Depths(0, 120, 1), ("ms", d => d));
        var c = Table("C", Depths(0, 50, 1), ("ms", d => d));
        var project = Project("A", 0.5, Spec("A"), Spec("B"), Spec("C"));
        var alignment = Aligned("A",
            Ensemble(DepthMapping.Identity("A", Cm, 0, 100)),
            Ensemble(new DepthMapping("B", Cm, [0, 50], [10, 70])),
            Ensemble(Shift("C", -5)));

        var result = CompositeBuilder.Build(Load(project, a, b, c), alignment, null, null, CancellationToken.None);

        // Union of [0,100], [10,154], [-5,45] is [-5,154]; both ends are whole steps of 0.5.
        Assert.Equal(-5, result.Grid.ValueAt(0), 9);
        Assert.Equal(154, result.Grid.ValueAt(result.Grid.Count - 1), 9);
        Assert.Equal(0.5, result.Grid.ValueAt(1) - result.Grid.ValueAt(0), 9);
        var ms = result.Record("ms")!;
        Assert.Equal(1, ms.N[Row(result, -5)]);   // C alone at the top
        Assert.Equal(3, ms.N[Row(result, 20)]);   // all three
        Assert.Equal(1, ms.N[Row(result, 154)]);  // B alone at the base
        Assert.Equal(120, ms.Mean[Row(result, 154)], 9);
        Assert.Null(result.Ages);
    }

    [Fact]
    public void Counts_drop_in_a_gap_and_the_other_core_bridges_it()
    {
        // Reference A has a gap at 40-50 cm (ends included, as DepthInterval.Contains) with samples in it
        // that must be ignored; B covers the whole interval with a small ensemble spread. At 0 cm two of
        // B's four members fall above its top: half of them still give a value, so B counts there.
        var a = Table("A", Depths(0, 100, 1), ("ms", d => d), ("density", d => 1.5));
        var b = Table("B", Depths(0, 100, 1), ("ms", d => d), ("density", d => 1.5));
        var project = Project("A", 1, Spec("A", gaps: [(40, 50)]), Spec("B"));
        var alignment = Aligned("A",
            Ensemble(DepthMapping.Identity("A", Cm, 0, 100)),
            Ensemble(Shift("B", 0), Shift("B", 0), Shift("B", -0.2), Shift("B", 0.2), Shift("B", 0.1)));

        var result = CompositeBuilder.Build(Load(project, a, b), alignment, null, null, CancellationToken.None);

        foreach (var signal in new[] { "ms", "density" })
        {
            var rec = result.Record(signal)!;
            for (double z = 0; z <= 100; z++)
            {
                int expected = z >= 40 && z <= 50 ? 1 : 2;
                Assert.True(expected == rec.N[Row(result, z)], $"{signal} at {z} cm: n = {rec.N[Row(result, z)]}, expected {expected}");
            }
            Assert.False(double.IsNaN(rec.Mean[Row(result, 45)]));
        }
        // The splice takes B across A's gap and A elsewhere.
        Assert.Equal("B", result.Splice.SourceByRow[Row(result, 45)]);
        Assert.Equal("A", result.Splice.SourceByRow[Row(result, 10)]);
        Assert.Equal("A", result.Splice.SourceByRow[Row(result, 90)]);
    }

    [Fact]
    public void Band_is_zero_where_cores_agree_and_wide_where_they_disagree()
    {
        // Two cores on identity mappings, no ensembles: the same ms above 50 cm, B 5 units higher below.
        // Pooled values at a row are {x, x + 5}; type-7 percentiles (Hyndman and Fan 1996) of two values
        // are x + 0.025*5 and x + 0.975*5, so the band is 4.75 wide and the mean is x + 2.5.
        var a = Table("A", Depths(0, 100, 1), ("ms", d => 10 + d));
        var b = Table("B", Depths(0, 100, 1), ("ms", d => 10 + d + (d > 50 ? 5 : 0)));
        var project = Project("A", 1, Spec("A"), Spec("B"));
        var alignment = Aligned("A", Ensemble(DepthMapping.Identity("A", Cm, 0, 100)), Ensemble(Shift("B", 0)));

        var result = CompositeBuilder.Build(Load(project, a, b), alignment, null, null, CancellationToken.None);
        var ms = result.Record("ms")!;

        int agree = Row(result, 20), disagree = Row(result, 80);
        Assert.Equal(0, ms.Hi[agree] - ms.Lo[agree], 12);
        Assert.Equal(30, ms.Mean[agree], 12);
        Assert.Equal(4.75, ms.Hi[disagree] - ms.Lo[disagree], 9);
        Assert.Equal(90 + 0.125, ms.Lo[disagree], 9);
        Assert.Equal(92.5, ms.Mean[disagree], 9);
        Assert.Equal(2, ms.N[disagree]);
    }

    [Fact]
    public void Single_core_band_is_its_own_ensemble_spread()
    {
        // Only B reaches below 100 cm. B's ms equals its depth and its four members shift composite depth
        // by -0.5, -0.25, +0.25, +0.5 cm, so at composite depth z the members read z+0.5, z+0.25, z-0.25,
        // z-0.5. Type-7 percentiles of those four: z - 0.48125 and z + 0.48125 (h = 3p, by hand).
        var a = Table("A", Depths(0, 100, 1), ("ms", d => d));
        var b = Table("B", Depths(0, 150, 1), ("ms", d => d));
        var project = Project("A", 1, Spec("A"), Spec("B"));
        var alignment = Aligned("A", Ensemble(DepthMapping.Identity("A", Cm, 0, 100)),
            Ensemble(Shift("B", 0), Shift("B", -0.5), Shift("B", -0.25), Shift("B", 0.25), Shift("B", 0.5)));

        var result = CompositeBuilder.Build(Load(project, a, b), alignment, null, null, CancellationToken.None);
        var ms = result.Record("ms")!;
        int row = Row(result, 120);
        Assert.Equal(1, ms.N[row]);
        Assert.Equal(120 - 0.48125, ms.Lo[row], 9);
        Assert.Equal(120 + 0.48125, ms.Hi[row], 9);
        Assert.Equal(120, ms.Mean[row], 9);
        Assert.Equal(120, ms.Spliced[row], 9);
        // The reference alone at its own depth scale and without ensemble: the band collapses on the mean.
        var only = CompositeBuilder.Build(Load(Project("A", 1, Spec("A")), a), Aligned("A"), null, null, CancellationToken.None).Record("ms")!;
        Assert.Equal(only.Mean[30], only.Lo[30]);
        Assert.Equal(only.Mean[30], only.Hi[30]);
    }

    [Fact]
    public void Standardised_stack_of_affinely_related_cores_has_no_spread()
    {
        // B's ms is 10 A + 3: after per-core z-scores (sample SD) both are identical, so the band is empty
        // and the mean is A's z-score. A = d on 0..100 step 1: mean 50, SD sqrt(101*102/12) = 29.3002 (n-1 form).
        var a = Table("A", Depths(0, 100, 1), ("ms", d => d));
        var b = Table("B", Depths(0, 100, 1), ("ms", d => 10 * d + 3));
        var project = Project("A", 1, Spec("A"), Spec("B")) with { Composite = new CompositeSettings { Step = 1, Standardise = true } };
        var alignment = Aligned("A", Ensemble(DepthMapping.Identity("A", Cm, 0, 100)), Ensemble(Shift("B", 0)));

        var result = CompositeBuilder.Build(Load(project, a, b), alignment, null, null, CancellationToken.None);
        var ms = result.Record("ms")!;
        double sd = Math.Sqrt(101.0 * 102.0 / 12.0);
        Assert.True(ms.Standardised);
        Assert.Equal((80 - 50) / sd, ms.Mean[80], 9);
        Assert.Equal(0, ms.Hi[80] - ms.Lo[80], 9);
        Assert.Contains("z-scores", result.ScaleNote);
        Assert.Contains("z-scores", result.MethodSummary);
        Assert.Contains("splice automatic", result.MethodSummary);
    }

    [Fact]
    public void Ages_come_from_the_age_scale_at_every_row()
    {
        var a = Table("A", Depths(0, 10, 1), ("ms", d => d));
        var result = CompositeBuilder.Build(Load(Project("A", 1, Spec("A")), a), Aligned("A"),
            new LinearAgeScale(-68, 12.5, 30), null, CancellationToken.None);
        Assert.NotNull(result.Ages);
        Assert.Equal(-68 + 12.5 * 7, result.Ages!.MedianBP[7], 12);
        Assert.Equal(-68 + 12.5 * 7 - 30, result.Ages.LoBP[7], 12);
        Assert.Equal(-68 + 12.5 * 7 + 30, result.Ages.HiBP[7], 12);
    }

    [Fact]
    public void Cores_without_a_mapping_are_left_out_with_a_warning()
    {
        var a = Table("A", Depths(0, 10, 1), ("ms", d => d));
        var b = Table("B", Depths(0, 10, 1), ("ms", d => d));
        var result = CompositeBuilder.Build(Load(Project("A", 1, Spec("A"), Spec("B")), a, b), Aligned("A"), null, null, CancellationToken.None);
        var f = Assert.Single(result.Findings);
        Assert.Equal(CompositeBuilder.NoMapping, f.Code);
        Assert.Equal("B", f.Core);
        Assert.Equal(1, result.Record("ms")!.N[5]);
    }

    [Fact]
    public void Results_are_identical_run_to_run_despite_parallel_blocks()
    {
        var rng = new Random(3);
        var depths = Depths(0, 2000, 0.5);
        var a = Table("A", depths, ("ms", _ => rng.NextDouble()));
        var b = Table("B", depths, ("ms", _ => rng.NextDouble()));
        var members = Enumerable.Range(0, 50).Select(i => Shift("B", (i - 25) * 0.05, 0, 2000)).ToArray();
        var alignment = Aligned("A", Ensemble(DepthMapping.Identity("A", Cm, 0, 2000)), Ensemble(Shift("B", 0, 0, 2000), members));
        var loaded = Load(Project("A", 0.5, Spec("A"), Spec("B", gaps: [(300, 320)])), a, b);
        var first = CompositeBuilder.Build(loaded, alignment, null, null, CancellationToken.None).Record("ms")!;
        var second = CompositeBuilder.Build(loaded, alignment, null, null, CancellationToken.None).Record("ms")!;
        Assert.Equal(first.Mean, second.Mean);
        Assert.Equal(first.Lo, second.Lo);
        Assert.Equal(first.Hi, second.Hi);
    }
    [Fact]
    public void Stacks_leave_event_layers_out_unless_asked_to_keep_them()
    {
        // One core, ms = 10 everywhere but 500 inside a turbidite at 40-45 cm (the event bed's own signal). The stack
        // (stated rule: event layers are left out by default, kept with composite.keep_events) must have no value
        // inside the event by default, 10 outside it, and 500 inside when the events are kept. Exact arithmetic.
        var a = Table("A", Depths(0, 100, 1), ("ms", d => d >= 40 && d <= 45 ? 500 : 10));
        var spec = Spec("A") with { Events = [DepthInterval.FromTopBottom(40, 45, Cm)] };
        var project = Project("A", 1, spec);
        var alignment = Aligned("A", Ensemble(DepthMapping.Identity("A", Cm, 0, 100)));

        var left = CompositeBuilder.Build(Load(project, a), alignment, null, null, CancellationToken.None).Record("ms")!;
        var kept = CompositeBuilder.Build(Load(project with { Composite = project.Composite with { KeepEvents = true } }, a), alignment, null, null, CancellationToken.None).Record("ms")!;

        var grid = CompositeBuilder.Build(Load(project, a), alignment, null, null, CancellationToken.None).Grid;
        for (int k = 0; k < grid.Count; k++)
        {
            double z = grid.ValueAt(k);
            if (z >= 40 && z <= 45)
            {
                Assert.True(double.IsNaN(left.Mean[k]), $"stack at {z} cm holds the event ({left.Mean[k]})");
                Assert.Equal(500, kept.Mean[k], 9);
            }
            else Assert.Equal(10, left.Mean[k], 9);
        }
    }
}
