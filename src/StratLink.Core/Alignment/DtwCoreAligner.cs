using StratLink.Checks;
using StratLink.Quantities;
using StratLink.Workflows;

namespace StratLink.Alignment;

/// <summary>
/// Aligns one core to the reference by dynamic time warping on prepared signals (rows = core grid,
/// columns = reference grid, same step), with marker ties as hard constraints and an ensemble of
/// paths drawn from the path posterior.
/// <para>
/// Band: a Sakoe-Chiba band of half-width window x (longer core) cells, laid around the
/// straight-line-ties mapping (piecewise linear through the ties, mean tie rate beyond them), so
/// cores of different length and accumulation rate keep the likely path inside it.
/// Ties: each tie pinches the band to a box of +/- its depth uncertainty; a tie known to the grid
/// step (box of one cell) cuts the lattice into independent segments, solved in parallel.
/// </para>
/// <para>
/// Ensemble temperature: with the local cost read as a negative log-likelihood, P(path) ~ exp(-C / T).
/// T is estimated from the optimal path's residuals (its local costs): T0 = distance / path cells is
/// the maximum-likelihood scale if those costs were independent exponential variables (for one
/// signal, |a - b| of Laplace-distributed misfits); neighbouring grid cells are not independent
/// (signals are smooth and oversampled), so T0 is multiplied by the integrated autocorrelation time
/// tau = 1 + 2 sum_k rho_k of the residual series (sum stopped at the first non-positive rho_k,
/// Geyer's initial positive sequence), which counts each independent piece of evidence once.
/// Each sampled path is then read no more finely than its cells and the records' sampling resolve
/// (<see cref="MatchResolution"/>).
/// </para>
/// <para>
/// Aligned to a stack of other cores (site rounds), a <c>placement</c> (the core's mapping from the
/// previous round) also decides where the stack is padded (<see cref="CoreOverhang.Of"/>) at the ends
/// named by <c>placedEnds</c>.
/// </para>
/// </summary>
public static class DtwCoreAligner
{
    public static (MappingEnsemble Mapping, CoreAlignmentDiagnostics Diagnostics) Align(
        PreparedSignals core, PreparedSignals reference, double[] weights, IReadOnlyList<TiePoint> ties,
        DtwCoreOptions options, DepthUnit unit, FindingList findings, CancellationToken ct = default, DepthMapping? placement = null, (bool Top, bool Bottom)? placedEnds = null)
    {
        if (core.Signals.Length != weights.Length || reference.Signals.Length != weights.Length)
            throw new ArgumentException("Core, reference and weights must have the same signals.");
        if (Math.Abs(core.Step - reference.Step) > 1e-9 * core.Step) throw new ArgumentException("Core and reference must share one grid step.");
        var overhang = CoreOverhang.Of(core, reference, ties, options.Window, unit, placement, placedEnds);
        var unpadded = reference;
        int recorded0 = overhang.Top, recorded1 = overhang.Top + reference.Count - 1;
        if (overhang.Any) reference = overhang.Pad(reference);
        int n = core.Count, m = reference.Count;
        var boxes = TieBoxes(core, reference, ties, findings);
        var resolution = new MatchResolution(core, unpadded, boxes.Select(b => core.DepthAt(b.I)));
        options = ResolveOpenEnds(options, boxes, n, m, unit, overhang);
        var centre = CentreLine(boxes, n, m, options, unit, overhang, againstStack: placement is not null);
        (core, reference) = StandardiseOverOverlap(core, reference, centre, recorded0, recorded1, options.RobustStandardise);
        var cost = new SignalCost(core.Values, reference.Values, weights, 0);
        double neutral = NeutralCost(cost, centre, n, m);
        cost = cost.WithNeutral(neutral);
        // Unmatched reference at an open end costs what matching it typically would, per unit of
        // pattern weight a reference column carries (none under N-normalised patterns).
        double completion = options.Pattern.Normalisation == StepNormalisation.N ? 0 : neutral;
        var band = BuildBand(centre, boxes, n, m, options);
        var segments = Segments(boxes, n, m, options);

        // Pass 1: optimal path per segment (independent given the exact ties).
        var optimal = new DtwPath[segments.Count];
        var directions = new StepDirections[segments.Count];
        var slices = new Band[segments.Count];
        var parallel = new ParallelOptions { CancellationToken = ct };
        void SolveSegments(double completionCost) => Parallel.For(0, segments.Count, parallel, s =>
        {
            var g = segments[s];
            slices[s] = band.Slice(g.R0, g.R1, g.C0, g.C1);
            try
            {
                var (path, dirs) = DtwSolver.SolveKeepingDirections(cost.At(g.R0, g.C0), options.Pattern, slices[s], g.Options(options, completionCost), ct);
                optimal[s] = path;
                if (options.RatePenalty > 0) directions[s] = dirs;
                else dirs.Dispose();
            }
            catch (InvalidOperationException e)
            {
                throw new InvalidOperationException($"Core {core.CoreId}, depths {core.DepthAt(g.R0):0.###}-{core.DepthAt(g.R1):0.###}: {e.Message}", e);
            }
        });
        SolveSegments(completion);
        bool open = completion > 0 && (options.OpenBegin == true || options.OpenEnd == true);
        if (open || overhang.Any)
        {
            // Where the path runs through padding beyond the reference, those cells cost the neutral
            // level and would raise the path's mean: take the mean over the cells it compares.
            double matched = ComparedMean(cost, optimal, segments);
            if (open)
            {
                // The neutral level (median cost along the straight-line-ties mapping) exceeds what a good
                // match costs, so unmatched reference would look dear and the path would run along it;
                // solve again with the cost per unit weight of the path just found.
                double weight = 0;
                for (int s = 0; s < segments.Count; s++)
                    weight += options.Pattern.Normalisation == StepNormalisation.NPlusM ? optimal[s].I[^1] - optimal[s].I[0] + optimal[s].J[^1] - optimal[s].J[0] + 2 : optimal[s].Length;
                completion = Math.Min(completion, overhang.Any ? matched : optimal.Sum(p => p.Distance) / weight);
            }
            // For the same reason, padding at the neutral level would cost more per row than running
            // the core's rows down the reference's last recorded column (a squeeze onto its base):
            // padded cells cost what the path's matches cost, so the path leaves where they stop.
            if (overhang.Any && matched < cost.Neutral) cost = cost.WithNeutral(matched);
            SolveSegments(completion);
        }

        var (pathI, pathJ) = Join(optimal, segments);
        double distance = optimal.Sum(p => p.Distance);
        double meanCost = distance / pathI.Length;
        double tau = AutocorrelationTime(cost, pathI, pathJ);
        double temperature = Math.Max(meanCost * tau, 1e-12);
        var forced = segments.Skip(1).Select(g => (g.R0, g.C0)).ToArray();
        var optimalMapping = ToMapping(core, reference, cost, unit, pathI, pathJ, forced);
        EndExtension? ends = null;
        if (overhang.Any)
        {
            ends = EndExtension.Measure(optimalMapping, core.DepthAt(0), core.DepthAt(n - 1), core.Step, overhang, ties);
            optimalMapping = ends.Apply(optimalMapping, null);
        }
        var diagnostics = new CoreAlignmentDiagnostics
        {
            CoreId = core.CoreId,
            Method = "dtw",
            Ties = boxes.Count,
            Segments = segments.Count,
            BandCells = slices.Sum(b => b.Cells),
            Distance = distance,
            MeanCost = meanCost,
            AutocorrelationCells = tau,
            Temperature = temperature,
            Seed = options.Seed,
            OpenBegin = options.OpenBegin == true,
            OpenEnd = options.OpenEnd == true,
            Optimal = optimalMapping,
        };
        if (options.Ensemble == 0) return (new MappingEnsemble(optimalMapping, []), diagnostics);

        // Pass 2: the posterior per segment and its sampled pieces; member e joins piece e of every segment.
        using var ensembleStage = StageTimes.Measure("ensemble");
        var pieces = new (int[] I, int[] J)[segments.Count][];
        Parallel.For(0, segments.Count, parallel, s =>
        {
            var g = segments[s];
            var o = g.Options(options, completion);
            double endBias = o.OpenEnd ? completion / temperature : 0; // the completion cost of the columns left after the end
            var lattice = o.OpenBegin || o.OpenEnd || overhang.Any
                ? NearOptimalWhereUnmatched(slices[s], optimal[s], (int)Math.Ceiling(tau), o.OpenBegin, o.OpenEnd, recorded0 - g.C0, recorded1 - g.C0)
                : slices[s];
            using var sampler = new PathSampler<SignalCost>(cost.At(g.R0, g.C0), options.Pattern, lattice, o, temperature, directions[s], endBias, ct);
            var rng = new Random(Seeds.Derive(options.Seed, core.CoreId, s));
            var drawn = new (int[] I, int[] J)[options.Ensemble];
            for (int e = 0; e < drawn.Length; e++)
            {
                var (pi, pj) = sampler.Sample(rng);
                for (int k = 0; k < pi.Length; k++) { pi[k] += g.R0; pj[k] += g.C0; }
                drawn[e] = (pi, pj);
            }
            pieces[s] = drawn;
        });
        var members = new DepthMapping[options.Ensemble];
        var aligned = new DepthMapping[options.Ensemble];
        Parallel.For(0, members.Length, parallel, e =>
        {
            var (mi, mj) = Join(pieces.Select(p => p[e]).ToArray());
            members[e] = aligned[e] = resolution.Spread(ToMapping(core, reference, cost, unit, mi, mj, forced), new Random(Seeds.Derive(options.Seed, core.CoreId + "/cell", e)));
            if (ends is not null) members[e] = ends.Apply(members[e], new Random(Seeds.Derive(options.Seed, core.CoreId + "/ends", e)));
        });
        if (ends is null) return (new MappingEnsemble(PointwiseMedian(core, unit, members, double.NegativeInfinity, double.PositiveInfinity, optimalMapping), members), diagnostics);
        // Past the matched ends the median is the continuation of the members' median, not the
        // median of their random continuations: those are drawn around that same continuation, and
        // a band tens of cm wide would leave a few hundred members' median off it by a cm or more.
        var (top, bottom) = ends.MatchedSpan(aligned);
        return (new MappingEnsemble(ends.Apply(PointwiseMedian(core, unit, members, top, bottom, optimalMapping), null), members), diagnostics);
    }

