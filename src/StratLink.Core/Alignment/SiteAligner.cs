using StratLink.Checks;
using StratLink.Quantities;
using StratLink.Workflows;

namespace StratLink.Alignment;

/// <summary>
/// Alignment of the whole site rather than of each core to the reference alone: starting from the
/// alignments to the reference, every other core is aligned again to the stack of all the other
/// cores (their standardised signals carried to composite depth by their current median mappings
/// and averaged where several overlap), and the stack is rebuilt from the new mappings, until 95% of
/// the samples of all cores move by at most one grid step in a round (or <see cref="MaxRounds"/> rounds). This is
/// iterative refinement of a multiple alignment against its own consensus, as in multiple sequence
/// alignment (progressive alignment, Feng and Doolittle 1987; iterative refinement, e.g. Gotoh 1996
/// - from memory) and in stacking palaeoclimate records by aligning each to the current stack
/// (Lisiecki and Lisiecki 2002; Lisiecki and Raymo 2005). Leaving each core out of its own stack keeps
/// it from matching itself. The reference keeps the identity, so composite depth is still its depth
/// where it has data; a core that runs past the reference is matched there to the cores that reach
/// that far, and only what no other core reaches is continued at its rate ratio. Past each end of the
/// reference one core carries the scale (progressive alignment: the one reaching furthest of those
/// sharing a long record with the reference, aligned
/// only to the stack on the reference's side and continued at the cores' consensus long-run rate
/// ratio, <see cref="ScaleContinuation"/>), the others are matched to it, and the scale's
/// uncertainty there enters member e of every core as member e of the carrier's. All cores map to one
/// composite, so mapping A to C directly and through B agree by construction.
/// </summary>
internal static class SiteAligner
{
    public const int MaxRounds = 4;

    /// <summary>Settled when this percentile of the samples' shifts in a round is within one grid step (the ensemble median jitters by a step here and there).</summary>
    private const double SettledPercentile = 95;

    /// <summary>One core taking part: its prepared signals (signal names of the reference's list), weights, ties.</summary>
    public sealed record Member(string CoreId, PreparedSignals Signals, double[] Weights, IReadOnlyList<TiePoint> Ties);

    /// <summary>
    /// Refines <paramref name="mappings"/> (the optimal mappings to the reference) in place: rounds of
    /// optimal paths only until they settle (or <see cref="MaxRounds"/>), then one round against the
    /// settled stack that also samples <paramref name="options"/>' ensemble. Returns the refinement
    /// rounds run and whether they settled.
    /// </summary>
    public static (int Rounds, bool Settled) Refine(PreparedSignals reference, IReadOnlyList<Member> members, Dictionary<string, MappingEnsemble> mappings,
        Dictionary<string, CoreAlignmentDiagnostics> diagnostics, DtwCoreOptions options, DepthUnit unit, FindingList findings, CancellationToken ct)
    {
        var optimalOnly = options with { Ensemble = 0 };
        bool shortReference = StartFromTiesWhereMostlyOutside(reference, members, mappings, unit);
        var carriers = CarriersOf(reference, members, mappings);
        int rounds = 0;
        bool settled = false;
        var last = Array.Empty<(MappingEnsemble, CoreAlignmentDiagnostics, FindingList Findings)>();
        while (!settled && rounds < MaxRounds)
        {
            rounds++;
            last = Round(reference, members, mappings, carriers, optimalOnly, unit, ct, shortReference);
            settled = Apply(members, mappings, diagnostics, last, rounds) <= reference.Step;
            ContinueCarriers(reference, members, mappings, carriers, unit);
        }
        if (options.Ensemble > 0)
        {
            last = Round(reference, members, mappings, carriers, options, unit, ct, shortReference);
            Apply(members, mappings, diagnostics, last, rounds);
            ContinueCarriers(reference, members, mappings, carriers, unit, options.Seed);
            ShareScalePastReference(reference, members, mappings, carriers, unit);
            WidenScalePastReference(reference, members, mappings, carriers, options.Seed);
        }
        foreach (var n in last) findings.AddRange(n.Findings);
        return (rounds, settled);
    }

