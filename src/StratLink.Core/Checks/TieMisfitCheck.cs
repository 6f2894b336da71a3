using StratLink.Alignment;
using StratLink.Model;
using StratLink.Workflows;

namespace StratLink.Checks;

/// <summary>
/// Leave-one-out test of each tie: align the cores without marker M and see where the signals put M.
/// The marker's depth in one core (the reference core when it holds M, else the first core listed for M)
/// is carried through the mapping into each other core holding M; a tie whose carried depth lies more
/// than <see cref="CheckSettings.TieMisfitSigmas"/> tie uncertainties from the given depth is reported.
/// The uncertainty has a floor of one grid step (<see cref="AlignmentRuns.GridStep"/>). The cores are
/// aligned to the reference alone (reference scale) even when the project uses the site scale: the
/// signals' say on one tie does not need the site's rounds, run again for every marker left out.
/// Optimal paths first; a marker that would then be reported is left out again with sampled paths
/// (seeded as the build's), and judged against their spread too: where the signals alone cannot place
/// the layer, the leave-one-out placement is uncertain by tens of centimetres and disagreeing with it
/// is no evidence against the tie. The nearer of the optimal path and the members' median is
/// compared, as in the loop-closure check. Nor is a tie reported where, left out, nothing but an end
/// holds the core: beyond the core's outermost remaining tie (or anywhere, when none remains) the
/// placement counts only toward an end the alignment closed where the project's ties put it. An open
/// end may stop anywhere, and a closed end the ties place elsewhere (a short core with no tie left,
/// stretched over the whole reference) forces the path; either way the signals have no say, and such
/// a misfit is a note, not a warning; past the reference's ends, where each core aligned to the
/// reference alone is only continued, too. On the site scale a misfit that remains is judged last with
/// the project's own alignment (the site's rounds, sampled), where every core is matched to the others
/// as well; only that costs the rounds, and only for the few markers that get that far.
/// </summary>
internal static class TieMisfitCheck
{
    /// <summary>Sampled paths for a marker whose optimal-path misfit would be reported: a 95 % range with a few members beyond each end.</summary>
    private const int MarkerEnsemble = 100;

