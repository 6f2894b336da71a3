using StratLink.Alignment;
using StratLink.Model;
using StratLink.Quantities;
using StratLink.Workflows;

namespace StratLink.Checks;

/// <summary>
/// Checks of the age controls. "Beyond their errors" means by more than twice the combined 1 sigma of
/// the two ages (about 95 % for normal errors; common practice). Controls marked <c>exclude</c> are left
/// out: the user has already set them aside.
/// </summary>
internal static class AgeChecks
{
    public static void Run(CheckReporter r, LoadedProject loaded, AlignmentResult? alignment, CheckContext ctx, CancellationToken ct)
    {
        var radiocarbon = new RadiocarbonDates(loaded);
        var levels = DatedLevel.Collect(r.Project, radiocarbon);
        ReversalsWithinCores(r, levels);
        if (alignment is not null)
        {
            ReversalsAcrossCores(r, levels, alignment);
            if (ctx.AgeScale is not null) OffModel(r, levels, alignment, ctx);
        }
        Calibrations(r, radiocarbon);
        Varves(r, levels, new VarveChronology(loaded, ct));
        MarkerControls(r, loaded, levels, alignment);
    }

    private static void ReversalsWithinCores(CheckReporter r, List<DatedLevel> levels)
    {
        foreach (var core in levels.GroupBy(l => l.Core))
        {
            var sorted = core.OrderBy(l => l.Depth).ToList();
            for (int i = 0; i < sorted.Count; i++)
                for (int j = i + 1; j < sorted.Count; j++)
                {
                    var (above, below) = (sorted[i], sorted[j]);
                    if (below.Depth <= above.Depth || !above.ReversedAbove(below)) continue;
                    r.Add(Severity.Error, CheckCodes.AgeReversal,
                        $"Age control {above.Control.Id} at {r.Depth(above.Depth)} ({above.Describe()}) is older than {below.Control.Id} below it at {r.Depth(below.Depth)} ({below.Describe()}) by more than twice their combined error, but sediment above cannot be older than sediment below. One of them may be reworked or contaminated: check it, or set 'exclude: true' on it.",
                        core.Key, $"{above.Control.Id}/{below.Control.Id}", above.Depth, CheckReporter.AgeSource(above.Control.Id));
                }
        }
    }

    /// <summary>
    /// Levels of different cores in reverse order on the composite depth scale: only where the 95 % composite
    /// ranges of the two levels do not overlap, so the order is not in doubt.
    /// </summary>
    private static void ReversalsAcrossCores(CheckReporter r, List<DatedLevel> levels, AlignmentResult alignment)
    {
        var placed = levels
            .Where(l => alignment.Mappings.ContainsKey(l.Core))
            .Select(l => (Level: l, Range: alignment.Mappings[l.Core].CompositeRange(l.Depth), Median: alignment.Mappings[l.Core].Median.ToCompositeValue(l.Depth)))
            .OrderBy(x => x.Median).ToList();
        for (int i = 0; i < placed.Count; i++)
            for (int j = i + 1; j < placed.Count; j++)
            {
                var (above, below) = (placed[i], placed[j]);
                if (above.Level.Core == below.Level.Core || above.Level.Control == below.Level.Control) continue;
                double aboveLow = Math.Max(above.Range.Hi, above.Median), belowTop = Math.Min(below.Range.Lo, below.Median);
                if (aboveLow >= belowTop || !above.Level.ReversedAbove(below.Level)) continue;
                r.Add(Severity.Warning, CheckCodes.AgeReversalAcrossCores,
                    $"Age control {above.Level.Control.Id} ({above.Level.Describe()}, core {above.Level.Core} at {r.Depth(above.Level.Depth)}) maps to composite depth {r.Depth(above.Median)}, above {below.Level.Control.Id} ({below.Level.Describe()}, core {below.Level.Core} at {r.Depth(below.Level.Depth)}, composite {r.Depth(below.Median)}), yet it is older by more than twice their combined error. Either one age is wrong or the alignment between {above.Level.Core} and {below.Level.Core} is wrong there.",
                    above.Level.Core, $"{above.Level.Control.Id}/{below.Level.Control.Id}", above.Level.Depth, CheckReporter.AgeSource(above.Level.Control.Id));
            }
    }