    /// <summary>
    /// A core whose ties place more than half of it outside the reference cannot be placed by an
    /// alignment to the reference alone (it is squeezed onto the reference), so it starts from its
    /// straight-line-ties mapping: beyond the reference the stack is then made of the cores that
    /// reach there as their ties (marker layers shared with other cores) place them, and each is
    /// matched to the others there in the rounds. Returns whether any core so started (a short
    /// reference): then the stack over the reference's span is the reference alone in every round,
    /// since the others' placements there start as ties' lines, which err alike between the same
    /// markers, or squeezed onto the reference, and matched to those the cores keep the error they share.
    /// </summary>
    private static bool StartFromTiesWhereMostlyOutside(PreparedSignals reference, IReadOnlyList<Member> members, Dictionary<string, MappingEnsemble> mappings, DepthUnit unit)
    {
        bool any = false;
        double refTop = reference.DepthAt(0), refBottom = reference.DepthAt(reference.Count - 1);
        foreach (var c in members)
        {
            if (c.Ties.Count < 2) continue;
            double top = c.Signals.DepthAt(0), bottom = c.Signals.DepthAt(c.Signals.Count - 1);
            var line = TieNetwork.StraightLines(c.CoreId, unit, [.. c.Ties.OrderBy(t => t.CoreDepth)], top, bottom);
            double outside = Math.Max(0, refTop - line.ToCompositeValue(top)) + Math.Max(0, line.ToCompositeValue(bottom) - refBottom);
            if (!(outside > 0.5 * (line.ToCompositeValue(bottom) - line.ToCompositeValue(top)))) continue;
            mappings[c.CoreId] = new MappingEnsemble(line, []);
            any = true;
        }
        return any;
    }

    /// <summary>The cores carrying the composite scale above the reference's top and below its base (null where fewer than two run past it by more than 1 % of the reference, at least 2 steps).</summary>
    private readonly record struct Carriers(string? Top, string? Bottom);

    /// <summary>
    /// Per end of the reference that at least two cores' starting mappings place past it, the one
    /// placed furthest among those sharing at least <see cref="CarrierShare"/> of the longest record
    /// any of them shares with the reference: the scale there is that core's continuation
    /// (progressive alignment: the others are matched to it, it to the part the reference holds), so
    /// the rounds cannot drift there by cores matched to each other. A core alone past an end is
    /// continued by its own alignment, as at the reference scale.
    /// </summary>
    private static Carriers CarriersOf(PreparedSignals reference, IReadOnlyList<Member> members, Dictionary<string, MappingEnsemble> mappings)
    {
        double margin = Math.Max(2, 0.01 * reference.Count) * reference.Step;
        double refTop = reference.DepthAt(0), refBottom = reference.DepthAt(reference.Count - 1);
        var placed = members.Select(c =>
        {
            var map = mappings[c.CoreId].Median;
            double t = map.ToCompositeValue(c.Signals.DepthAt(0)), b = map.ToCompositeValue(c.Signals.DepthAt(c.Signals.Count - 1));
            return (c.CoreId, Top: t, Bottom: b, Shared: Math.Max(0, Math.Min(b, refBottom) - Math.Max(t, refTop)));
        }).ToList();
        var above = placed.Where(p => p.Top < refTop - margin).Select(p => new CarrierCandidate(p.CoreId, refTop - p.Top, p.Shared)).ToList();
        var below = placed.Where(p => p.Bottom > refBottom + margin).Select(p => new CarrierCandidate(p.CoreId, p.Bottom - refBottom, p.Shared)).ToList();
        return new Carriers(CarrierAmong(above), CarrierAmong(below));
    }

