using StratLink.Alignment;
using StratLink.Model;
using StratLink.Workflows;

namespace StratLink.Checks;

/// <summary>
/// Loop closure with three or more cores: align once with each core as the reference, then compare the
/// direct mapping A to C with A to B to C at A's samples (where both stay inside the cores). Consistent
/// alignments close the loop; the worst mismatch and where it is are reported, as a warning when it
/// exceeds <see cref="CheckSettings.TieMisfitSigmas"/> times the typical tie uncertainty (median over
/// markers, at least one grid step of C), else as a note.
/// </summary>
internal static class LoopClosureCheck
{
    /// <summary>Samples of A compared per loop; enough to find a local misfit, bounded for long cores.</summary>
    private const int MaxPointsPerCore = 1000;

    public static void Run(CheckReporter r, LoadedProject loaded, AlignmentResult? given, Func<LoadedProject, CancellationToken, AlignmentResult> aligner,
        IProgress<WorkProgress>? progress, CancellationToken ct)
    {
        var p = r.Project;
        var cores = p.Cores.Select(c => c.Id).Where(id => loaded.Tables.TryGetValue(id, out var t) && t.Count > 1).ToList();
        if (cores.Count < 3) return;

        // maps[b][a]: core a's depth to core b's depth (alignment with b as the reference).
        var maps = new Dictionary<string, IReadOnlyDictionary<string, MappingEnsemble>>(StringComparer.Ordinal);
        for (int i = 0; i < cores.Count; i++)
        {
            ct.ThrowIfCancellationRequested();
            string reference = cores[i];
            progress?.Report(new WorkProgress("checks: loop closure", (double)i / cores.Count, reference));
            if (given is not null && given.ReferenceCore == reference)
            {
                maps[reference] = given.Mappings;
                continue;
            }
            var result = AlignmentRuns.TryAlign(aligner, loaded, p with { Alignment = p.Alignment with { Reference = reference } }, ct, out string? failure);
            if (result is null)
            {
                r.Add(Severity.Note, CheckCodes.CheckNotRun,
                    $"The loop-closure check did not run: aligning the cores to {reference} failed ({failure}).", reference, null, null, "alignment.reference");
                return;
            }
            maps[reference] = result.Mappings;
        }
        progress?.Report(new WorkProgress("checks: loop closure", 1));

        (double Mismatch, string A, string B, string C, double Z, double Direct, double Via)? worst = null;
        foreach (string a in cores)
        {
            var ta = loaded.Tables[a];
            var spec = p.FindCore(a)!;
            int stride = Math.Max(1, ta.Count / MaxPointsPerCore);
            foreach (string b in cores.Where(b => b != a))
            {
                foreach (string c in cores.Where(c => c != a && c != b))
                {
                    if (!maps[b].TryGetValue(a, out var ab) || !maps[c].TryGetValue(a, out var ac) || !maps[c].TryGetValue(b, out var bc)) continue;
                    var tb = loaded.Tables[b];
                    var tc = loaded.Tables[c];
                    for (int k = 0; k < ta.Count; k += stride)
                    {
                        double z = ta.Depths[k];
                        if (spec.IsUnusable(z)) continue;
                        double inB = ab.Median.ToCompositeValue(z);
                        double direct = ac.Median.ToCompositeValue(z);
                        double via = bc.Median.ToCompositeValue(inB);
                        if (!Inside(tb.Depths, inB) || !Inside(tc.Depths, direct) || !Inside(tc.Depths, via)) continue;
                        double mismatch = Math.Abs(direct - via);
                        if (worst is null || mismatch > worst.Value.Mismatch) worst = (mismatch, a, b, c, z, direct, via);
                    }
                }
            }
        }
        if (worst is not { } w) return;

        var uncertainties = p.Markers.Select(m => m.Uncertainty).Order().ToArray();
        double typical = uncertainties.Length == 0 ? 0 : Statistics.PercentileSorted(uncertainties, 50);
        double sigma = Math.Max(typical, AlignmentRuns.GridStep(p, loaded.Tables[w.C]));
        double limit = p.Checks.TieMisfitSigmas * sigma;
        bool bad = w.Mismatch > limit;
        r.Add(bad ? Severity.Warning : Severity.Note, CheckCodes.LoopClosure,
            $"Mapping core {w.A} to {w.C} directly and through {w.B} differs by {r.Depth(w.Mismatch)} at most, at {r.Depth(w.Z)} in {w.A} ({r.Depth(w.Direct)} in {w.C} directly, {r.Depth(w.Via)} through {w.B}); "
            + (bad
                ? $"that is more than {CheckReporter.Number(p.Checks.TieMisfitSigmas)} × {r.Depth(sigma)} (typical tie uncertainty, at least one grid step), so the alignments are not consistent there."
                : $"within {CheckReporter.Number(p.Checks.TieMisfitSigmas)} × {r.Depth(sigma)} (typical tie uncertainty, at least one grid step)."),
            w.A, $"{w.A}/{w.B}/{w.C}", w.Z, $"cores[{w.A}]");
    }

    private static bool Inside(double[] sortedDepths, double d) => d >= sortedDepths[0] && d <= sortedDepths[^1];
}