    /// <summary>
    /// A calendar-scale level whose ±2 sigma interval misses the age model's 95 % range at its composite
    /// depth. The level's place on the composite scale is itself uncertain by its alignment band, so the
    /// range compared is the age model's from the 95 % range's young end at the band's top to its old end
    /// at the band's base; otherwise an exactly dated top (a varve count's year of coring) would be
    /// flagged by the width of one alignment step.
    /// </summary>
    private static void OffModel(CheckReporter r, List<DatedLevel> levels, AlignmentResult alignment, CheckContext ctx)
    {
        foreach (var l in levels.Where(l => l.IsCalendar && alignment.Mappings.ContainsKey(l.Core)))
        {
            var mapping = alignment.Mappings[l.Core];
            var (top, bottom) = mapping.CompositeRange(l.Depth);
            double composite = mapping.Median.ToCompositeValue(l.Depth);
            var (median, _, _) = ctx.AgeScale!.AgeAt(CompositeDepth.From(composite, r.Unit));
            double lo = ctx.AgeScale.AgeAt(CompositeDepth.From(Math.Min(top, composite), r.Unit)).LoBP;
            double hi = ctx.AgeScale.AgeAt(CompositeDepth.From(Math.Max(bottom, composite), r.Unit)).HiBP;
            if (l.Age + 2 * l.Sigma >= lo && l.Age - 2 * l.Sigma <= hi) continue;
            r.Add(Severity.Warning, CheckCodes.AgeOffModel,
                $"Age control {l.Control.Id} ({l.Describe()}) at {r.Depth(l.Depth)} in core {l.Core} lies outside the age model there ({CheckReporter.Number(median, "0")} cal BP, 95 % range {CheckReporter.Number(lo, "0")} to {CheckReporter.Number(hi, "0")}); the other controls outvote it. Check it, or set 'exclude: true' on it.",
                l.Core, l.Control.Id, l.Depth, CheckReporter.AgeSource(l.Control.Id));
        }
    }

    /// <summary>
    /// A radiocarbon age that cannot be calibrated on its curve (more than <see cref="AgeModelling.Calibration.Calibrator.OutsideCurveSigmas"/>
    /// combined sigmas beyond every curve value, after the reservoir offset: modern or too old) is an
    /// error; one whose calendar distribution is cut by an end of the curve, a warning. A curve file that
    /// does not exist is left to the project loader's missing-file error.
    /// </summary>
    private static void Calibrations(CheckReporter r, RadiocarbonDates radiocarbon)
    {
        foreach (var rc in r.Project.Ages.OfType<RadiocarbonAgeControl>().Where(a => !a.Exclude))
        {
            var result = radiocarbon.Calibrate(rc, out string? problem);
            string src = CheckReporter.AgeSource(rc.Id);
            double depth = rc.Depth.In(r.Unit);
            if (result is null)
            {
                if (problem is not null)
                    r.Add(Severity.Warning, CheckCodes.CurveUnreadable, $"Radiocarbon age {rc.Id} could not be calibrated for the checks: {problem}", rc.Core, rc.Id, depth, src + ".curve");
                continue;
            }
            string measured = $"Radiocarbon age {rc.Id}, {CheckReporter.Number(rc.C14Age.Years, "0")} ± {CheckReporter.Number(rc.C14Error, "0")} 14C yr BP"
                + (rc.ReservoirOffset != 0 ? $" ({CheckReporter.Number(result.EffectiveC14Age, "0")} after the reservoir offset)" : "");
            switch (result.Status)
            {
                case AgeModelling.Calibration.CalibrationStatus.Modern or AgeModelling.Calibration.CalibrationStatus.TooOld:
                    r.Add(Severity.Error, CheckCodes.RadiocarbonOutsideCurve,
                        $"{measured}, lies outside its curve {rc.Curve} ({result.Message}), so it has no calendar age there. Check the value, or use a curve that covers it.",
                        rc.Core, rc.Id, depth, src);
                    break;
                case AgeModelling.Calibration.CalibrationStatus.Truncated:
                    r.Add(Severity.Warning, CheckCodes.RadiocarbonAtCurveEnd,
                        $"{measured}, reaches an end of its curve {rc.Curve} ({result.Message}); its calendar age is cut there.",
                        rc.Core, rc.Id, depth, src);
                    break;
            }
        }
    }