    /// <summary>A core placed past one end of the reference: how far past it (<paramref name="Reach"/>) and how much record it shares with the reference (<paramref name="Shared"/>), both in composite depth.</summary>
    internal readonly record struct CarrierCandidate(string CoreId, double Reach, double Shared);

    /// <summary>The carrier among the cores placed past one end (<see cref="CarriersOf"/>); null with fewer than two.</summary>
    internal static string? CarrierAmong(IReadOnlyList<CarrierCandidate> past)
    {
        if (past.Count < 2) return null;
        double longest = past.Max(p => p.Shared);
        return past.Where(p => p.Shared >= CarrierShare * longest).MaxBy(p => p.Reach).CoreId;
    }

    /// <summary>
    /// A carrier continues the scale at the long-run rate ratio it keeps over the record it shares
    /// with the reference, whose error grows with distance over the square root of that length: a
    /// core sharing a short stretch (a freeze core tied once beside a piston core spanning the
    /// reference) extrapolates a poorer ratio however far its start is placed, and placed by that
    /// same extrapolation, often furthest. Half the longest share keeps the ratio's error within
    /// about 1.4 times the best (our choice).
    /// </summary>
    private const double CarrierShare = 0.5;

    /// <summary>Each carrier's mapping past the end it carries recentred on the cores' consensus there (<see cref="ScaleContinuation.Consensus"/>).</summary>
    private static void ContinueCarriers(PreparedSignals reference, IReadOnlyList<Member> members, Dictionary<string, MappingEnsemble> mappings, Carriers carriers, DepthUnit unit, int seed = 0)
    {
        double refTop = reference.DepthAt(0), refBottom = reference.DepthAt(reference.Count - 1);
        foreach (var (carrier, below) in (ReadOnlySpan<(string?, bool)>)[(carriers.Top, false), (carriers.Bottom, true)])
        {
            if (carrier is null) continue;
            var c = members.First(m => m.CoreId == carrier);
            var cores = members.Select(m => (m.Signals, mappings[m.CoreId].Median)).ToList();
            mappings[carrier] = ScaleContinuation.Consensus(mappings[carrier], c.Signals, cores, refTop, refBottom, below, unit, seed);
        }
    }

    /// <summary>Every member of the other cores moved past each end of the reference as the carrier's member of the same index moves the scale there (<see cref="ScaleContinuation"/>); their medians taken again.</summary>
    private static void ShareScalePastReference(PreparedSignals reference, IReadOnlyList<Member> members, Dictionary<string, MappingEnsemble> mappings, Carriers carriers, DepthUnit unit)
    {
        var ends = new List<(string Carrier, ScaleContinuation Scale)>();
        if (carriers.Top is { } top && ScaleContinuation.Of(mappings[top], reference.DepthAt(0), below: false) is { } above) ends.Add((top, above));
        if (carriers.Bottom is { } bottom && ScaleContinuation.Of(mappings[bottom], reference.DepthAt(reference.Count - 1), below: true) is { } below) ends.Add((bottom, below));
        if (ends.Count == 0) return;
        foreach (var c in members)
        {
            var mine = ends.Where(x => x.Carrier != c.CoreId).Select(x => x.Scale).ToList();
            var ensemble = mappings[c.CoreId];
            if (mine.Count == 0 || ensemble.Members.Count == 0) continue;
            var moved = new DepthMapping[ensemble.Members.Count];
            for (int e = 0; e < moved.Length; e++)
            {
                moved[e] = ensemble.Members[e];
                foreach (var scale in mine) moved[e] = scale.Apply(moved[e], e);
            }
            mappings[c.CoreId] = new MappingEnsemble(DtwCoreAligner.PointwiseMedian(c.Signals, unit, moved, double.NegativeInfinity, double.PositiveInfinity), moved);
        }
    }

