using StratLink.Alignment;
using StratLink.Model;
using StratLink.Workflows;

namespace StratLink.Checks;

/// <summary>
/// Loop closure with three or more cores. Reference scale: align once with each core as the reference,
/// then compare the direct mapping A to C with A to B to C at A's samples. Site scale
/// (<see cref="AlignmentScales.Site"/>): every core maps onto one composite, so any loop through it
/// closes by construction; what can still disagree is the composite with the records themselves, so
/// the mapping of A to C the site implies (C's mapping inverted after A's) is compared with a direct
/// alignment of A to C alone (C as the reference, reference scale) over the part of A that C covers,
/// for each pair with C the longer core: a shorter record fits inside a longer one, while a longer
/// one aligned to a shorter has most of its length with nothing to match. Points whose two placements
/// have a gap or disturbed interval at or between them (in C, or in A with the direct placement carried
/// back through the site) are not compared: there the pair alone has nothing to align on, while the
/// site bridges it with the other cores. Nor are the parts of A beyond its outermost tie with C that
/// the pair's path places by its ends rather than by the records: an open end, where the path may stop
/// anywhere, and an end the ties place beyond C's unpadded end, onto which the path squeezes A.
/// Only the part of A that the other cores overlap is compared (in the reference scale taken from the
/// alignment with A as the reference, where B and C map onto the stretch of A they cover), less one
/// grid step at each end; and points where a mapping's local rate ratio departs from its overall ratio
/// by more than <see cref="CheckSettings.RateJumpFactor"/> are skipped: that is how a mapping looks
/// where it runs off the end of the shorter core (squeezed onto the reference's end, or stretched
/// along it), where there is nothing to compare. Consistent alignments close the loop; the worst
/// mismatch and where it is are reported, as a warning when it exceeds
/// <see cref="CheckSettings.TieMisfitSigmas"/> times the typical tie uncertainty (median over markers,
/// at least one grid step of C), else as a note; the multiple is raised for the worst of the
/// effective number of independent points compared (<see cref="FamilyWiseLimit"/>), so that a long
/// consistent site warns no more often than one comparison would. On the site scale the composite's own band at the
/// point (from the ensemble, when there is one) is added in quadrature, and the pair's: at least the
/// site's, and where the optimal paths would warn, the pair's own band from its sampled paths (seeded
/// as the build's; then the nearer of its optimal path and their median is compared). A mapping known
/// only to within its band agrees with another when they differ by no more than both uncertainties allow.
/// </summary>
internal static class LoopClosureCheck
{
    /// <summary>Samples of A compared per loop; enough to find a local misfit, bounded for long cores.</summary>
    private const int MaxPointsPerCore = 1000;

    /// <summary>
    /// Sampled paths of a pair's own alignment where its optimal path would warn: enough for a 95 %
    /// range with a few members beyond each end, at half the cost of the build's default ensemble.
    /// </summary>
    private const int PairEnsemble = 100;