    /// <summary>Each varve count against every independent calendar-scale age in its core within the counted interval.</summary>
    private static void Varves(CheckReporter r, List<DatedLevel> levels, VarveChronology varves)
    {
        foreach (var v in r.Project.Ages.OfType<VarveCountControl>().Where(v => !v.Exclude))
        {
            if (varves.Problem(v) is { } problem)
            {
                r.Add(Severity.Note, CheckCodes.CheckNotRun, $"The varve count {v.Id} was not compared with the other ages: {problem}",
                    v.Core, v.Id, null, CheckReporter.AgeSource(v.Id) + ".table");
                continue;
            }
            foreach (var l in levels.Where(l => l.Core == v.Core && l.IsCalendar && l.Control != v))
            {
                if (varves.AgeAt(v, l.Depth) is not { } counted) continue;
                double limit = 2 * Math.Sqrt(counted.Sigma * counted.Sigma + l.Sigma * l.Sigma);
                if (Math.Abs(counted.YearsBP - l.Age) <= limit) continue;
                r.Add(Severity.Warning, CheckCodes.VarveDisagrees,
                    $"At {r.Depth(l.Depth)} in core {v.Core} the varve count {v.Id} gives {CheckReporter.Number(counted.YearsBP, "0")} ± {CheckReporter.Number(counted.Sigma, "0")} cal BP but {l.Control.Id} gives {l.Describe()}: they differ by more than twice their combined error. Varves may be missing or doubled in the count, or the other age is wrong.",
                    v.Core, $"{v.Id}/{l.Control.Id}", l.Depth, CheckReporter.AgeSource(v.Id));
            }
        }
    }

    /// <summary>
    /// A calendar age on a marker applies in every core holding the marker. If no core holds it, it dates
    /// nothing (error). A core that has age controls of its own but lacks the marker is noted: the user
    /// dates that core and may have missed the layer in it; with an alignment, only when the marker's
    /// composite depth falls within that core's recovered interval (a layer below a short core's base
    /// cannot be missing from it).
    /// </summary>
    private static void MarkerControls(CheckReporter r, LoadedProject loaded, List<DatedLevel> levels, AlignmentResult? alignment)
    {
        var p = r.Project;
        var known = p.Cores.Select(c => c.Id).ToHashSet(StringComparer.Ordinal);
        foreach (var c in p.Ages.OfType<CalendarAgeControl>().Where(a => a.Marker is not null))
        {
            if (p.FindMarker(c.Marker!) is not { } marker) continue; // unknown marker: the reader's error already
            var holding = marker.Depths.Select(d => d.CoreId).Where(known.Contains).ToHashSet(StringComparer.Ordinal);
            string src = CheckReporter.AgeSource(c.Id);
            if (holding.Count == 0)
            {
                r.Add(Severity.Error, CheckCodes.AgeMarkerUnplaced,
                    $"Age control {c.Id} dates marker {marker.Id}, but no core has a depth for {marker.Id}, so the age applies nowhere. Give the marker's depths.",
                    null, c.Id, null, src + ".marker");
                continue;
            }
            if (c.Exclude) continue;
            foreach (string core in p.Cores.Select(x => x.Id).Where(id => !holding.Contains(id)))
            {
                var own = levels.Where(l => l.Core == core && l.Control != c).Select(l => l.Control.Id).Distinct().ToList();
                if (own.Count == 0 || !CouldHold(loaded, alignment, core, marker)) continue;
                r.Add(Severity.Note, CheckCodes.AgeMarkerAbsent,
                    $"Core {core} is dated ({string.Join(", ", own)}) but has no depth for marker {marker.Id}, so the age {c.Id} ({CheckReporter.Number(c.Age.YearsBP, "0")} cal BP) does not apply there. If {marker.Id} is seen in {core}, add its depth.",
                    core, c.Id, null, $"markers[{marker.Id}]");
            }
        }
    }

    private static bool CouldHold(LoadedProject loaded, AlignmentResult? alignment, string core, MarkerSpec marker)
    {
        if (alignment is null || !alignment.Mappings.TryGetValue(core, out var own) || !loaded.Tables.TryGetValue(core, out var table) || table.Count == 0)
            return true;
        var unit = loaded.Project.DepthUnit;
        var placed = marker.Depths
            .Where(d => alignment.Mappings.ContainsKey(d.CoreId))
            .Select(d => alignment.Mappings[d.CoreId].Median.ToCompositeValue(d.Depth.In(unit)))
            .ToList();
        if (placed.Count == 0) return true;
        double at = placed.Average();
        return at >= own.Median.ToCompositeValue(table.Depths[0]) && at <= own.Median.ToCompositeValue(table.Depths[^1]);
    }
}