    /// <summary>At each end a core carries the scale past, every core's members given the scale's error a straight continuation is measured to have where their bands are narrower (<see cref="ScaleContinuation.WidenToMeasuredError"/>).</summary>
    private static void WidenScalePastReference(PreparedSignals reference, IReadOnlyList<Member> members, Dictionary<string, MappingEnsemble> mappings, Carriers carriers, int seed)
    {
        double refTop = reference.DepthAt(0), refBottom = reference.DepthAt(reference.Count - 1);
        foreach (var (carrier, below) in (ReadOnlySpan<(string?, bool)>)[(carriers.Top, false), (carriers.Bottom, true)])
        {
            if (carrier is null) continue;
            var widened = ScaleContinuation.WidenToMeasuredError([.. members.Select(m => (m.Signals, mappings[m.CoreId]))], refTop, refBottom, below, reference.Step, seed);
            for (int k = 0; k < members.Count; k++) mappings[members[k].CoreId] = widened[k];
        }
    }

    /// <summary>
    /// Every member aligned to the stack of all the others as <paramref name="mappings"/> place them
    /// (their medians); a carrier only to the part of the stack on the reference's side of the end it
    /// carries, beyond which it is continued.
    /// </summary>
    private static (MappingEnsemble Mapping, CoreAlignmentDiagnostics Diagnostics, FindingList Findings)[] Round(PreparedSignals reference, IReadOnlyList<Member> members,
        Dictionary<string, MappingEnsemble> mappings, Carriers carriers, DtwCoreOptions options, DepthUnit unit, CancellationToken ct, bool referenceAlone)
    {
        var current = mappings.ToDictionary(kv => kv.Key, kv => kv.Value.Median, StringComparer.Ordinal);
        var next = new (MappingEnsemble, CoreAlignmentDiagnostics, FindingList)[members.Count];
        Parallel.For(0, members.Count, new ParallelOptions { CancellationToken = ct }, k =>
        {
            var c = members[k];
            var others = new List<(PreparedSignals, DepthMapping)> { (reference, current[reference.CoreId]) };
            others.AddRange(members.Where(o => o.CoreId != c.CoreId).Select(o => (o.Signals, current[o.CoreId])));
            double from = c.CoreId == carriers.Top ? reference.DepthAt(0) : double.NegativeInfinity;
            double to = c.CoreId == carriers.Bottom ? reference.DepthAt(reference.Count - 1) : double.PositiveInfinity;
            var stack = Stack(reference.CoreId, reference.Signals, others, reference.Step, from, to, referenceAlone).Select(c.Signals.Signals);
            var local = new FindingList();
            using (StageTimes.Measure("align"))
            {
                // The placement decides padding at an end only where the stack already reaches past the
                // reference there (other cores matched beyond it) or the core carries the scale there.
                double margin = Math.Max(2, 0.01 * stack.Count) * stack.Step;
                var placedEnds = (c.CoreId == carriers.Top || stack.Top < reference.DepthAt(0) - margin,
                    c.CoreId == carriers.Bottom || stack.DepthAt(stack.Count - 1) > reference.DepthAt(reference.Count - 1) + margin);
                var (m, d) = DtwCoreAligner.Align(c.Signals, stack, c.Weights, c.Ties, options, unit, local, ct, current[c.CoreId], placedEnds);
                next[k] = (m, d, local);
            }
        });
        return next;
    }

    /// <summary>Takes a round's mappings; returns the <see cref="SettledPercentile"/> of the samples' shifts.</summary>
    private static double Apply(IReadOnlyList<Member> members, Dictionary<string, MappingEnsemble> mappings, Dictionary<string, CoreAlignmentDiagnostics> diagnostics,
        (MappingEnsemble Mapping, CoreAlignmentDiagnostics Diagnostics, FindingList Findings)[] next, int round)
    {
        var shifts = new List<double>();
        for (int k = 0; k < members.Count; k++)
        {
            var c = members[k];
            var old = mappings[c.CoreId].Median;
            var now = next[k].Mapping.Median;
            for (int i = 0; i < c.Signals.Count; i++)
                shifts.Add(Math.Abs(now.ToCompositeValue(c.Signals.DepthAt(i)) - old.ToCompositeValue(c.Signals.DepthAt(i))));
            mappings[c.CoreId] = next[k].Mapping;
            diagnostics[c.CoreId] = next[k].Diagnostics with { SiteRounds = round };
        }
        shifts.Sort();
        return Statistics.PercentileSorted(shifts.ToArray(), SettledPercentile);
    }