    public static void Run(CheckReporter r, LoadedProject loaded, AlignmentResult? given, Func<LoadedProject, CancellationToken, AlignmentResult> aligner,
        IProgress<WorkProgress>? progress, CancellationToken ct)
    {
        var p = r.Project;
        var cores = p.Cores.Select(c => c.Id).Where(id => loaded.Tables.TryGetValue(id, out var t) && t.Count > 1).ToList();
        if (cores.Count < 3) return;
        if (p.Alignment.Method == AlignmentMethods.Dtw && p.Alignment.Scale == AlignmentScales.Site)
        {
            RunOnSite(r, loaded, given, aligner, cores, progress, ct);
            return;
        }

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
        double compared = 0;
        foreach (string a in cores)
        {
            var ta = loaded.Tables[a];
            var spec = p.FindCore(a)!;
            int stride = Math.Max(1, ta.Count / MaxPointsPerCore);
            double stepA = AlignmentRuns.GridStep(p, ta);
            double factor = p.Checks.RateJumpFactor;
            foreach (string b in cores.Where(b => b != a))
            {
                foreach (string c in cores.Where(c => c != a && c != b))
                {
                    if (!maps[b].TryGetValue(a, out var ab) || !maps[c].TryGetValue(a, out var ac) || !maps[c].TryGetValue(b, out var bc)) continue;
                    if (Overlap(maps[a], b, loaded) is not { } inAofB || Overlap(maps[a], c, loaded) is not { } inAofC) continue;
                    double lo = Math.Max(inAofB.Lo, inAofC.Lo) + stepA, hi = Math.Min(inAofB.Hi, inAofC.Hi) - stepA;
                    var misfits = new List<double>();
                    for (int k = 0; k < ta.Count; k += stride)
                    {
                        double z = ta.Depths[k];
                        if (z < lo || z > hi || spec.IsUnusable(z)) continue;
                        double inB = ab.Median.ToCompositeValue(z);
                        if (!Regular(ab.Median, z, loaded.Tables[a], factor) || !Regular(ac.Median, z, loaded.Tables[a], factor)
                            || !Regular(bc.Median, inB, loaded.Tables[b], factor)) continue;
                        double direct = ac.Median.ToCompositeValue(z);
                        double via = bc.Median.ToCompositeValue(inB);
                        double mismatch = Math.Abs(direct - via);
                        misfits.Add(direct - via);
                        if (worst is null || mismatch > worst.Value.Mismatch) worst = (mismatch, a, b, c, z, direct, via);
                    }
                    compared += FamilyWiseLimit.EffectiveCount(misfits);
                }
            }
        }
        if (worst is not { } w) return;
        Report(r, loaded, w.Mismatch, w.A, w.C, w.Z,
            $"Mapping core {w.A} to {w.C} directly and through {w.B} differs by {r.Depth(w.Mismatch)} at most, at {r.Depth(w.Z)} in {w.A} ({r.Depth(w.Direct)} in {w.C} directly, {r.Depth(w.Via)} through {w.B}); ",
            $"{w.A}/{w.B}/{w.C}", 0, (FamilyWiseLimit.Sigmas(p.Checks.TieMisfitSigmas, compared), compared));
    }