    /// <summary>
    /// The band cut, where nothing is matched, to the optimal path's cells widened by
    /// <paramref name="cells"/> (one autocorrelation time, the scale of independent evidence) either
    /// side: in an open first (last) row, in the padding beyond the reference's recorded columns
    /// <paramref name="recorded0"/>-<paramref name="recorded1"/> (band columns), and below the record
    /// in the rows where the optimal path runs in the padding. Sampled at a
    /// temperature, a path drifts into a stretch where every path costs alike: the unmatched
    /// reference before an open end has one way of being skipped but many of being matched, and the
    /// padding many ways of being crossed, so paths that spend cells there outnumber those that do
    /// not whatever the cost (the entropy term of a free energy). The optimal path has no such count
    /// and places the ends and the exit from the record well; the ensemble keeps near it there.
    /// </summary>
    private static Band NearOptimalWhereUnmatched(Band band, DtwPath path, int cells, bool openBegin, bool openEnd, int recorded0, int recorded1)
    {
        int rows = band.Rows;
        var lo = band.Lo.ToArray();
        var hi = band.Hi.ToArray();
        var first = new int[rows];
        var last = new int[rows];
        Array.Fill(first, int.MaxValue);
        Array.Fill(last, int.MinValue);
        for (int k = 0; k < path.Length; k++)
        {
            first[path.I[k]] = Math.Min(first[path.I[k]], path.J[k]);
            last[path.I[k]] = Math.Max(last[path.I[k]], path.J[k]);
        }
        for (int i = 0; i < rows; i++)
        {
            if (first[i] > last[i]) continue;
            if (lo[i] < recorded0) lo[i] = Math.Max(lo[i], Math.Min(recorded0, first[i] - cells));
            if (hi[i] > recorded1) hi[i] = Math.Min(hi[i], Math.Max(recorded1, last[i] + cells));
            // Cut on the padding's side alone, the lattice below the record would be a strip about
            // the optimal path against the whole band inside the record: members would outnumber it
            // by lagging there, squeezing the core's rows onto the reference's last columns.
            if (first[i] > recorded1) lo[i] = Math.Max(lo[i], first[i] - cells);
        }
        if (openBegin && first[0] <= last[0]) (lo[0], hi[0]) = (Math.Max(lo[0], Math.Min(first[0], path.J[0] - cells)), Math.Min(hi[0], Math.Max(last[0], path.J[0] + cells)));
        if (openEnd && first[^1] <= last[^1]) (lo[^1], hi[^1]) = (Math.Max(lo[^1], Math.Min(first[^1], path.J[^1] - cells)), Math.Min(hi[^1], Math.Max(last[^1], path.J[^1] + cells)));
        return new Band(band.Columns, lo, hi);
    }