    /// <summary>
    /// Signals of <paramref name="cores"/> on the composite grid (the reference's step, spanning every
    /// core's mapped extent within <paramref name="from"/>-<paramref name="to"/>): at each row the mean, over
    /// cores reaching it, of the core's value at the core depth the mapping gives there (linear between
    /// grid rows; missing where either is). With <paramref name="referenceAlone"/>, the stack over
    /// the span of the core named <paramref name="id"/> (the reference) is that core's alone, gaps included.
    /// </summary>
    internal static PreparedSignals Stack(string id, string[] signals, IReadOnlyList<(PreparedSignals Signals, DepthMapping Map)> cores, double step,
        double from = double.NegativeInfinity, double to = double.PositiveInfinity, bool referenceAlone = false)
    {
        double top = double.PositiveInfinity, bottom = double.NegativeInfinity;
        foreach (var (s, map) in cores)
        {
            top = Math.Min(top, Math.Max(from, map.ToCompositeValue(s.DepthAt(0))));
            bottom = Math.Max(bottom, Math.Min(to, map.ToCompositeValue(s.DepthAt(s.Count - 1))));
        }
        top = Math.Floor(top / step) * step;
        int count = (int)Math.Ceiling((bottom - top) / step - 1e-9) + 1, dims = signals.Length;
        var sum = new double[count * dims];
        var n = new int[count * dims];
        var span = cores.Where(c => referenceAlone && c.Signals.CoreId == id).Select(c => (Top: c.Signals.Top, Bottom: c.Signals.DepthAt(c.Signals.Count - 1))).SingleOrDefault();
        foreach (var (s, map) in cores)
        {
            var own = s.Select(signals);
            int k0 = Math.Max(0, (int)Math.Ceiling((Math.Max(from, map.ToCompositeValue(s.DepthAt(0))) - top) / step - 1e-9));
            int k1 = Math.Min(count - 1, (int)Math.Floor((Math.Min(to, map.ToCompositeValue(s.DepthAt(s.Count - 1))) - top) / step + 1e-9));
            for (int k = k0; k <= k1; k++)
            {
                if (referenceAlone && s.CoreId != id && top + k * step >= span.Top && top + k * step <= span.Bottom) continue;
                double r = (map.ToCoreValue(top + k * step) - s.Top) / s.Step;
                int i0 = Math.Clamp((int)Math.Floor(r), 0, s.Count - 1), i1 = Math.Min(i0 + 1, s.Count - 1);
                double f = Math.Clamp(r - i0, 0, 1);
                for (int d = 0; d < dims; d++)
                {
                    double v = own.Value(i0, d) * (1 - f) + own.Value(i1, d) * f;
                    if (double.IsNaN(v)) continue;
                    sum[k * dims + d] += v;
                    n[k * dims + d]++;
                }
            }
        }
        // Rows no core has data at (a disturbed top, a gap at an end) are left off, so a core whose end
        // is closed is matched to the first (last) recorded row rather than to missing cells above it.
        int first = 0, last = count - 1;
        while (first < last && !Recorded(first)) first++;
        while (last > first && !Recorded(last)) last--;
        var values = new double[(last - first + 1) * dims];
        for (int x = 0; x < values.Length; x++)
        {
            int at = first * dims + x;
            values[x] = n[at] > 0 ? sum[at] / n[at] : double.NaN;
        }
        return new PreparedSignals(id, top + first * step, step, last - first + 1, signals, values);

        bool Recorded(int row)
        {
            for (int d = 0; d < dims; d++) if (n[row * dims + d] > 0) return true;
            return false;
        }
    }
}