    public static void Run(CheckReporter r, LoadedProject loaded, Func<LoadedProject, CancellationToken, AlignmentResult> aligner,
        IProgress<WorkProgress>? progress, CancellationToken ct)
    {
        var p = r.Project;
        if (p.Alignment.Method == AlignmentMethods.Ties) return; // the ties method uses no signals: nothing to disagree with
        var candidates = p.Markers
            .Where(m => m.Depths.Count(d => loaded.Tables.ContainsKey(d.CoreId)) >= 2)
            .ToList();
        // The leave-one-out alignments are independent: they run in parallel (each one's cores too, so the few
        // cores of one alignment do not leave a worker idle), and are reported in marker order.
        var results = new (AlignmentResult? Result, string? Failure)[candidates.Count];
        int done = 0;
        Parallel.For(0, candidates.Count, new ParallelOptions { CancellationToken = ct }, i =>
        {
            results[i].Result = AlignmentRuns.TryAlign(aligner, loaded, Without(p, candidates[i]), ct, out results[i].Failure);
            progress?.Report(new WorkProgress("checks: ties left out one at a time", (double)Interlocked.Increment(ref done) / candidates.Count, candidates[i].Id));
        });
        var network = TieNetwork.Build(p, loaded.Tables, []);
        var sampled = new AlignmentResult?[candidates.Count];
        var onSite = new bool[candidates.Count];
        // Only a misfit where the signals had a say is worth more alignments; one that rests on an end is a note as it stands.
        bool Warns(int i) => results[i].Result is { } result
            && Misfits(r, loaded, network, candidates[i], result, sampled[i], onSite[i]).Any(f => f.Unheld is null && f.Distance > f.Limit);
        var again = Enumerable.Range(0, candidates.Count).Where(Warns).ToList();
        Parallel.ForEach(again, new ParallelOptions { CancellationToken = ct }, i =>
            sampled[i] = AlignmentRuns.TryAlign(aligner, loaded, Without(p, candidates[i]), ct, out _, MarkerEnsemble));
        // What still disagrees is judged last by the project's own alignment: on the site scale every
        // core is matched to the others too; its rounds are paid only here, on optimal paths first.
        if (p.Alignment.Scale == AlignmentScales.Site && loaded.Tables.Count >= 3)
        {
            var still = again.Where(Warns).ToList();
            Parallel.ForEach(still, new ParallelOptions { CancellationToken = ct }, i =>
            {
                var onTheSite = Without(p, candidates[i]) with { Alignment = p.Alignment };
                if (AlignmentRuns.TryAlign(aligner, loaded, onTheSite, ct, out _) is not { } site) return;
                (results[i].Result, sampled[i], onSite[i]) = (site, null, true);
                if (Warns(i) && AlignmentRuns.TryAlign(aligner, loaded, onTheSite, ct, out _, MarkerEnsemble) is { } sampledSite)
                    (results[i].Result, sampled[i]) = (sampledSite, sampledSite);
            });
        }
        for (int i = 0; i < candidates.Count; i++)
        {
            var m = candidates[i];
            if (results[i].Result is not { } result)
            {
                r.Add(Severity.Note, CheckCodes.CheckNotRun,
                    $"The tie check of marker {m.Id} did not run: aligning the cores without it failed ({results[i].Failure}).",
                    null, m.Id, null, $"markers[{m.Id}]");
                continue;
            }
            foreach (var f in Misfits(r, loaded, network, m, result, sampled[i], onSite[i]))
            {
                if (f.Distance <= f.Limit) continue;
                if (f.Unheld is { } why)
                {
                    r.Add(Severity.Note, CheckCodes.TieMisfit,
                        $"Aligned without marker {m.Id}, {why}: it puts the marker at {r.Depth(f.Placed)} in core {f.Held.CoreId}, {r.Depth(f.Distance)} from the tie at {r.Depth(f.Given)}, but the signals had no say there, so the tie is not judged.",
                        f.Held.CoreId, m.Id, f.Given, CheckReporter.MarkerSource(m.Id, f.Held.CoreId));
                    continue;
                }
                string range = f.Range is { } b
                    ? $"; sampled without it, the signals' 95 % range there is {r.Depth(b.Lo)} to {r.Depth(b.Hi)}, and the nearer of the optimal path and the members' median is compared"
                    : "";
                string basis = f.Range is null ? "the tie uncertainty, at least one grid step" : "the tie uncertainty, at least one grid step, and that range's, combined";
                r.Add(Severity.Warning, CheckCodes.TieMisfit,
                    $"Aligned without marker {m.Id}{(onSite[i] ? " (on the site scale, every core to the others too)" : "")}, the signals put it at {r.Depth(f.Placed)} in core {f.Held.CoreId} (carried from {r.Depth(f.Anchor.Depth.In(r.Unit))} in {f.Anchor.CoreId}), {r.Depth(f.Distance)} from the tie at {r.Depth(f.Given)}{range}; that is more than {CheckReporter.Number(p.Checks.TieMisfitSigmas)} × {r.Depth(f.Sigma)} ({basis}). The layer may be misidentified or its depth mistyped, or the signals are poor here.",
                    f.Held.CoreId, m.Id, f.Given, CheckReporter.MarkerSource(m.Id, f.Held.CoreId));
            }
        }
        progress?.Report(new WorkProgress("checks: ties left out one at a time", 1));
    }

    private static Project Without(Project p, MarkerSpec m) => p with
    {
        Markers = p.Markers.Remove(m),
        Ages = p.Ages.RemoveAll(a => a is CalendarAgeControl { Marker: var mk } && mk == m.Id),
        Alignment = p.Alignment with { Scale = AlignmentScales.Reference },
    };

    /// <param name="Unheld">Why, left out, the marker's placement in the core rests on something other than the signals (then not judged); else null.</param>
    private sealed record Misfit(MarkerDepth Anchor, MarkerDepth Held, double Given, double Placed, double Distance, double Sigma, double Limit,
        (double Lo, double Hi)? Range, string? Unheld);

