using System.Globalization;
using StratLink.Checks;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Quantities;

namespace StratLink.Compositing;

/// <summary>
/// The splice as the project file lists it, checked: intervals that overlap, holes between them,
/// intervals through a core's gap (no recovery) or disturbed interval, unknown cores and intervals
/// beyond a core's recovered depth. Each finding points at the interval's line in the project file.
/// </summary>
internal static class ManualSplice
{
    public const string Overlap = "splice.overlap";
    public const string Hole = "splice.hole";
    public const string InGap = "splice.in-gap";
    public const string InDisturbed = "splice.in-disturbed";
    public const string UnknownCore = "splice.unknown-core";
    public const string BeyondCore = "splice.beyond-core";

    public static Splice Check(CompositeGrid grid, IReadOnlyList<SpliceInterval> intervals, IReadOnlyList<CompositeCore> cores, SourceMap? lines, FindingList findings)
    {
        var unit = grid.Unit;
        string u = unit.Symbol();
        var byId = cores.ToDictionary(c => c.Id, StringComparer.Ordinal);
        var order = Enumerable.Range(0, intervals.Count)
            .OrderBy(k => intervals[k].From.In(unit)).ThenBy(k => intervals[k].To.In(unit)).ThenBy(k => k)
            .ToList();

        Finding At(Severity severity, string code, int k, string key, string message, string? core, double depth) => new()
        {
            Severity = severity,
            Code = code,
            Message = message,
            Core = core,
            Depth = depth,
            Item = $"splice[{k}]",
            File = lines?.File,
            Line = lines?.LineOf($"composite.splice[{k}].{key}"),
            Field = $"composite.splice[{k}].{key}",
        };

        for (int i = 1; i < order.Count; i++)
        {
            int p = order[i - 1], k = order[i];
            double prevTo = intervals[p].To.In(unit), from = intervals[k].From.In(unit);
            // Joins within a millionth of a step count as touching.
            double tolerance = grid.Step * 1e-6;
            if (from < prevTo - tolerance)
            {
                double overlapEnd = Math.Min(prevTo, intervals[k].To.In(unit));
                findings.Add(At(Severity.Error, Overlap, k, "from",
                    $"Splice intervals {p} ({Describe(intervals[p], unit)}) and {k} ({Describe(intervals[k], unit)}) overlap from {F(from)} to {F(overlapEnd)} {u} composite depth; each composite depth must come from one core.",
                    intervals[k].Core, from));
            }
            else if (from > prevTo + tolerance)
            {
                findings.Add(At(Severity.Warning, Hole, k, "from",
                    $"No splice interval covers composite depth {F(prevTo)} to {F(from)} {u} (between intervals {p} and {k}); the splice has a hole there.",
                    intervals[k].Core, prevTo));
            }
        }

        var pieces = new List<SplicePiece>();
        foreach (int k in order)
        {
            var iv = intervals[k];
            if (!byId.TryGetValue(iv.Core, out var core))
            {
                findings.Add(At(Severity.Error, UnknownCore, k, "core",
                    $"Splice interval {k} names core '{iv.Core}', which has no aligned table (known: {string.Join(", ", byId.Keys)}).", iv.Core, iv.From.In(unit)));
                continue;
            }
            var median = core.Ensemble.Median;
            double coreFrom = median.ToCoreValue(iv.From.In(unit)), coreTo = median.ToCoreValue(iv.To.In(unit));
            pieces.Add(new SplicePiece(core.Id, iv.From, iv.To, CoreDepth.From(coreFrom, unit), CoreDepth.From(coreTo, unit)));

            foreach (var gap in core.Spec.Gaps)
                if (Overlaps(gap, coreFrom, coreTo, unit))
                    findings.Add(At(Severity.Error, InGap, k, "core",
                        $"Splice interval {k} ({Describe(iv, unit)}) takes core {core.Id} from {F(coreFrom)} to {F(coreTo)} {u} core depth, through its gap {F(gap.Top.In(unit))}-{F(gap.Bottom.In(unit))} {u} where nothing was recovered; take another core there.",
                        core.Id, gap.Top.In(unit)));
            foreach (var dist in core.Spec.Disturbed)
                if (Overlaps(dist, coreFrom, coreTo, unit))
                    findings.Add(At(Severity.Warning, InDisturbed, k, "core",
                        $"Splice interval {k} ({Describe(iv, unit)}) takes core {core.Id} through its disturbed interval {F(dist.Top.In(unit))}-{F(dist.Bottom.In(unit))} {u} core depth; its values there are left out of the spliced record.",
                        core.Id, dist.Top.In(unit)));
            if (coreFrom < core.RecoveredTop - grid.Step * 1e-6 || coreTo > core.RecoveredBottom + grid.Step * 1e-6)
                findings.Add(At(Severity.Warning, BeyondCore, k, "core",
                    $"Splice interval {k} ({Describe(iv, unit)}) reaches {F(coreFrom)}-{F(coreTo)} {u} in core {core.Id}, beyond its samples ({F(core.RecoveredTop)}-{F(core.RecoveredBottom)} {u}).",
                    core.Id, iv.From.In(unit)));
        }

        return new Splice(automatic: false, pieces, SourceByRow(grid, pieces));
    }

    /// <summary>Each row takes the first interval (by top) holding it; an interval's base counts only where no interval starts.</summary>
    private static string?[] SourceByRow(CompositeGrid grid, List<SplicePiece> pieces)
    {
        var source = new string?[grid.Count];
        var unit = grid.Unit;
        for (int r = 0; r < grid.Count; r++)
        {
            double z = grid.ValueAt(r);
            string? atBase = null;
            foreach (var p in pieces)
            {
                double from = p.From.In(unit), to = p.To.In(unit);
                if (z >= from && z < to) { source[r] = p.Core; break; }
                if (z == to) atBase ??= p.Core;
            }
            source[r] ??= atBase;
        }
        return source;
    }

    /// <summary>True when the open interval (from, to) shares depth with the closed interval.</summary>
    private static bool Overlaps(DepthInterval interval, double from, double to, DepthUnit unit) =>
        interval.Top.In(unit) < to && interval.Bottom.In(unit) > from;

    private static string Describe(SpliceInterval iv, DepthUnit unit) =>
        $"{iv.Core}, {F(iv.From.In(unit))}-{F(iv.To.In(unit))} {unit.Symbol()}";

    private static string F(double v) => v.ToString("0.###", CultureInfo.InvariantCulture);
}
