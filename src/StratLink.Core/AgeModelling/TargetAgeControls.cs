using System.Collections.Immutable;
using System.Globalization;
using StratLink.Alignment;
using StratLink.Checks;
using StratLink.Model;
using StratLink.Quantities;
using StratLink.Workflows;

namespace StratLink.AgeModelling;

/// <summary>
/// Age controls transferred from the project's dated target: each core the target dates is aligned to it
/// (<see cref="DatedTargetAligner"/>), and the transferred age at every <c>spacing</c> of core depth becomes a
/// calendar age control (mean and 1 sigma from the path ensemble and the target's own age error, see
/// <see cref="TransferredAges.Controls"/>) with id <c>target:CORE:DEPTH</c>. They join the other controls, so
/// the age model draws, orders and tests them for outliers in the same ensemble.
/// </summary>
public static class TargetAgeControls
{
    public const string IdPrefix = "target:";

    public static ImmutableList<AgeControlSpec> For(LoadedProject project, FindingList findings, CancellationToken ct)
    {
        var p = project.Project;
        if (p.Target is not { } spec || project.Target is not { } record) return [];
        int seed = Seed(p);
        var controls = ImmutableList.CreateBuilder<AgeControlSpec>();
        foreach (string id in p.TargetCoreIds)
        {
            ct.ThrowIfCancellationRequested();
            if (!project.Tables.TryGetValue(id, out var table) || table.Count < 2 || !table.Signals.ContainsKey(spec.Signal)) continue;
            var core = p.FindCore(id);
            var ages = DatedTargetAligner.Align(table, spec.Signal, record.AgesBP, record.Values, p.Alignment, Seeds.Derive(seed, IdPrefix + id, 0), findings, ct);
            double top = table.Depths[0], length = table.Depths[^1] - top;
            double step = spec.Spacing is double s ? DepthUnits.Convert(s, p.DepthUnit, table.Unit) : length / DatedTargetSpec.DefaultControlsPerCore;
            var depths = Enumerable.Range(0, (int)Math.Floor(length / step + 1e-9) + 1).Select(k => top + k * step)
                .Where(z => core is null || !core.IsUnusable(DepthUnits.Convert(z, table.Unit, p.DepthUnit))).ToArray();
            var transferred = ages.Controls(depths, age => spec.AgeError ?? record.ErrorAt(age));
            foreach (var c in transferred)
            {
                double z = DepthUnits.Convert(c.CoreDepth, table.Unit, p.DepthUnit);
                controls.Add(new CalendarAgeControl
                {
                    Id = $"{IdPrefix}{id}:{z.ToString("0.###", CultureInfo.InvariantCulture)}",
                    Core = id,
                    Depth = CoreDepth.From(z, p.DepthUnit),
                    Age = CalendarAge.FromYearsBP(c.Age),
                    Error = c.Sigma,
                });
            }
            if (transferred.Count > 0)
                findings.Add(Finding.Note(AgeModelCodes.TargetAges,
                    $"core {id}: {transferred.Count} ages transferred from the target {spec.Table} by its signal {spec.Signal}, " +
                    $"1 sigma {Years(transferred.Min(c => c.Sigma))}-{Years(transferred.Max(c => c.Sigma))} years; they join the age controls as {IdPrefix}{id}:DEPTH.") with { Core = id });
        }
        return controls.ToImmutable();
    }

    /// <summary>The seed the target alignments derive theirs from (with each core's id): the alignment's.</summary>
    public static int Seed(Project p) => p.Alignment.Seed ?? p.AgeModel.Seed;

    private static string Years(double v) => v.ToString("0", CultureInfo.InvariantCulture);
}