    private readonly record struct TieBox(int I, int J, int K);

    private readonly record struct Segment(int R0, int C0, int R1, int C1, bool OpenBegin, bool OpenEnd)
    {
        public DtwOptions Options(DtwCoreOptions o, double completion) =>
            new() { OpenBegin = OpenBegin, OpenEnd = OpenEnd, StrictBand = true, RatePenalty = o.RatePenalty, CompletionCostPerColumn = completion };
    }

    private static List<TieBox> TieBoxes(PreparedSignals core, PreparedSignals reference, IReadOnlyList<TiePoint> ties, FindingList findings)
    {
        var boxes = new List<TieBox>();
        foreach (var t in ties.OrderBy(t => t.CoreDepth))
        {
            int ti = core.RowNearest(t.CoreDepth), tj = reference.RowNearest(t.CompositeDepth);
            int k = (int)Math.Round(t.Uncertainty / core.Step, MidpointRounding.AwayFromZero);
            string? problem = null;
            if (ti < 0 || ti >= core.Count || tj < 0 || tj >= reference.Count) problem = "lies outside the aligned records";
            else if (boxes.Count > 0 && (ti - k <= boxes[^1].I + boxes[^1].K || tj - k <= boxes[^1].J + boxes[^1].K))
                problem = "overlaps the previous tie within their uncertainties at this grid step";
            if (problem is null) { boxes.Add(new TieBox(ti, tj, k)); continue; }
            findings.Add(new Finding
            {
                Severity = Severity.Warning,
                Code = "alignment.tie-unused",
                Core = core.CoreId,
                Item = t.Marker,
                Depth = t.CoreDepth,
                Message = $"marker {t.Marker} at {t.CoreDepth:0.###} (composite {t.CompositeDepth:0.###}) {problem}; the alignment does not use it",
            });
        }
        return boxes;
    }

