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
/// </summary>
internal static class TieMisfitCheck
{
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
            var m = candidates[i];
            var without = p with
            {
                Markers = p.Markers.Remove(m),
                Ages = p.Ages.RemoveAll(a => a is CalendarAgeControl { Marker: var mk } && mk == m.Id),
                Alignment = p.Alignment with { Scale = AlignmentScales.Reference },
            };
            results[i].Result = AlignmentRuns.TryAlign(aligner, loaded, without, ct, out results[i].Failure);
            progress?.Report(new WorkProgress("checks: ties left out one at a time", (double)Interlocked.Increment(ref done) / candidates.Count, m.Id));
        });
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
            Compare(r, loaded, m, result);
        }
        progress?.Report(new WorkProgress("checks: ties left out one at a time", 1));
    }

    private static void Compare(CheckReporter r, LoadedProject loaded, MarkerSpec m, AlignmentResult result)
    {
        var p = r.Project;
        var held = m.Depths.Where(d => loaded.Tables.ContainsKey(d.CoreId) && result.Mappings.ContainsKey(d.CoreId)).ToList();
        if (held.Count < 2) return;
        var anchor = held.FirstOrDefault(d => d.CoreId == result.ReferenceCore) ?? held[0];
        double anchorComposite = result.Mappings[anchor.CoreId].Median.ToCompositeValue(anchor.Depth.In(r.Unit));
        foreach (var md in held.Where(d => d != anchor))
        {
            double given = md.Depth.In(r.Unit);
            double placed = result.Mappings[md.CoreId].Median.ToCoreValue(anchorComposite);
            double sigma = Math.Max(m.Uncertainty, AlignmentRuns.GridStep(p, loaded.Tables[md.CoreId]));
            double limit = p.Checks.TieMisfitSigmas * sigma;
            double distance = Math.Abs(placed - given);
            if (distance <= limit) continue;
            r.Add(Severity.Warning, CheckCodes.TieMisfit,
                $"Aligned without marker {m.Id}, the signals put it at {r.Depth(placed)} in core {md.CoreId} (carried from {r.Depth(anchor.Depth.In(r.Unit))} in {anchor.CoreId}), {r.Depth(distance)} from the tie at {r.Depth(given)}; that is more than {CheckReporter.Number(p.Checks.TieMisfitSigmas)} × {r.Depth(sigma)} (the tie uncertainty, at least one grid step). The layer may be misidentified or its depth mistyped, or the signals are poor here.",
                md.CoreId, m.Id, given, CheckReporter.MarkerSource(m.Id, md.CoreId));
        }
    }
}