    /// <summary>
    /// Where the alignment without <paramref name="m"/> puts it in each core holding it, carried from
    /// one core's depth (the reference's when it holds M). With <paramref name="sampled"/>, each member
    /// carries it too: their 95 % range widens the uncertainty, and the nearer of the optimal placement
    /// and their median is compared. <paramref name="network"/>: the project's ties, all markers kept.
    /// <paramref name="onSite"/>: aligned on the site scale, where past the reference the cores are matched to each other.
    /// </summary>
    private static IEnumerable<Misfit> Misfits(CheckReporter r, LoadedProject loaded, TieNetwork network, MarkerSpec m, AlignmentResult result, AlignmentResult? sampled, bool onSite)
    {
        var p = r.Project;
        var held = m.Depths.Where(d => loaded.Tables.ContainsKey(d.CoreId) && result.Mappings.ContainsKey(d.CoreId)).ToList();
        if (held.Count < 2) yield break;
        var anchor = held.FirstOrDefault(d => d.CoreId == result.ReferenceCore) ?? held[0];
        double anchorDepth = anchor.Depth.In(r.Unit);
        double anchorComposite = result.Mappings[anchor.CoreId].Median.ToCompositeValue(anchorDepth);
        foreach (var md in held.Where(d => d != anchor))
        {
            double given = md.Depth.In(r.Unit);
            double placed = result.Mappings[md.CoreId].Median.ToCoreValue(anchorComposite);
            double step = AlignmentRuns.GridStep(p, loaded.Tables[md.CoreId]);
            double sigma = Math.Max(m.Uncertainty, step);
            var reference = loaded.Tables[result.ReferenceCore];
            string? unheld = !onSite && (anchorComposite < reference.Depths[0] || anchorComposite > reference.Depths[^1])
                ? $"the marker lies past the {(anchorComposite < reference.Depths[0] ? "top" : "base")} of the reference core {result.ReferenceCore}, where each core aligned to it alone is only continued"
                : UnheldEnd(network, m, md.CoreId, given, result, loaded.Tables[md.CoreId], sigma) is { } end
                    ? $"core {md.CoreId} has no tie between the marker and its {end}, which the alignment then places by the end alone (open, or closed where the other ties do not put it)"
                    : null;
            (double Lo, double Hi)? range = null;
            if (sampled is not null && sampled.Mappings.TryGetValue(md.CoreId, out var to) && sampled.Mappings.TryGetValue(anchor.CoreId, out var from)
                && to.Members.Count > 0)
            {
                var members = new double[to.Members.Count];
                for (int e = 0; e < members.Length; e++) members[e] = to.Members[e].ToCoreValue(from.Member(e).ToCompositeValue(anchorDepth));
                Array.Sort(members);
                double median = Statistics.PercentileSorted(members, 50);
                if (Math.Abs(median - given) < Math.Abs(placed - given)) placed = median;
                range = (Statistics.PercentileSorted(members, 2.5), Statistics.PercentileSorted(members, 97.5));
                double spread = Statistics.SigmaOfRange95(range.Value.Lo, range.Value.Hi);
                sigma = Math.Sqrt(sigma * sigma + spread * spread);
            }
            double distance = Math.Abs(placed - given);
            yield return new Misfit(anchor, md, given, placed, distance, sigma, p.Checks.TieMisfitSigmas * sigma, range, unheld);
        }
    }

    /// <summary>
    /// The end ("top" or "base") of <paramref name="coreId"/> that alone places the marker at
    /// <paramref name="given"/> once it is left out, or null when the placement is held: between two
    /// remaining ties, or toward an end the alignment closed where the project's ties' line puts it
    /// (within three tie uncertainties of <paramref name="sigma"/>, or a twentieth of the core).
    /// </summary>
    private static string? UnheldEnd(TieNetwork network, MarkerSpec m, string coreId, double given, AlignmentResult result, Tables.CoreTable table, double sigma)
    {
        if (coreId == result.ReferenceCore) return null;
        var remaining = network.TiesOf(coreId).Where(t => t.Marker != m.Id).ToList();
        bool aboveAll = remaining.Count == 0 || given < remaining[0].CoreDepth;
        bool belowAll = remaining.Count == 0 || given > remaining[^1].CoreDepth;
        var diagnostics = result.Diagnostics.GetValueOrDefault(coreId);
        var mapping = result.Mappings[coreId].Median;
        var line = network.LineOf(coreId);
        double tolerance = Math.Max(3 * sigma, (table.Depths[^1] - table.Depths[0]) / 20);
        bool Held(double end, bool open) => !open && line is not null && Math.Abs(line.ToCompositeValue(end) - mapping.ToCompositeValue(end)) <= tolerance;
        if (aboveAll && !Held(table.Depths[0], diagnostics?.OpenBegin == true)) return "top";
        if (belowAll && !Held(table.Depths[^1], diagnostics?.OpenEnd == true)) return "base";
        return null;
    }
}