    /// <summary>
    /// Auto open ends: a core whose ties place its top (bottom) more than 1% of the reference's
    /// length inside the reference has lost that part (or is shorter); without ties, ends are closed.
    /// An end the reference was padded at is closed at the padded corner: there the reference's own
    /// end lies inside the core, so all of the recorded reference is to be matched and the core is
    /// the one left over. Any path through the padding costs the same (the neutral level per unit of
    /// weight), so the path leaves the record where the signals stop matching; left open, each padded
    /// column skipped would cost the (lower) completion cost instead, and the path would squeeze the
    /// core's rows onto the last recorded columns to skip them.
    /// </summary>
    private static DtwCoreOptions ResolveOpenEnds(DtwCoreOptions o, List<TieBox> boxes, int n, int m, DepthUnit unit, CoreOverhang overhang)
    {
        if (o.OpenBegin is not null && o.OpenEnd is not null) return o;
        bool begin = false, end = false;
        if (boxes.Count > 0)
        {
            var line = TieNetwork.StraightLines("grid", unit, boxes.Select(b => new TiePoint("", b.I, b.J, 0, "")).ToList(), 0, n - 1);
            double margin = Math.Max(2, 0.01 * m);
            begin = overhang.Top == 0 && line.ToCompositeValue(0) > margin;
            end = overhang.Bottom == 0 && line.ToCompositeValue(n - 1) < m - 1 - margin;
        }
        return o with { OpenBegin = o.OpenBegin ?? begin, OpenEnd = o.OpenEnd ?? end };
    }