    /// <summary>Site scale: each pair's mapping through the one composite against a direct alignment of the pair.</summary>
    private static void RunOnSite(CheckReporter r, LoadedProject loaded, AlignmentResult? given, Func<LoadedProject, CancellationToken, AlignmentResult> aligner,
        List<string> cores, IProgress<WorkProgress>? progress, CancellationToken ct)
    {
        var p = r.Project;
        const string stage = "checks: loop closure";
        var site = given?.Mappings ?? AlignmentRuns.TryAlign(aligner, loaded, p, ct, out _)?.Mappings;
        if (site is null) return;
        double Length(string id) => loaded.Tables[id].Depths[^1] - loaded.Tables[id].Depths[0];
        bool Longer(string c, string a) => Length(c) > Length(a) || Length(c) == Length(a) && cores.IndexOf(c) < cores.IndexOf(a);
        // direct[c][a]: core a's depth to core c's depth, aligned to c alone; c longer than a. ties[c]: the ties that alignment had.
        var direct = new Dictionary<string, AlignmentResult>(StringComparer.Ordinal);
        var ties = new Dictionary<string, TieNetwork>(StringComparer.Ordinal);
        var references = cores.Where(c => cores.Any(a => a != c && Longer(c, a))).ToList();
        for (int i = 0; i < references.Count; i++)
        {
            ct.ThrowIfCancellationRequested();
            string reference = references[i];
            progress?.Report(new WorkProgress(stage, (double)i / references.Count, reference));
            var pair = p with { Alignment = p.Alignment with { Reference = reference, Scale = AlignmentScales.Reference } };
            var result = AlignmentRuns.TryAlign(aligner, loaded, pair, ct, out string? failure);
            if (result is null)
            {
                r.Add(Severity.Note, CheckCodes.CheckNotRun,
                    $"The loop-closure check did not run: aligning the cores to {reference} failed ({failure}).", reference, null, null, "alignment.reference");
                return;
            }
            direct[reference] = result;
            ties[reference] = TieNetwork.Build(pair, loaded.Tables, []);
        }
        progress?.Report(new WorkProgress(stage, 1));

        double factor = p.Checks.RateJumpFactor;
        double tie = TypicalTieSigma(p);
        // Optimal paths first; a reference whose pairs would warn is aligned again with the path
        // ensemble, so that a warning is judged against the pair's own band, not a bound on it.
        var worstByReference = references.ToDictionary(c => c, c => WorstPair(c, null), StringComparer.Ordinal);
        // The worst of every compared point is judged, so the limit is the one for the family of the
        // points' effective number, taken from the optimal paths' misfits.
        double compared = worstByReference.Values.Sum(w => w.Effective);
        double sigmas = FamilyWiseLimit.Sigmas(p.Checks.TieMisfitSigmas, compared);
        foreach (string c in references)
        {
            if (worstByReference[c].Worst is not { } first || first.Excess <= sigmas) continue;
            ct.ThrowIfCancellationRequested();
            var pair = p with { Alignment = p.Alignment with { Reference = c, Scale = AlignmentScales.Reference } };
            if (AlignmentRuns.TryAlign(aligner, loaded, pair, ct, out _, PairEnsemble) is not { } sampled) continue;
            worstByReference[c] = WorstPair(c, sampled);
        }
        var worst = worstByReference.Values.Select(w => w.Worst).Where(w => w is not null).MaxBy(w => w!.Value.Excess);
        if (worst is not { } w) return;
        string own = w.Sampled ? $" (the optimal path or the median of {PairEnsemble} sampled paths, whichever is nearer)" : "";
        Report(r, loaded, w.Mismatch, w.A, w.C, w.Z,
            $"Mapping core {w.A} to {w.C} through the site's composite and by aligning {w.A} to {w.C} alone{own} differs by {r.Depth(w.Mismatch)} at {r.Depth(w.Z)} in {w.A} ({r.Depth(w.Implied)} in {w.C} through the composite, {r.Depth(w.Direct)} directly), the largest departure for its uncertainty; ",
            $"{w.A}/{w.C}", w.Band, (sigmas, compared));

        // The worst departure, for its uncertainty, over the cores shorter than c; with the pair's
        // sampled paths, from the nearer of its optimal path (the posterior's mode) and their median:
        // where the two differ the pair's posterior is skewed or has several modes, and a site placement
        // near either is one the pair's own evidence allows.
        // Effective: the effective number of independent points compared, summed over the pairs.
        ((double Mismatch, double Band, double Excess, string A, string C, double Z, double Direct, double Implied, bool Sampled)? Worst, double Effective) WorstPair(string c, AlignmentResult? sampled)
        {
            (double Mismatch, double Band, double Excess, string A, string C, double Z, double Direct, double Implied, bool Sampled)? worst = null;
            double effective = 0;
            if (!site.TryGetValue(c, out var sc)) return (null, 0);
            var tc = loaded.Tables[c];
            var specC = p.FindCore(c)!;
            double stepC = AlignmentRuns.GridStep(p, tc);
            double sigma = Math.Max(tie, stepC);
            foreach (string a in cores.Where(a => a != c && Longer(c, a)))
            {
                if (!site.TryGetValue(a, out var sa) || !direct[c].Mappings.TryGetValue(a, out var ac)) continue;
                var members = sampled?.Mappings.GetValueOrDefault(a);
                var ta = loaded.Tables[a];
                var spec = p.FindCore(a)!;
                int stride = Math.Max(1, ta.Count / MaxPointsPerCore);
                double stepA = AlignmentRuns.GridStep(p, ta);
                // The part of A that C covers on the composite, and that the pair's own alignment places.
                var (ownLo, ownHi) = PlacedByThePair(ac, direct[c].Diagnostics.GetValueOrDefault(a), ties[c], a, ta, tc, stepC);
                double lo = Math.Max(ownLo, sa.Median.ToCoreValue(sc.Median.ToCompositeValue(tc.Depths[0])) + stepA);
                double hi = Math.Min(ownHi, sa.Median.ToCoreValue(sc.Median.ToCompositeValue(tc.Depths[^1])) - stepA);
                var misfits = new List<double>();
                for (int k = 0; k < ta.Count; k += stride)
                {
                    double z = ta.Depths[k];
                    if (z < lo || z > hi || spec.IsUnusable(z)) continue;
                    double implied = sc.Median.ToCoreValue(sa.Median.ToCompositeValue(z));
                    if (!Regular(ac.Median, z, ta, factor) || !Regular(sa.Median, z, ta, factor) || !Regular(sc.Median, implied, tc, factor)) continue;
                    double d = ac.Median.ToCompositeValue(z);
                    if (members is not null && Math.Abs(members.Median.ToCompositeValue(z) - implied) < Math.Abs(d - implied)) d = members.Median.ToCompositeValue(z);
                    // Where C (or A) has no record (a gap, a disturbed stretch) at or between the two
                    // placements, the pair's own alignment had nothing to tell them apart; the site
                    // bridges it with the other cores.
                    double back = sa.Median.ToCoreValue(sc.Median.ToCompositeValue(d)); // the direct placement, carried back to A through the site
                    if (Unrecorded(specC, Math.Min(d, implied), Math.Max(d, implied)) || Unrecorded(spec, Math.Min(z, back), Math.Max(z, back))) continue;
                    double mismatch = Math.Abs(d - implied);
                    misfits.Add(d - implied);
                    // The bands only lower the excess, so they are read (sorting the members) only where
                    // the tie uncertainty alone would make this point the worst.
                    if (worst is not null && mismatch / sigma <= worst.Value.Excess) continue;
                    // Aligned on two cores where the site uses all, the pair's placement is uncertain by at
                    // least the site's band; its own band, where sampled, when wider.
                    double siteBand = BandSigma(sa, z, sc, implied);
                    double pairBand = siteBand;
                    if (members is not null)
                    {
                        var (pLo, pHi) = members.CompositeRange(z);
                        pairBand = Math.Max(siteBand, Statistics.SigmaOfRange95(pLo, pHi));
                    }
                    double band = Math.Sqrt(siteBand * siteBand + pairBand * pairBand);
                    double excess = mismatch / Math.Sqrt(sigma * sigma + band * band);
                    if (worst is null || excess > worst.Value.Excess) worst = (mismatch, band, excess, a, c, z, d, implied, members is not null);
                }
                effective += FamilyWiseLimit.EffectiveCount(misfits);
            }
            return (worst, effective);
        }
    }