    /// <summary>
    /// The straight-line-ties mapping in grid cells (row to column); the corners join it at closed
    /// ends. Against a stack (<paramref name="againstStack"/>, site rounds) an end padded from the
    /// core's placement joins where the placement puts it, inside the padding's slack, not the padded
    /// corner: the slack (a band half-width) would otherwise tilt the line and, with the other end
    /// open, the ratio it is continued at beyond the last tie there. Elsewhere the corners are kept.
    /// </summary>
    private static DepthMapping CentreLine(List<TieBox> boxes, int n, int m, DtwCoreOptions o, DepthUnit unit, CoreOverhang overhang, bool againstStack)
    {
        int top = againstStack ? overhang.TopSlack : 0, bottom = againstStack ? overhang.BottomSlack : 0;
        var knots = boxes.Select(b => new TiePoint("", b.I, b.J, 0, "")).ToList();
        if (o.OpenBegin != true || knots.Count == 0) knots.Insert(0, new TiePoint("", 0, top, 0, ""));
        // Against a stack, a single tie with both ends open gives no rate ratio: the line runs through
        // it at ratio 1 (as between cores of one basin with similar rates), not to the far corner,
        // which over a long stack would lay the band of a short core across all of it.
        if (o.OpenEnd != true || knots.Count < 2 && (boxes.Count == 0 || !againstStack)) knots.Add(new TiePoint("", n - 1, m - 1 - bottom, 0, ""));
        knots = knots.DistinctBy(k => k.CoreDepth).ToList();
        return TieNetwork.StraightLines("grid", unit, knots, 0, n - 1);
    }

    /// <summary>
    /// Both records standardised again over the part they are expected to share: the reference over
    /// the columns the straight-line-ties mapping reaches from the core, the core over the rows it maps
    /// inside the reference. Each core was standardised over its own whole length, so a short core
    /// (a freeze core of the top few hundred years) and a long reference would otherwise differ in
    /// level and spread wherever the reference's long-term trend moves its whole-core mean away from
    /// the shared interval's, and the path would slide to chase that offset.
    /// </summary>
    private static (PreparedSignals Core, PreparedSignals Reference) StandardiseOverOverlap(PreparedSignals core, PreparedSignals reference, DepthMapping centre,
        int recorded0, int recorded1, bool robust)
    {
        int n = core.Count;
        double c0 = centre.ToCompositeValue(0), c1 = centre.ToCompositeValue(n - 1);
        int j0 = Math.Clamp((int)Math.Floor(Math.Min(c0, c1)), recorded0, recorded1), j1 = Math.Clamp((int)Math.Ceiling(Math.Max(c0, c1)), recorded0, recorded1);
        int i0 = 0, i1 = n - 1;
        while (i0 < n - 1 && centre.ToCompositeValue(i0) < recorded0) i0++;
        while (i1 > i0 && centre.ToCompositeValue(i1) > recorded1) i1--;
        if (j0 > recorded0 || j1 < recorded1) reference = SignalPreparation.StandardiseOver(reference, j0, j1, robust);
        if (i0 > 0 || i1 < n - 1) core = SignalPreparation.StandardiseOver(core, i0, i1, robust);
        return (core, reference);
    }

    /// <summary>
    /// Cost of a cell with nothing to compare: the median local cost along the straight-line-ties
    /// mapping, a level typical of plausible matches, so a gap neither attracts nor repels the path.
    /// </summary>
    private static double NeutralCost(SignalCost cost, DepthMapping centre, int n, int m)
    {
        var values = new List<double>();
        int stride = Math.Max(1, n / 2000);
        for (int i = 0; i < n; i += stride)
        {
            int j = Math.Clamp((int)Math.Round(centre.ToCompositeValue(i)), 0, m - 1);
            if (!cost.IsMissing(i, j)) values.Add(cost.Cost(i, j));
        }
        if (values.Count == 0) return 1;
        values.Sort();
        return Statistics.PercentileSorted(values.ToArray(), 50);
    }

    private static Band BuildBand(DepthMapping centre, List<TieBox> boxes, int n, int m, DtwCoreOptions o)
    {
        int w = Math.Max(1, (int)Math.Ceiling(o.Window * Math.Max(n, m)));
        var lo = new int[n];
        var hi = new int[n];
        var pinned = new bool[n];
        for (int i = 0; i < n; i++)
        {
            double c = centre.ToCompositeValue(i);
            lo[i] = Math.Clamp((int)Math.Floor(c) - w, 0, m - 1);
            hi[i] = Math.Clamp((int)Math.Ceiling(c) + w, 0, m - 1);
        }
        if (o.OpenBegin != true) lo[0] = 0;
        if (o.OpenEnd != true) hi[n - 1] = m - 1;
        foreach (var b in boxes)
        {
            int j0 = Math.Max(0, b.J - b.K), j1 = Math.Min(m - 1, b.J + b.K);
            for (int i = Math.Max(0, b.I - b.K); i <= Math.Min(n - 1, b.I + b.K); i++)
            {
                lo[i] = Math.Max(lo[i], j0);
                hi[i] = Math.Min(hi[i], j1);
                if (lo[i] > hi[i]) { lo[i] = j0; hi[i] = j1; }
                pinned[i] = true;
            }
        }
        // Keep consecutive rows connected (a path moves at most one column between rows).
        for (int i = 1; i < n; i++)
        {
            if (lo[i] > hi[i - 1] + 1)
            {
                if (!pinned[i - 1]) hi[i - 1] = lo[i] - 1;
                else if (!pinned[i]) lo[i] = hi[i - 1] + 1;
            }
            if (hi[i] < lo[i - 1])
            {
                if (!pinned[i]) hi[i] = lo[i - 1];
                else if (!pinned[i - 1]) lo[i - 1] = hi[i];
            }
        }
        return new Band(m, lo, hi);
    }

    private static List<Segment> Segments(List<TieBox> boxes, int n, int m, DtwCoreOptions o)
    {
        var segs = new List<Segment>();
        int r0 = 0, c0 = 0;
        foreach (var b in boxes.Where(b => b.K == 0))
        {
            if (b.I == r0 && b.J == c0) continue;
            segs.Add(new Segment(r0, c0, b.I, b.J, segs.Count == 0 && o.OpenBegin == true, false));
            (r0, c0) = (b.I, b.J);
        }
        segs.Add(new Segment(r0, c0, n - 1, m - 1, segs.Count == 0 && o.OpenBegin == true, o.OpenEnd == true));
        return segs;
    }

    private static (int[] I, int[] J) Join(DtwPath[] paths, List<Segment> segs) =>
        Join(paths.Select((p, s) => (p.I.Select(i => i + segs[s].R0).ToArray(), p.J.Select(j => j + segs[s].C0).ToArray())).ToArray());

    /// <summary>Segment paths end to end; the junction cell, shared by two segments, is kept once.</summary>
    private static (int[] I, int[] J) Join((int[] I, int[] J)[] parts)
    {
        var ri = new List<int>();
        var rj = new List<int>();
        foreach (var (pi, pj) in parts)
        {
            int start = ri.Count > 0 && pi.Length > 0 && ri[^1] == pi[0] && rj[^1] == pj[0] ? 1 : 0;
            for (int k = start; k < pi.Length; k++) { ri.Add(pi[k]); rj.Add(pj[k]); }
        }
        return ([.. ri], [.. rj]);
    }

    /// <summary>Mean local cost over the cells of the segment paths where both sides have data.</summary>
    private static double ComparedMean(SignalCost cost, DtwPath[] paths, List<Segment> segs)
    {
        double sum = 0;
        int count = 0;
        for (int s = 0; s < paths.Length; s++)
            for (int k = 0; k < paths[s].Length; k++)
            {
                int i = paths[s].I[k] + segs[s].R0, j = paths[s].J[k] + segs[s].C0;
                if (cost.IsMissing(i, j)) continue;
                sum += cost.Cost(i, j);
                count++;
            }
        return count > 0 ? sum / count : cost.Neutral;
    }

    /// <summary>Integrated autocorrelation time of the local costs along a path (cells where both sides have data).</summary>
    internal static double AutocorrelationTime(SignalCost cost, int[] pi, int[] pj)
    {
        var r = new List<double>(pi.Length);
        for (int k = 0; k < pi.Length; k++)
            if (!cost.IsMissing(pi[k], pj[k])) r.Add(cost.Cost(pi[k], pj[k]));
        int n = r.Count;
        if (n < 4) return 1;
        double mean = r.Average();
        double c0 = 0;
        foreach (double v in r) c0 += (v - mean) * (v - mean);
        if (!(c0 > 0)) return 1;
        double tau = 1;
        for (int lag = 1; lag < n / 2; lag++)
        {
            double c = 0;
            for (int k = 0; k + lag < n; k++) c += (r[k] - mean) * (r[k + lag] - mean);
            double rho = c / c0;
            if (rho <= 0) break;
            tau += 2 * rho;
        }
        return tau;
    }