    /// <summary>
    /// Reports the worst mismatch against <see cref="CheckSettings.TieMisfitSigmas"/> times the typical
    /// tie uncertainty (at least one grid step of C), combined in quadrature with the standard
    /// uncertainty <paramref name="band"/> (C's depth units) of the mapping the mismatch is measured on.
    /// </summary>
    private static void Report(CheckReporter r, LoadedProject loaded, double mismatch, string a, string c, double z, string what, string item, double band,
        (double Sigmas, double Compared) family)
    {
        var p = r.Project;
        double tie = Math.Max(TypicalTieSigma(p), AlignmentRuns.GridStep(p, loaded.Tables[c]));
        double sigma = Math.Sqrt(tie * tie + band * band);
        double limit = family.Sigmas * sigma;
        bool bad = mismatch > limit;
        string basis = band > 0
            ? $"{r.Depth(tie)} typical tie uncertainty (at least one grid step) and {r.Depth(band)} from the bands of both mappings there, combined"
            : "typical tie uncertainty, at least one grid step";
        string times = CheckReporter.Number(Math.Round(family.Sigmas, 2));
        string raised = family.Sigmas > p.Checks.TieMisfitSigmas
            ? $"; {CheckReporter.Number(p.Checks.TieMisfitSigmas)} for one comparison, raised for the worst of about {family.Compared:0} independent points"
            : "";
        r.Add(bad ? Severity.Warning : Severity.Note, CheckCodes.LoopClosure,
            what
            + (bad
                ? $"that is more than {times} × {r.Depth(sigma)} ({basis}{raised}), so the alignments are not consistent there."
                : $"within {times} × {r.Depth(sigma)} ({basis}{raised})."),
            a, item, z, $"cores[{a}]");
    }

    private static double TypicalTieSigma(Project p)
    {
        var uncertainties = p.Markers.Select(m => m.Uncertainty).Order().ToArray();
        return uncertainties.Length == 0 ? 0 : Statistics.PercentileSorted(uncertainties, 50);
    }