    /// <summary>
    /// A path as a depth mapping: each core row maps to the mean reference column it is matched
    /// with. Rows with nothing compared on the path (gaps, disturbed intervals) give no knot, so
    /// the mapping crosses them in a straight line; tie cells always give theirs.
    /// </summary>
    private static DepthMapping ToMapping(PreparedSignals core, PreparedSignals reference, SignalCost cost, DepthUnit unit, int[] pi, int[] pj, (int I, int J)[] forced)
    {
        int n = core.Count;
        var sum = new double[n];
        var cnt = new int[n];
        for (int k = 0; k < pi.Length; k++)
        {
            if (cost.IsMissing(pi[k], pj[k])) continue;
            sum[pi[k]] += pj[k];
            cnt[pi[k]]++;
        }
        foreach (var (fi, fj) in forced) { sum[fi] = fj; cnt[fi] = 1; }
        var x = new List<double>();
        var y = new List<double>();
        for (int i = 0; i < n; i++)
        {
            if (cnt[i] == 0) continue;
            x.Add(core.DepthAt(i));
            y.Add(reference.DepthAt(0) + sum[i] / cnt[i] * reference.Step);
        }
        if (x.Count < 2)
        {
            // Nothing compared anywhere: the path's end points are all there is.
            x = [core.DepthAt(pi[0]), core.DepthAt(pi[^1])];
            y = [reference.DepthAt(pj[0]), reference.DepthAt(pj[^1])];
            if (x[1] <= x[0]) { x[1] = x[0] + core.Step; y[1] = y[0] + reference.Step; }
        }
        return Thin(core.CoreId, unit, x, y);
    }

    /// <summary>
    /// The members' median at every grid row from <paramref name="top"/> to <paramref name="bottom"/> (all rows where that leaves fewer than two).
    /// With <paramref name="mode"/> (the optimal path: the posterior's mode), at a row where the members
    /// form several modes (<see cref="PosteriorModes"/>) the median is that of the mode holding it, and the
    /// rows are then made monotone again by pool-adjacent-violators (the least-squares monotone fit).
    /// </summary>
    internal static DepthMapping PointwiseMedian(PreparedSignals core, DepthUnit unit, DepthMapping[] members, double top, double bottom, DepthMapping? mode = null)
    {
        int first = 0, last = core.Count - 1;
        while (first < last && core.DepthAt(first) < top) first++;
        while (last > first && core.DepthAt(last) > bottom) last--;
        if (last - first < 1) (first, last) = (0, core.Count - 1);
        int count = last - first + 1;
        var x = new double[count];
        var y = new double[count];
        Parallel.For(0, (count + 1023) / 1024, chunk =>
        {
            var v = new double[members.Length];
            for (int i = chunk * 1024; i < Math.Min(count, (chunk + 1) * 1024); i++)
            {
                double z = core.DepthAt(first + i);
                for (int e = 0; e < v.Length; e++) v[e] = members[e].ToCompositeValue(z);
                Array.Sort(v);
                x[i] = z;
                y[i] = mode is null ? Statistics.PercentileSorted(v, 50) : PosteriorModes.MedianOfModeHolding(v, mode.ToCompositeValue(z));
            }
        });
        if (mode is not null) AgeModelling.StratigraphicOrder.Pool([.. Enumerable.Range(0, y.Length)], y, [.. Enumerable.Repeat(1.0, y.Length)]);
        return Thin(core.CoreId, unit, [.. x], [.. y]);
    }

    /// <summary>Drops knots that lie on the line through their neighbours (long runs at one rate).</summary>
    private static DepthMapping Thin(string coreId, DepthUnit unit, List<double> x, List<double> y)
    {
        var kx = new List<double> { x[0] };
        var ky = new List<double> { y[0] };
        for (int k = 1; k < x.Count - 1; k++)
        {
            double predicted = ky[^1] + (y[k + 1] - ky[^1]) * (x[k] - kx[^1]) / (x[k + 1] - kx[^1]);
            if (Math.Abs(predicted - y[k]) <= 1e-9 * Math.Max(1, Math.Abs(y[k]))) continue;
            kx.Add(x[k]);
            ky.Add(y[k]);
        }
        if (x.Count > 1) { kx.Add(x[^1]); ky.Add(y[^1]); }
        return new DepthMapping(coreId, unit, [.. kx], [.. ky]);
    }
}