    /// <summary>
    /// Standard uncertainty, in C's depth, of the site's placement of A's depth <paramref name="z"/> in C:
    /// A's and C's ensemble bands on the composite (95 % ranges, half-width / 1.96 as for a normal
    /// spread) combined in quadrature, carried to C's depth by C's local rate ratio. Zero without
    /// ensembles. The site's mapping is itself uncertain by that much, so agreeing "within the tie
    /// uncertainty" means within both.
    /// </summary>
    private static double BandSigma(MappingEnsemble a, double z, MappingEnsemble c, double inC)
    {
        var (aLo, aHi) = a.CompositeRange(z);
        var (cLo, cHi) = c.CompositeRange(inC);
        double sa = Statistics.SigmaOfRange95(aLo, aHi), sc = Statistics.SigmaOfRange95(cLo, cHi);
        double rate = c.Median.RateRatioAt(inC);
        return rate > 0 ? Math.Sqrt(sa * sa + sc * sc) / rate : 0;
    }

    /// <summary>
    /// The part of A whose placement in C the pair's own alignment has evidence for. Between A's
    /// outermost ties the path is held at both sides. Beyond them it is held only by an end the
    /// alignment closes where the pair's ties place it: at an open end (A ends inside C) the path may
    /// stop at any column, and stopping costs what matching on does (the completion cost is the path's
    /// mean cost per cell), so where it stops, and A's placement back to the tie with it, is the
    /// choice of its last rows; where the ties place A's end beyond C's end but C was not padded (the
    /// overhang within the band), the path starts (ends) A at C's end and has had to fit A's surplus
    /// onto it (a freeze core above a gravity core's lost top, squeezed onto it).
    /// </summary>
    private static (double Lo, double Hi) PlacedByThePair(MappingEnsemble direct, CoreAlignmentDiagnostics? diagnostics, TieNetwork network, string a,
        Tables.CoreTable ta, Tables.CoreTable tc, double stepC)
    {
        double lo = double.NegativeInfinity, hi = double.PositiveInfinity;
        var ties = network.TiesOf(a);
        if (network.LineOf(a) is not { } line || ties.Count == 0) return (lo, hi);
        double aTop = ta.Depths[0], aBottom = ta.Depths[^1], cTop = tc.Depths[0], cBottom = tc.Depths[^1];
        bool squeezedAtTop = line.ToCompositeValue(aTop) < cTop - stepC && direct.Median.ToCompositeValue(aTop) > cTop - stepC;
        bool squeezedAtBottom = line.ToCompositeValue(aBottom) > cBottom + stepC && direct.Median.ToCompositeValue(aBottom) < cBottom + stepC;
        if (squeezedAtTop || diagnostics?.OpenBegin == true) lo = ties[0].CoreDepth;
        if (squeezedAtBottom || diagnostics?.OpenEnd == true) hi = ties[^1].CoreDepth;
        return (lo, hi);
    }

    /// <summary>True when a gap or disturbed interval of <paramref name="core"/> meets <paramref name="lo"/>-<paramref name="hi"/> (project unit).</summary>
    private static bool Unrecorded(CoreSpec core, double lo, double hi) =>
        core.Gaps.Concat(core.Disturbed).Any(g => g.Top.In(g.Top.Unit) <= hi && g.Bottom.In(g.Top.Unit) >= lo);

    /// <summary>True when the mapping's rate ratio at <paramref name="depth"/> is within a factor of its ratio over the whole core.</summary>
    private static bool Regular(DepthMapping m, double depth, Tables.CoreTable core, double factor)
    {
        double overall = (m.ToCompositeValue(core.Depths[^1]) - m.ToCompositeValue(core.Depths[0])) / (core.Depths[^1] - core.Depths[0]);
        double local = m.RateRatioAt(depth);
        return overall > 0 && local * factor >= overall && local <= overall * factor;
    }

    /// <summary>The stretch of the reference core that core <paramref name="other"/> covers in an alignment to that reference.</summary>
    private static (double Lo, double Hi)? Overlap(IReadOnlyDictionary<string, MappingEnsemble> toReference, string other, LoadedProject loaded)
    {
        if (!toReference.TryGetValue(other, out var e)) return null;
        var t = loaded.Tables[other];
        return (e.Median.ToCompositeValue(t.Depths[0]), e.Median.ToCompositeValue(t.Depths[^1]));
    }
}
