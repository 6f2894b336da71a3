using System.Collections.Immutable;
using System.Globalization;
using MathNet.Numerics.Statistics;
using StratLink.AgeModelling.Calibration;
using StratLink.Alignment;
using StratLink.Checks;
using StratLink.Compositing;
using StratLink.Model;
using StratLink.Quantities;
using StratLink.Workflows;

namespace StratLink.AgeModelling;

/// <summary>
/// Monte Carlo age-depth modelling on the composite depth scale (Bennett 1994, The Holocene 4:337-348;
/// Blaauw 2010, Quaternary Geochronology 5:512-518). In iteration i every core's depths go to composite
/// depth through member i of its alignment ensemble, so correlation uncertainty enters the ages; every
/// control's age is drawn from its full distribution (inverse CDF of the calibrated density; normal for
/// calendar ages; anchor and systematic counting error for varves); and the ages are interpolated. Unless the
/// project's <c>rate_variability</c> is 0, the accumulation rate then takes a bridged random walk between and
/// beyond the controls (<see cref="RateWalk"/>), so the ranges between controls allow for the rate changing.
/// <para>
/// Stratigraphic order is kept by rejection: an iteration redraws all control ages until no age decreases
/// with depth, up to <see cref="MaxOrderAttempts"/> times, each from the iteration's own random streams. When
/// no ordered draw is found the last draw is put in order by weighted isotonic regression (pooling, weights
/// 1/sigma^2) and the iteration is counted in <see cref="AgeModelResult.OrderForcedIterations"/> with a warning.
/// </para>
/// <para>
/// Contradicted controls: in each iteration the first, unconstrained draw of each control is compared with
/// the others in use. The share of iterations in which it is out of order with at least one of them is its
/// <see cref="AgeControlSummary.ContradictionShare"/>; a control is flagged at <see cref="FlagShare"/> or more
/// when its leave-one-out |z| is also at least <see cref="FlagZ"/>. Order alone
/// cannot tell which of two conflicting controls is wrong, so both are flagged; the leave-one-out z-score
/// (<see cref="AgeControlSummary.LeaveOneOutZ"/>: the control's draw against the age the other controls give at
/// its depth by linear interpolation, mean over sd of the difference) says which one the rest disagree with more.
/// Controls set <c>exclude: true</c> are summarised and measured the same way but not used.
/// </para>
/// </summary>
public static class AgeModeller
{
    public const int MaxOrderAttempts = 100;
    public const double FlagShare = 0.5;

    /// <summary>
    /// Flagging also needs the control to disagree with the others' interpolated age by this many standard
    /// deviations: a precise age inside a densely counted varve run is "out of order" with some varve in most
    /// unconstrained draws even when the two agree.
    /// </summary>
    public const double FlagZ = 2.0;

    /// <summary>Samples per unit of parallel work when summarising ages.</summary>
    private const int SampleBlock = 64;

    /// <summary>
    /// Runs the age model. <paramref name="varveLayers"/> maps a varve-count control's id to its varve tops and
    /// bottoms (project unit, one entry a varve), loaded from the control's table by the caller.
    /// </summary>
    public static AgeModelResult Run(LoadedProject project, AlignmentResult alignment,
        IReadOnlyDictionary<string, (double[] Tops, double[] Bottoms)> varveLayers,
        IProgress<WorkProgress>? progress, CancellationToken ct)
    {
        var p = project.Project;
        var unit = p.DepthUnit;
        int seed = p.AgeModel.Seed;
        int iterations = Math.Max(1, p.AgeModel.Iterations);
        var interpolation = AgeInterpolations.Parse(p.AgeModel.Interpolation);
        double step = p.Composite.Step > 0 ? p.Composite.Step : 1;
        var findings = new FindingList();

        // Prepare every control; keep the problem of those that cannot be used.
        var specs = p.Ages;
        var prepared = new PreparedControl?[specs.Count];
        var problemOf = new string?[specs.Count];
        for (int c = 0; c < specs.Count; c++)
        {
            var localProblems = new FindingList();
            prepared[c] = Prepare(project, alignment, varveLayers, specs[c], localProblems, out problemOf[c]);
            findings.AddRange(localProblems);
        }
        int[] active = Enumerable.Range(0, specs.Count).Where(c => prepared[c] is not null && !specs[c].Exclude).ToArray();
        int[] measured = Enumerable.Range(0, specs.Count).Where(c => prepared[c] is not null).ToArray();
        NoteAgesAfterCoring(p, findings);
        foreach (int c in Enumerable.Range(0, specs.Count).Where(c => specs[c].Exclude))
            findings.Add(Finding.Note(AgeModelCodes.Excluded, $"age control {specs[c].Id} is excluded by the project file (exclude: true): listed, not used.") with { Item = specs[c].Id });

        int distinctPoints = active.SelectMany(c => prepared[c]!.PointCores.Zip(prepared[c]!.PointDepths)).Distinct().Count();
        if (distinctPoints < 2)
        {
            // A project without any age control asks for alignment and composite only: nothing failed.
            findings.Add(specs.Count == 0
                ? Finding.Note(AgeModelCodes.NoControls, "the project has no age controls: the alignment and the composite are built on depth alone, without ages.")
                : Finding.Error(AgeModelCodes.TooFewControls,
                    $"the age model needs at least two usable age controls at different depths; found {distinctPoints} usable point(s) from {active.Length} control(s)."));
            var empty = Summaries(specs, prepared, problemOf, [], [], iterations, null, [], []);
            return new AgeModelResult(seed, interpolation, unit, [], empty, new Dictionary<string, AgeSeries>(), null, 0, findings);
        }

        var scales = Scales(project, alignment);
        int backbone = Backbone(prepared, active);
        var placements = new (double Depth, double Spread)[specs.Count];
        foreach (int c in active) placements[c] = Placement(prepared[c]!, alignment, scales);
        RateWalk? walk = null;
        if (p.AgeModel.RateVariability > 0)
        {
            var (top, bottom) = QueryExtent(project, alignment, iterations, prepared, active, scales);
            walk = new RateWalk(p.AgeModel.RateVariability, step, top - step, bottom + step);
        }

        // No member's age is younger than the site's last coring: above that age it has no sediment.
        double youngestBP = p.Cores.Max(c => c.CoringYear) is int lastCoring ? CalendarAge.FromYearCE(lastCoring).YearsBP : double.NegativeInfinity;
        var draws = new IterationDraws(specs.Count, iterations);
        var proposals = new AgeDepthCurve[iterations];
        var logWeights = new double[iterations];
        int done = 0, forced = 0;
        var options = new ParallelOptions { CancellationToken = ct };
        Parallel.For(0, iterations, options, () => new IterationBuffers(prepared, active, measured), (i, _, buffers) =>
        {
            (proposals[i], logWeights[i]) = Iterate(i, seed, prepared, active, measured, backbone, placements, alignment, scales, interpolation, walk, youngestBP, buffers, draws, ref forced);
            int d = Interlocked.Increment(ref done);
            if (progress is not null && (d % Math.Max(1, iterations / 100) == 0 || d == iterations))
                progress.Report(new WorkProgress("age model: iterations", d / (double)iterations));
            return buffers;
        }, _ => { });

        var weights = Normalised(logWeights);
        var source = Resample(weights, SeedStreams.Derive(seed, iterations, specs.Count + 1));
        var curves = source.Select(k => proposals[k]).ToArray();
        double ess = EffectiveSize(weights);
        if (backbone >= 0)
            findings.Add((ess < Math.Min(100, iterations / 4.0) ? Finding.Warning(AgeModelCodes.FewEffective,
                    $"the age controls leave an effective {ess:0} of {iterations} members to the varve count {specs[backbone].Id}: the ranges rest on few distinct members; raise age_model.iterations.")
                : Finding.Note(AgeModelCodes.FewEffective,
                    $"{specs[backbone].Id} carries the chronology; the other controls weigh its members (effective size {ess:0} of {iterations}).")) with { Item = specs[backbone].Id });

        if (forced > 0)
            findings.Add(Finding.Warning(AgeModelCodes.OrderForced,
                $"in {forced} of {iterations} iterations no draw of the age controls was in stratigraphic order after {MaxOrderAttempts} tries; those ages were pooled into order. The controls contradict each other: see the flagged ones."));

        var summaries = Summaries(specs, prepared, problemOf, active, measured, iterations, draws, weights, source);
        foreach (var s in summaries.Where(s => s.Flagged))
            findings.Add(Finding.Warning(AgeModelCodes.Contradicted,
                $"age control {s.Id} is out of stratigraphic order with another control in {Pct(s.ContradictionShare)} % of iterations (leave-one-out z {s.LeaveOneOutZ.ToString("0.0", CultureInfo.InvariantCulture)}){(s.Excluded ? " (excluded)" : "; check it, or set exclude: true")}.") with { Item = s.Id, Core = s.Cores.FirstOrDefault() });
        foreach (var s in summaries.Where(s => s.Used && s.OutlierShare >= OutlierWarnShare))
            findings.Add(Finding.Warning(AgeModelCodes.Outlier,
                $"age control {s.Id} is an outlier in {Pct(s.OutlierShare)} % of the ensemble (prior {Pct(specs.First(a => a.Id == s.Id).OutlierPrior)} %): the other controls disagree with it, so it barely shapes the ages; check it.") with { Item = s.Id, Core = s.Cores.FirstOrDefault() });

        // Ages of every core's samples, then of the composite grid.
        var cores = new Dictionary<string, AgeSeries>();
        double rateWindow = p.AgeModel.RateWindow ?? AgeModelSettings.DefaultRateWindowSteps * Math.Max(step, AlignmentGridStep(project, alignment));
        double gridTop = double.PositiveInfinity, gridBottom = double.NegativeInfinity;
        int coreIndex = 0;
        foreach (var core in p.Cores)
        {
            ct.ThrowIfCancellationRequested();
            coreIndex++;
            if (!project.Tables.TryGetValue(core.Id, out var table) || table.Count == 0) continue;
            if (!alignment.Mappings.TryGetValue(core.Id, out var ensemble))
            {
                findings.Add(Finding.Warning(AgeModelCodes.NoMapping, $"core {core.Id} has no depth mapping to the composite scale: no ages for its samples.") with { Core = core.Id });
                continue;
            }
            var depths = DepthsIn(table, unit);
            var series = Summarise(core.Id, false, unit, depths, ensemble, curves, source, scales.Of(core.Id), scales.Composite,
                core.CoringYear is int year ? CalendarAge.FromYearCE(year).YearsBP : youngestBP, rateWindow, options);
            cores[core.Id] = series;
            NoteExtrapolation(series, findings);
            gridTop = Math.Min(gridTop, ensemble.Median.ToCompositeValue(depths[0]));
            gridBottom = Math.Max(gridBottom, ensemble.Median.ToCompositeValue(depths[^1]));
            progress?.Report(new WorkProgress("age model: samples", coreIndex / (double)p.Cores.Count, core.Id));
        }
        if (double.IsInfinity(gridTop))
        {
            gridTop = Median(curves.Select(c => c.TopDepth));
            gridBottom = Median(curves.Select(c => c.BottomDepth));
        }
        int first = (int)Math.Floor(gridTop / step), last = (int)Math.Ceiling(gridBottom / step);
        var grid = Enumerable.Range(first, last - first + 1).Select(k => k * step).ToArray();
        var composite = Summarise("composite", true, unit, grid, null, curves, source, EventFreeScale.None, scales.Composite, youngestBP, rateWindow, options);

        return new AgeModelResult(seed, interpolation, unit, curves, summaries, cores, composite, forced, findings) { CompositeEvents = scales.Composite };
    }

    private static double[] DepthsIn(Tables.CoreTable table, DepthUnit unit) =>
        table.Unit == unit ? table.Depths : table.Depths.Select(d => DepthUnits.Convert(d, table.Unit, unit)).ToArray();

    /// <summary>
    /// Shallowest and deepest composite depth the run will ask ages for: every core's end samples through the median
    /// and every member of its mapping, and the controls' points through the members the iterations use.
    /// </summary>
    private static (double Top, double Bottom) QueryExtent(LoadedProject project, AlignmentResult alignment, int iterations,
        PreparedControl?[] prepared, int[] active, EventScales scales)
    {
        var unit = project.Project.DepthUnit;
        double top = double.PositiveInfinity, bottom = double.NegativeInfinity;
        void Reach(DepthMapping mapping, double depth)
        {
            double z = scales.Composite.ToEventFree(mapping.ToCompositeValue(depth));
            top = Math.Min(top, z);
            bottom = Math.Max(bottom, z);
        }
        foreach (var core in project.Project.Cores)
        {
            if (!project.Tables.TryGetValue(core.Id, out var table) || table.Count == 0) continue;
            if (!alignment.Mappings.TryGetValue(core.Id, out var ensemble)) continue;
            var depths = DepthsIn(table, unit);
            foreach (var mapping in ensemble.Members.Append(ensemble.Median))
            {
                Reach(mapping, depths[0]);
                Reach(mapping, depths[^1]);
            }
        }
        int members = alignment.Mappings.Values.Max(e => Math.Max(1, e.Members.Count));
        foreach (int c in active)
            for (int q = 0; q < prepared[c]!.PointCount; q++)
                for (int i = 0; i < Math.Min(iterations, members); i++)
                    Reach(alignment.Mappings[prepared[c]!.PointCores[q]].Member(i), prepared[c]!.PointDepths[q]);
        return (top, bottom);
    }

    /// <summary>
    /// Every core's event layers, and the composite scale's: the reference core's, through its median mapping. (Another
    /// core's event need not be an event in the reference; its samples take the age of its base through their mapping.)
    /// </summary>
    private static EventScales Scales(LoadedProject project, AlignmentResult alignment)
    {
        var unit = project.Project.DepthUnit;
        var cores = project.Project.Cores.ToDictionary(c => c.Id, c => EventFreeScale.Of(c, unit));
        var composite = EventFreeScale.None;
        if (cores.TryGetValue(alignment.ReferenceCore, out var reference) && reference.Count > 0 && alignment.Mappings.TryGetValue(alignment.ReferenceCore, out var ensemble))
        {
            var tops = reference.Tops.Select(ensemble.Median.ToCompositeValue).ToArray();
            var bottoms = reference.Bottoms.Select(ensemble.Median.ToCompositeValue).ToArray();
            for (int k = 1; k < tops.Length; k++) tops[k] = Math.Max(tops[k], bottoms[k - 1]);
            for (int k = 0; k < tops.Length; k++) bottoms[k] = Math.Max(bottoms[k], tops[k]);
            composite = new EventFreeScale(tops, bottoms);
        }
        return new EventScales(cores, composite);
    }

    /// <summary>
    /// Where a control observing the backbone sits on the event-free composite scale: through the median mapping
    /// (the reference core's point for a marker it holds, else the mean over the marker's cores; a varve count's
    /// deepest point), and the spread (sd) of the mapping members there. The backbone path is drawn given the control
    /// at that depth with the spread in its sigma, so the age controls do not pick alignment members: with a few
    /// hundred distinct members and annual precision they would leave a handful.
    /// </summary>
    private static (double Depth, double Spread) Placement(PreparedControl pc, AlignmentResult alignment, EventScales scales)
    {
        var points = pc.Varves is not null ? [pc.PointCount - 1]
            : pc.IsMarker && Array.IndexOf(pc.PointCores, alignment.ReferenceCore) is int r and >= 0 ? [r]
            : Enumerable.Range(0, pc.PointCount).ToArray();
        double depth = 0, spread = 0;
        foreach (int q in points)
        {
            var ensemble = alignment.Mappings[pc.PointCores[q]];
            depth += scales.ToModelDepth(pc.PointCores[q], ensemble.Median, pc.PointDepths[q]);
            var zs = ensemble.Members.Select(m => scales.ToModelDepth(pc.PointCores[q], m, pc.PointDepths[q])).ToArray();
            spread += zs.Length > 1 ? zs.StandardDeviation() : 0;
        }
        return (depth / points.Length, spread / points.Length);
    }

    /// <summary>The active varve count with the most varves carries the chronology (the first such in file order); -1 when none.</summary>
    private static int Backbone(PreparedControl?[] prepared, int[] active)
    {
        int best = -1;
        foreach (int c in active)
            if (prepared[c]!.Varves is { } v && (best < 0 || v.VarveCount > prepared[best]!.Varves!.VarveCount)) best = c;
        return best;
    }

    /// <summary>Importance weights summing to 1 from log weights (all equal when every log weight is equal).</summary>
    private static double[] Normalised(double[] logWeights)
    {
        double top = logWeights.Max();
        var w = logWeights.Select(l => double.IsNegativeInfinity(top) ? 1 : Math.Exp(l - top)).ToArray();
        double sum = w.Sum();
        for (int i = 0; i < w.Length; i++) w[i] /= sum;
        return w;
    }

    /// <summary>Kish's effective sample size, (sum w)^2 / sum w^2, of normalised weights.</summary>
    private static double EffectiveSize(double[] weights) => 1 / weights.Sum(w => w * w);

    /// <summary>
    /// Systematic resampling (Kitagawa 1996, J. Comput. Graph. Stat. 5:1-25, from memory): as many members as
    /// proposals, member i taking the proposal where the cumulative weight first reaches (u + i) / n for one
    /// seeded u. Equal weights give every proposal once, in order.
    /// </summary>
    private static int[] Resample(double[] weights, int seed)
    {
        int n = weights.Length;
        var source = new int[n];
        if (weights.All(w => w == weights[0]))
        {
            for (int i = 0; i < n; i++) source[i] = i;
            return source;
        }
        double u = new Random(seed).NextDouble(), cumulative = weights[0];
        int k = 0;
        for (int i = 0; i < n; i++)
        {
            double target = (u + i) / n;
            while (cumulative < target && k < n - 1) cumulative += weights[++k];
            source[i] = k;
        }
        return source;
    }

    /// <summary>A control is reported as an outlier when its posterior share reaches this (our choice: at least even odds).</summary>
    public const double OutlierWarnShare = 0.5;

    private static PreparedControl? Prepare(LoadedProject project, AlignmentResult alignment,
        IReadOnlyDictionary<string, (double[] Tops, double[] Bottoms)> varveLayers, AgeControlSpec spec, FindingList problems, out string? problem)
    {
        var unit = project.Project.DepthUnit;
        problem = null;
        string? Fail(string code, string text, string? core = null, Severity severity = Severity.Error)
        {
            problems.Add(new Finding { Severity = severity, Code = code, Message = $"age control {spec.Id}: {text}", Item = spec.Id, Core = core });
            return text;
        }
        bool Mapped(string core) => alignment.Mappings.ContainsKey(core);
        // A point's depth on the composite scale is known to about half a composite step (our choice).
        double placement = 0.5 * (project.Project.Composite.Step > 0 ? project.Project.Composite.Step : 1);

        switch (spec)
        {
            case CalendarAgeControl c when c.Marker is not null:
            {
                var marker = project.Project.FindMarker(c.Marker);
                if (marker is null) { problem = Fail(AgeModelCodes.UnknownMarker, $"marker {c.Marker} is not defined."); return null; }
                var at = marker.Depths.Where(d => Mapped(d.CoreId)).ToArray();
                if (at.Length == 0) { problem = Fail(AgeModelCodes.NoMapping, $"no core holding marker {c.Marker} has a depth mapping."); return null; }
                return PreparedControl.Calendar(spec, at.Select(d => d.CoreId).ToArray(), at.Select(d => d.Depth.In(unit)).ToArray(), c.Age.YearsBP, c.Error).Placed(marker.Uncertainty);
            }
            case CalendarAgeControl c:
                if (!Mapped(c.Core!)) { problem = Fail(AgeModelCodes.NoMapping, $"core {c.Core} has no depth mapping.", c.Core); return null; }
                return PreparedControl.Calendar(spec, [c.Core!], [c.Depth!.Value.In(unit)], c.Age.YearsBP, c.Error).Placed(placement);
            case RadiocarbonAgeControl r:
            {
                if (!Mapped(r.Core)) { problem = Fail(AgeModelCodes.NoMapping, $"core {r.Core} has no depth mapping.", r.Core); return null; }
                var curve = CalibrationCurveCache.Shared.Get(project.Document.Resolve(r.Curve), problems);
                CalibrationCurve? atmospheric = null;
                if (r.MarineFraction is not null && r.AtmosphericCurve is not null)
                    atmospheric = CalibrationCurveCache.Shared.Get(project.Document.Resolve(r.AtmosphericCurve), problems);
                if (curve is null || (r.MarineFraction is not null && atmospheric is null))
                {
                    problem = Fail(AgeModelCodes.Curve, "its calibration curve could not be read.", r.Core);
                    return null;
                }
                var result = Calibrator.Calibrate(r.C14Age, r.C14Error, curve, r.ReservoirOffset, r.ReservoirError, r.MarineFraction, atmospheric);
                if (!result.IsUsable)
                {
                    problem = Fail(AgeModelCodes.Calibration, result.Message + " Not used in the age model.", r.Core, Severity.Warning);
                    return null;
                }
                if (result.Message is not null) Fail(AgeModelCodes.Calibration, result.Message, r.Core, Severity.Warning);
                return PreparedControl.Radiocarbon(r, r.Depth.In(unit), result).Placed(placement);
            }
            case VarveCountControl v:
            {
                if (!Mapped(v.Core)) { problem = Fail(AgeModelCodes.NoMapping, $"core {v.Core} has no depth mapping.", v.Core); return null; }
                if (!varveLayers.TryGetValue(v.Id, out var layers))
                {
                    problem = Fail(AgeModelCodes.VarveTable, $"the varve table {v.Table} was not loaded.", v.Core);
                    return null;
                }
                int before = problems.Count;
                var sequence = VarveSequence.Build(v.Id, layers.Tops, layers.Bottoms, v.AnchorDepth.In(unit), v.MiscountRateAt, problems);
                if (sequence is null) { problem = problems.Count > before ? problems[^1].Message : "bad varve table"; return null; }
                return PreparedControl.Varve(v, sequence).Placed(placement);
            }
            default:
                problem = Fail(AgeModelCodes.TooFewControls, $"unsupported kind {spec.KindName}.");
                return null;
        }
    }

    /// <summary>Per-thread scratch space for one iteration: points of every measured control and their draws.</summary>
    private sealed class IterationBuffers
    {
        public IterationBuffers(PreparedControl?[] prepared, int[] active, int[] measured)
        {
            Offset = new int[prepared.Length + 1];
            for (int c = 0; c < prepared.Length; c++) Offset[c + 1] = Offset[c] + (prepared[c]?.PointCount ?? 0);
            int total = Offset[^1];
            Depth = new double[total];
            Age = new double[total];
            FirstAge = new double[total];
            SortedDepth = new double[total];
            SortedAge = new double[total];
            SortedCopy = new bool[prepared.Length];
            int activePoints = active.Sum(c => prepared[c]!.PointCount);
            ActiveIndex = new int[activePoints];
            ActiveControl = new int[activePoints];
            ActiveWeight = new double[activePoints];
            Order = new int[activePoints];
            OrderKeys = new double[activePoints];
            KnotDepth = new double[activePoints];
            KnotAge = new double[activePoints];
            KnotWeight = new double[activePoints];
            KnotOrder = new int[activePoints];
            KnotKeys = new double[activePoints];
            int k = 0;
            foreach (int c in active)
                for (int q = 0; q < prepared[c]!.PointCount; q++)
                {
                    ActiveIndex[k] = Offset[c] + q;
                    ActiveControl[k] = c;
                    ActiveWeight[k++] = prepared[c]!.Weights[q];
                }
            Rng = new Random[prepared.Length];
        }

        public int[] Offset { get; }
        public double[] Depth { get; }
        public double[] Age { get; }
        public double[] FirstAge { get; }
        public double[] SortedDepth { get; }
        public double[] SortedAge { get; }

        /// <summary>Per control: its points are sorted into <see cref="SortedDepth"/> and <see cref="SortedAge"/> (else read in place).</summary>
        public bool[] SortedCopy { get; }
        public int[] ActiveIndex { get; }
        public int[] ActiveControl { get; }
        public double[] ActiveWeight { get; }
        public int[] Order { get; }
        public double[] OrderKeys { get; }
        public Random[] Rng { get; }

        /// <summary>One iteration's knots: depth, age, weight, and their depth order (keys: sort scratch).</summary>
        public double[] KnotDepth { get; }
        public double[] KnotAge { get; }
        public double[] KnotWeight { get; }
        public int[] KnotOrder { get; }
        public double[] KnotKeys { get; }

        /// <summary>The backbone's point depths in this iteration, sized on first use.</summary>
        public double[]? BackboneDepth { get; set; }
    }

    /// <summary>Per-iteration records written by index (so parallel runs give identical results).</summary>
    private sealed class IterationDraws(int controls, int iterations)
    {
        public double[] ModelledAge { get; } = new double[controls * iterations];
        public bool[] Contradicted { get; } = new bool[controls * iterations];
        public double[] Discrepancy { get; } = new double[controls * iterations];
        public double[] Top { get; } = new double[controls * iterations];
        public double[] Bottom { get; } = new double[controls * iterations];

        /// <summary>Posterior outlier probability of each control in each member (NaN where not assessed).</summary>
        public double[] Outlier { get; } = Enumerable.Repeat(double.NaN, controls * iterations).ToArray();
    }

    /// <summary>The depth scales one iteration needs: every core's event layers and the composite scale's.</summary>
    private sealed record EventScales(IReadOnlyDictionary<string, EventFreeScale> Cores, EventFreeScale Composite)
    {
        public EventFreeScale Of(string core) => Cores.TryGetValue(core, out var s) ? s : EventFreeScale.None;

        /// <summary>Event-free composite depth of a core depth through one mapping: the core's event takes its base's age.</summary>
        public double ToModelDepth(string core, DepthMapping mapping, double coreDepth) =>
            Composite.ToEventFree(mapping.ToCompositeValue(Of(core).BaseOf(coreDepth)));
    }

    /// <summary>
    /// One member of the ensemble. Its curve runs through knots: the backbone varve count's points (anchor and
    /// random-walk counting-error path drawn) when there is one, and the point controls outside its reach (or all
    /// point controls without a backbone), each drawn from its distribution; when that draw is out of order, the
    /// redraws leave each control out as an outlier with its prior probability until the knots are in order. Every other
    /// control (in the backbone's reach, and other varve counts) weighs the member by its likelihood under the
    /// outlier mixture; its posterior outlier probability in this member is recorded. Returns the log weight.
    /// </summary>
    private static (AgeDepthCurve Curve, double LogWeight) Iterate(int i, int seed, PreparedControl?[] prepared, int[] active, int[] measured, int backbone,
        (double Depth, double Spread)[] placements, AlignmentResult alignment, EventScales scales, AgeInterpolation interpolation, RateWalk? walk, double youngestBP, IterationBuffers b, IterationDraws draws, ref int forced)
    {
        int nControls = prepared.Length;
        foreach (int c in measured)
        {
            var pc = prepared[c]!;
            b.Rng[c] = new Random(SeedStreams.Derive(seed, i, c));
            var depths = b.Depth.AsSpan(b.Offset[c], pc.PointCount);
            // A control's points mostly lie in one core: look its mapping and event layers up once per run of points.
            string? core = null;
            DepthMapping? mapping = null;
            var coreEvents = EventFreeScale.None;
            for (int q = 0; q < pc.PointCount; q++)
            {
                if (!ReferenceEquals(pc.PointCores[q], core))
                {
                    core = pc.PointCores[q];
                    mapping = alignment.Mappings[core].Member(i);
                    coreEvents = scales.Of(core);
                }
                depths[q] = scales.Composite.ToEventFree(mapping!.ToCompositeValue(coreEvents.BaseOf(pc.PointDepths[q])));
            }
            if (pc.IsMarker && pc.PointCount > 1) PlaceMarker(pc, depths, alignment.ReferenceCore);
            double top = double.PositiveInfinity, bottom = double.NegativeInfinity;
            foreach (double z in depths)
            {
                top = Math.Min(top, z);
                bottom = Math.Max(bottom, z);
            }
            draws.Top[i * nControls + c] = top;
            draws.Bottom[i * nControls + c] = bottom;
            pc.Draw(b.Rng[c], b.FirstAge.AsSpan(b.Offset[c], pc.PointCount));
        }

        int n = b.ActiveIndex.Length;
        for (int k = 0; k < n; k++)
        {
            b.Order[k] = k;
            b.OrderKeys[k] = b.Depth[b.ActiveIndex[k]];
        }
        Array.Sort(b.OrderKeys, b.Order);
        MeasureContradictions(i, prepared, active, measured, b, draws);

        double reachTop = double.PositiveInfinity, reachBottom = double.NegativeInfinity;
        if (backbone >= 0)
        {
            reachTop = draws.Top[i * nControls + backbone];
            reachBottom = draws.Bottom[i * nControls + backbone];
        }
        bool InReach(int c) => backbone >= 0 && (prepared[c]!.Varves is not null
            || (draws.Top[i * nControls + c] >= reachTop && draws.Bottom[i * nControls + c] <= reachBottom));

        // The backbone's path, drawn given the calendar ages and other varve counts in its reach below its anchor.
        var conditioned = new bool[nControls];
        double logWeight = 0;
        if (backbone >= 0)
        {
            var pb = prepared[backbone]!;
            var bDepths = b.BackboneDepth ??= new double[pb.PointCount];
            Array.Copy(b.Depth, b.Offset[backbone], bDepths, 0, pb.PointCount);
            var observations = new List<PreparedControl.PathObservation>();
            foreach (int c in active)
            {
                if (c == backbone || !InReach(c)) continue;
                var pc = prepared[c]!;
                if (pc.Spec is not CalendarAgeControl && pc.Varves is null) continue;
                int last = pc.PointCount - 1;
                var (z, spread) = placements[c];
                int k = Array.BinarySearch(bDepths, z);
                if (k < 0) k = ~k;
                if (k >= bDepths.Length) k = bDepths.Length - 1;
                if (k > 0 && Math.Abs(bDepths[k - 1] - z) <= Math.Abs(bDepths[k] - z)) k--;
                if (pb.Varves!.Counts[k] < 0) continue;
                int k1 = Math.Min(k + 1, bDepths.Length - 1), k0 = k1 - 1;
                double yearsPerUnit = k0 >= 0 && bDepths[k1] > bDepths[k0] ? (pb.Varves.Counts[k1] - pb.Varves.Counts[k0]) / (bDepths[k1] - bDepths[k0]) : 0;
                double place = yearsPerUnit * Math.Sqrt(pc.DepthSigma * pc.DepthSigma + spread * spread);
                double observed, sigma;
                if (pc.Varves is { } v)
                {
                    var (anchorAge, anchorSigma) = pc.Anchor;
                    observed = anchorAge + v.Counts[last];
                    sigma = Math.Sqrt(anchorSigma * anchorSigma + v.Variances[last] + Math.Pow(pc.CountError * v.Counts[last], 2) + place * place);
                }
                else
                {
                    var (mean, sd) = pc.Moments;
                    observed = mean;
                    sigma = Math.Sqrt(sd * sd + place * place);
                }
                observations.Add(new PreparedControl.PathObservation(k, observed, Math.Max(sigma, 0.5), pc.OutlierPrior, c));
                conditioned[c] = true;
            }
            observations.Sort((x, y) => x.Point.CompareTo(y.Point));
            var flags = new bool[observations.Count];
            logWeight += pb.DrawConditioned(b.Rng[backbone], b.FirstAge.AsSpan(b.Offset[backbone], pb.PointCount), observations, flags);
            for (int o = 0; o < observations.Count; o++) draws.Outlier[i * nControls + observations[o].Control] = flags[o] ? 1 : 0;
        }

        // Knots: the backbone's points, then the point controls that are not weighed (in per-thread buffers:
        // a varve backbone gives thousands of them in every iteration).
        var knotDepth = b.KnotDepth;
        var knotAge = b.KnotAge;
        var knotWeight = b.KnotWeight;
        int knots = 0;
        if (backbone >= 0)
        {
            var pb = prepared[backbone]!;
            for (int q = 0; q < pb.PointCount; q++, knots++)
            {
                knotDepth[knots] = b.Depth[b.Offset[backbone] + q];
                knotAge[knots] = b.FirstAge[b.Offset[backbone] + q];
                knotWeight[knots] = pb.Weights[q];
            }
        }
        int fixedKnots = knots;
        var free = active.Where(c => c != backbone && !InReach(c)).ToArray();
        var outlier = new bool[free.Length];
        bool twoFixedDepths = HasTwoDepths(knotDepth.AsSpan(0, fixedKnots));
        bool ordered = false;
        for (int attempt = 0; attempt < MaxOrderAttempts && !ordered; attempt++)
        {
            knots = fixedKnots;
            for (int f = 0; f < free.Length; f++)
            {
                var pc = prepared[free[f]]!;
                var ages = (attempt == 0 ? b.FirstAge : b.Age).AsSpan(b.Offset[free[f]], pc.PointCount);
                if (attempt > 0) pc.Draw(b.Rng[free[f]], ages);
                // A first draw in order keeps every knot; the redraws of a set out of order leave outliers out.
                outlier[f] = attempt > 0 && pc.OutlierPrior > 0 && b.Rng[free[f]].NextDouble() < pc.OutlierPrior;
                if (outlier[f]) continue;
                for (int q = 0; q < pc.PointCount; q++, knots++)
                {
                    knotDepth[knots] = b.Depth[b.Offset[free[f]] + q];
                    knotAge[knots] = ages[q];
                    knotWeight[knots] = pc.Weights[q];
                }
            }
            // Outliers are never so many that fewer than two knot depths remain: then they all count.
            if (!twoFixedDepths && !HasTwoDepths(knotDepth.AsSpan(0, knots)))
                for (int f = 0; f < free.Length; f++)
                {
                    if (!outlier[f]) continue;
                    outlier[f] = false;
                    var pc = prepared[free[f]]!;
                    var ages = (attempt == 0 ? b.FirstAge : b.Age).AsSpan(b.Offset[free[f]], pc.PointCount);
                    for (int q = 0; q < pc.PointCount; q++, knots++)
                    {
                        knotDepth[knots] = b.Depth[b.Offset[free[f]] + q];
                        knotAge[knots] = ages[q];
                        knotWeight[knots] = pc.Weights[q];
                    }
                }
            SortOrder(knotDepth, knots, fixedKnots, b.KnotOrder, b.KnotKeys);
            ordered = StratigraphicOrder.IsOrdered(b.KnotOrder.AsSpan(0, knots), knotDepth.AsSpan(0, knots), knotAge.AsSpan(0, knots));
        }
        var order = b.KnotOrder.AsSpan(0, knots);
        if (!ordered)
        {
            StratigraphicOrder.Pool(order, knotAge.AsSpan(0, knots), knotWeight.AsSpan(0, knots));
            Interlocked.Increment(ref forced);
        }
        for (int f = 0; f < free.Length; f++) draws.Outlier[i * nControls + free[f]] = outlier[f] ? 1 : 0;

        var curve = BuildCurve(order, knotDepth, knotAge, interpolation, i);
        // The walk's stream follows the controls' streams (indices 0 .. controls - 1) of the same iteration.
        if (walk is not null) curve = walk.Apply(curve, new Random(SeedStreams.Derive(seed, i, nControls)));
        if (youngestBP > double.NegativeInfinity) curve = curve.NoYoungerThan(youngestBP);

        foreach (int c in active)
        {
            var pc = prepared[c]!;
            double first = b.Depth[b.Offset[c]];
            draws.ModelledAge[i * nControls + c] = curve.AgeAt(first);
            if (c == backbone || !InReach(c) || conditioned[c]) continue;
            var (lIn, lOut) = pc.Varves is not null ? VarveLikelihood(pc, b.Depth.AsSpan(b.Offset[c], pc.PointCount), curve) : PointLikelihood(pc, first, curve);
            double p = pc.OutlierPrior;
            // log((1 - p) L_in + p L_out) and the outlier's posterior p L_out / that, computed stably in logs.
            double a = Math.Log(1 - p) + lIn, o = p > 0 ? Math.Log(p) + lOut : double.NegativeInfinity;
            double top = Math.Max(a, o);
            double log = top + Math.Log(Math.Exp(a - top) + Math.Exp(o - top));
            logWeight += log;
            draws.Outlier[i * nControls + c] = Math.Exp(o - log);
        }
        return (curve, logWeight);
    }

    /// <summary>
    /// Indices 0 .. count - 1 of <paramref name="depths"/> in ascending depth, into <paramref name="order"/> as
    /// <see cref="Array.Sort{TKey, TValue}(TKey[], TValue[], int, int)"/> orders them (<paramref name="keys"/> is scratch).
    /// The first <paramref name="presorted"/> depths (a backbone's points) mostly ascend already: the few after them
    /// are merged in, and when no two depths are equal that order is the only one, so it is the sort's.
    /// </summary>
    private static void SortOrder(double[] depths, int count, int presorted, int[] order, double[] keys)
    {
        if (!TryMergeOrder(depths, count, presorted, order, keys))
        {
            for (int k = 0; k < count; k++) order[k] = k;
            Array.Copy(depths, keys, count);
            Array.Sort(keys, order, 0, count);
        }
    }

    /// <summary>The merge of <see cref="SortOrder"/>; false (order and keys left undefined) unless every depth differs.</summary>
    private static bool TryMergeOrder(double[] depths, int count, int presorted, int[] order, double[] keys)
    {
        const int MaxMerged = 64;
        int rest = count - presorted;
        if (presorted < 2 || rest > MaxMerged || !StrictlyIncreasing(depths.AsSpan(0, presorted))) return false;
        Span<double> restKeys = stackalloc double[rest];
        Span<int> restIndex = stackalloc int[rest];
        for (int k = 0; k < rest; k++)
        {
            restKeys[k] = depths[presorted + k];
            restIndex[k] = presorted + k;
        }
        restKeys.Sort(restIndex);
        int a = 0, b = 0;
        for (int k = 0; k < count; k++)
        {
            bool fromRest = a == presorted || (b < rest && restKeys[b] < depths[a]);
            order[k] = fromRest ? restIndex[b] : a;
            keys[k] = fromRest ? restKeys[b++] : depths[a++];
            if (k > 0 && !(keys[k] > keys[k - 1])) return false;
        }
        return true;
    }

    /// <summary>True when the depths hold two different values (as <see cref="Enumerable.Distinct{T}(IEnumerable{T})"/> tells them apart).</summary>
    private static bool HasTwoDepths(ReadOnlySpan<double> depths)
    {
        for (int k = 1; k < depths.Length; k++)
            if (!depths[k].Equals(depths[0])) return true;
        return false;
    }

    private static (double In, double Out) PointLikelihood(PreparedControl pc, double depth, AgeDepthCurve curve)
    {
        double modelled = curve.AgeAt(depth, out double yearsPerUnit);
        return (pc.LogLikelihood(modelled, yearsPerUnit, false), pc.LogLikelihood(modelled, yearsPerUnit, true));
    }

    /// <summary>Checkpoints of a weighed varve count: its point nearest the anchor and this many more, spread evenly.</summary>
    private const int VarveCheckpoints = 4;

    /// <summary>
    /// Likelihood of a second varve count given the member's curve: the modelled age at its point nearest the
    /// anchor against the anchor age, and the modelled years between checkpoints against the varves counted
    /// between them. Under the random-walk miscount model the increments are independent normals with the
    /// miscount variance accumulated between the checkpoints (plus the systematic error and the depth placement
    /// of both ends). As an outlier the count keeps its shape loosely: anchor widened by
    /// <see cref="PreparedControl.OutlierWidthYears"/>, increments by half their counts.
    /// </summary>
    private static (double In, double Out) VarveLikelihood(PreparedControl pc, ReadOnlySpan<double> depths, AgeDepthCurve curve)
    {
        var seq = pc.Varves!;
        var counts = seq.Counts;
        int nearest = 0;
        for (int q = 1; q < counts.Length; q++) if (Math.Abs(counts[q]) < Math.Abs(counts[nearest])) nearest = q;
        var (anchorAge, anchorSigma) = pc.Anchor;
        double z0 = depths[nearest];
        double a0 = curve.AgeAt(z0, out double r0);
        double place0 = r0 * pc.DepthSigma;
        double sigma0 = Math.Sqrt(anchorSigma * anchorSigma + seq.Variances[nearest] + place0 * place0 + Math.Pow(pc.CountError * counts[nearest], 2));
        double expected0 = anchorAge + counts[nearest];
        double lIn = PreparedControl.LogNormal(a0, expected0, sigma0);
        double lOut = PreparedControl.LogNormal(a0, expected0, Math.Sqrt(sigma0 * sigma0 + PreparedControl.OutlierWidthYears * PreparedControl.OutlierWidthYears));
        foreach (int side in (ReadOnlySpan<int>)[-1, 1])
        {
            int end = side < 0 ? 0 : counts.Length - 1;
            int span = Math.Abs(end - nearest);
            if (span == 0) continue;
            int previous = nearest;
            double prevAge = a0, prevPlace = place0;
            for (int k = 1; k <= VarveCheckpoints; k++)
            {
                int q = nearest + side * (int)Math.Round(span * k / (double)VarveCheckpoints);
                if (q == previous) continue;
                double aq = curve.AgeAt(depths[q], out double rq);
                double place = rq * pc.DepthSigma;
                double counted = counts[q] - counts[previous];
                double modelled = aq - prevAge;
                double sigma = Math.Sqrt(Math.Abs(seq.Variances[q] - seq.Variances[previous]) + Math.Pow(pc.CountError * counted, 2) + place * place + prevPlace * prevPlace);
                sigma = Math.Max(sigma, 0.5);
                lIn += PreparedControl.LogNormal(modelled, counted, sigma);
                lOut += PreparedControl.LogNormal(modelled, counted, Math.Sqrt(sigma * sigma + 0.25 * counted * counted));
                previous = q;
                prevAge = aq;
                prevPlace = place;
            }
        }
        return (lIn, lOut);
    }

    /// <summary>
    /// A marker is one layer, so its age sits at one composite depth per iteration: the reference core's depth
    /// when the reference holds the marker, else the mean of the depths its cores map to. (Left at each core's
    /// mapped depth, the correlation scatter would interleave one age with its neighbours' and no draw would be
    /// in order.) Its spread over the iterations still reaches every core's samples through their mappings.
    /// </summary>
    private static void PlaceMarker(PreparedControl pc, Span<double> depths, string referenceCore)
    {
        int r = Array.IndexOf(pc.PointCores, referenceCore);
        double z = r >= 0 ? depths[r] : Mean(depths);
        depths.Fill(z);

        static double Mean(Span<double> values)
        {
            double sum = 0;
            foreach (double v in values) sum += v;
            return sum / values.Length;
        }
    }

    /// <summary>
    /// From the first draws: which controls are out of order with at least one other control in use, and how far
    /// each control's age lies from the age the other controls give at its first point (linear interpolation
    /// between the nearest other points above and below, or extrapolation from the two nearest on one side).
    /// </summary>
    private static void MeasureContradictions(int i, PreparedControl?[] prepared, int[] active, int[] measured, IterationBuffers b, IterationDraws draws)
    {
        int nControls = prepared.Length;
        foreach (int c in measured)
        {
            // Sort each control's points by depth (a marker's cores may come in any order; ages are equal then).
            // Points already strictly increasing (a varve count's mostly are) can only sort to their own order: read in place.
            int o = b.Offset[c], len = prepared[c]!.PointCount;
            b.SortedCopy[c] = len > 1 && !StrictlyIncreasing(b.Depth.AsSpan(o, len));
            if (!b.SortedCopy[c]) continue;
            Array.Copy(b.Depth, o, b.SortedDepth, o, len);
            Array.Copy(b.FirstAge, o, b.SortedAge, o, len);
            Array.Sort(b.SortedDepth, b.SortedAge, o, len);
        }
        foreach (int c in measured)
        {
            bool conflict = false;
            var zc = (b.SortedCopy[c] ? b.SortedDepth : b.Depth).AsSpan(b.Offset[c], prepared[c]!.PointCount);
            var ac = (b.SortedCopy[c] ? b.SortedAge : b.FirstAge).AsSpan(b.Offset[c], prepared[c]!.PointCount);
            foreach (int k in active)
            {
                if (k == c) continue;
                var zk = (b.SortedCopy[k] ? b.SortedDepth : b.Depth).AsSpan(b.Offset[k], prepared[k]!.PointCount);
                var ak = (b.SortedCopy[k] ? b.SortedAge : b.FirstAge).AsSpan(b.Offset[k], prepared[k]!.PointCount);
                if (StratigraphicOrder.Conflict(zc, ac, zk, ak)) { conflict = true; break; }
            }
            draws.Contradicted[i * nControls + c] = conflict;
            int first = b.Offset[c];
            draws.Discrepancy[i * nControls + c] = b.FirstAge[first] - PredictFromOthers(c, b.Depth[first], b);
        }
    }

    private static bool StrictlyIncreasing(ReadOnlySpan<double> values)
    {
        for (int k = 1; k < values.Length; k++)
            if (!(values[k] > values[k - 1])) return false;
        return true;
    }

    /// <summary>Age at <paramref name="z"/> from the first draws of the active points not of control <paramref name="c"/>; NaN with fewer than two.</summary>
    private static double PredictFromOthers(int c, double z, IterationBuffers b)
    {
        // Nearest two other points above-or-at z and nearest two below-or-at z, in depth order.
        int a1 = -1, a2 = -1, b1 = -1, b2 = -1;
        foreach (int k in b.Order)
        {
            if (b.ActiveControl[k] == c) continue;
            double zk = b.Depth[b.ActiveIndex[k]];
            if (zk <= z) { a2 = a1; a1 = k; }
            else if (b1 < 0) b1 = k;
            else if (b2 < 0) { b2 = k; break; }
        }
        (int p, int q) = a1 >= 0 && b1 >= 0 ? (a1, b1) : a1 >= 0 ? (a2, a1) : (b1, b2);
        if (p < 0 || q < 0) return double.NaN;
        double zp = b.Depth[b.ActiveIndex[p]], zq = b.Depth[b.ActiveIndex[q]];
        double yp = b.FirstAge[b.ActiveIndex[p]], yq = b.FirstAge[b.ActiveIndex[q]];
        if (zp == z) return yp;
        return zq == zp ? 0.5 * (yp + yq) : yp + (yq - yp) * (z - zp) / (zq - zp);
    }

    /// <summary>Knots from ordered points: points at one composite depth become one knot at their mean age.</summary>
    private static AgeDepthCurve BuildCurve(ReadOnlySpan<int> order, double[] depth, double[] age, AgeInterpolation interpolation, int iteration)
    {
        int groups = 0;
        for (int k = 0; k < order.Length; k++)
            if (k == 0 || depth[order[k]] != depth[order[k - 1]]) groups++;
        var zs = new double[groups];
        var ys = new double[groups];
        int g = 0;
        for (int k = 0; k < order.Length; g++)
        {
            double z = depth[order[k]], sum = 0;
            int count = 0;
            for (; k < order.Length && depth[order[k]] == z; k++, count++) sum += age[order[k]];
            zs[g] = z;
            ys[g] = sum / count;
        }
        if (groups < 2)
            throw new InvalidOperationException($"In iteration {iteration} every age control maps to one composite depth ({zs[0].ToString(CultureInfo.InvariantCulture)}): an age model needs controls at two depths at least.");
        // Means of ordered groups are ordered; guard against the last bit of rounding.
        for (int j = 1; j < ys.Length; j++) if (ys[j] < ys[j - 1]) ys[j] = ys[j - 1];
        return new AgeDepthCurve(zs, ys, interpolation);
    }

    private static ImmutableArray<AgeControlSummary> Summaries(ImmutableList<AgeControlSpec> specs, PreparedControl?[] prepared, string?[] problemOf,
        int[] active, int[] measured, int iterations, IterationDraws? draws, double[] weights, int[] source)
    {
        int nControls = specs.Count;
        var list = ImmutableArray.CreateBuilder<AgeControlSummary>(nControls);
        var column = new double[iterations];
        for (int c = 0; c < nControls; c++)
        {
            var spec = specs[c];
            var pc = prepared[c];
            var summary = new AgeControlSummary
            {
                Id = spec.Id,
                Kind = spec.KindName,
                Cores = pc is not null ? [.. pc.PointCores.Distinct()] : CoresNamed(spec),
                InputDensity = pc?.Density,
                Calibration = pc?.Calibration,
                Excluded = spec.Exclude,
                Used = active.Contains(c),
                Problem = problemOf[c],
            };
            if (measured.Contains(c) && draws is not null)
            {
                int hits = 0;
                for (int i = 0; i < iterations; i++) if (draws.Contradicted[i * nControls + c]) hits++;
                double share = hits / (double)iterations, z = StandardisedMean(draws.Discrepancy, c);
                summary = summary with
                {
                    ContradictionShare = share,
                    LeaveOneOutZ = z,
                    Flagged = share >= FlagShare && Math.Abs(z) >= FlagZ,
                    CompositeTop = MedianOfColumn(draws.Top, c),
                    CompositeBottom = MedianOfColumn(draws.Bottom, c),
                };
            }
            if (summary.Used && draws is not null)
            {
                double share = 0, mass = 0;
                for (int i = 0; i < iterations; i++)
                {
                    double o = draws.Outlier[i * nControls + c];
                    if (double.IsNaN(o)) continue;
                    share += weights[i] * o;
                    mass += weights[i];
                }
                summary = summary with { OutlierPrior = spec.OutlierPrior, OutlierShare = mass > 0 ? share / mass : double.NaN };
                for (int i = 0; i < iterations; i++) column[i] = draws.ModelledAge[source[i] * nControls + c];
                Array.Sort(column);
                summary = summary with
                {
                    ModelledMedianBP = Statistics.PercentileSorted(column, 50),
                    ModelledLoBP = Statistics.PercentileSorted(column, 2.5),
                    ModelledHiBP = Statistics.PercentileSorted(column, 97.5),
                };
            }
            list.Add(summary);
        }
        return list.MoveToImmutable();

        // Mean over sd of a control's discrepancies; +-infinity when exact ages disagree, 0 when they agree exactly.
        double StandardisedMean(double[] values, int c)
        {
            double sum = 0, sum2 = 0;
            int n = 0;
            for (int i = 0; i < iterations; i++)
            {
                double v = values[i * nControls + c];
                if (double.IsNaN(v)) continue;
                sum += v;
                sum2 += v * v;
                n++;
            }
            if (n < 2) return double.NaN;
            double mean = sum / n, sd = Math.Sqrt(Math.Max(0, (sum2 - n * mean * mean) / (n - 1)));
            if (sd <= 1e-9 * Math.Max(1, Math.Abs(mean))) return Math.Abs(mean) < 1e-9 ? 0 : Math.Sign(mean) * double.PositiveInfinity;
            return mean / sd;
        }

        double MedianOfColumn(double[] values, int c)
        {
            for (int i = 0; i < iterations; i++) column[i] = values[i * nControls + c];
            Array.Sort(column);
            return Statistics.PercentileSorted(column, 50);
        }
    }

    private static ImmutableArray<string> CoresNamed(AgeControlSpec spec) => spec switch
    {
        CalendarAgeControl { Core: { } core } => [core],
        RadiocarbonAgeControl r => [r.Core],
        VarveCountControl v => [v.Core],
        _ => [],
    };

    /// <summary>The grid step a dtw alignment resolved (0 for other methods or without the reference's table).</summary>
    private static double AlignmentGridStep(LoadedProject project, AlignmentResult alignment) =>
        alignment.Method == AlignmentMethods.Dtw && project.Tables.TryGetValue(alignment.ReferenceCore, out var table)
            && CoreAligner.GridStep(project.Project.Alignment, table) is double g && g > 0 ? g : 0;

    /// <summary>
    /// Median and 2.5/97.5 percentiles over the members of age and accumulation rate at each depth; for a core,
    /// depth d goes through mapping member i before curve i reads its age. A member's rate is the secant of its age
    /// between the samples that bound <paramref name="rateWindow"/> about the depth (at least the neighbouring ones),
    /// per event-free depth of the series' own scale: a dtw member's slope at one depth is 0 or many times the ratio.
    /// </summary>
    private static AgeSeries Summarise(string id, bool isComposite, DepthUnit unit, double[] depths, MappingEnsemble? ensemble, AgeDepthCurve[] curves,
        int[] source, EventFreeScale coreEvents, EventFreeScale compositeEvents, double youngestBP, double rateWindow, ParallelOptions options)
    {
        int n = depths.Length, members = curves.Length;
        // A sample inside one of the core's event layers takes the age of the layer's base.
        var dated = depths.Select(coreEvents.BaseOf).ToArray();
        var eventFree = isComposite ? depths.Select(compositeEvents.ToEventFree).ToArray() : depths.Select(coreEvents.ToEventFree).ToArray();
        var (windowTop, windowBase) = RateWindows(dated, rateWindow);

        // Iterations cycle through the alignment members: map every sample through each distinct member once.
        var memberOf = new int[members];
        var distinct = new List<DepthMapping>();
        if (ensemble is not null)
        {
            var index = new Dictionary<DepthMapping, int>(ReferenceEqualityComparer.Instance);
            for (int i = 0; i < members; i++)
            {
                var mapping = ensemble.Member(source[i]);
                if (!index.TryGetValue(mapping, out int k))
                {
                    k = distinct.Count;
                    index[mapping] = k;
                    distinct.Add(mapping);
                }
                memberOf[i] = k;
            }
        }
        var composite = new double[distinct.Count][];
        Parallel.For(0, distinct.Count, options, k =>
        {
            composite[k] = new double[n];
            for (int s = 0; s < n; s++) composite[k][s] = compositeEvents.ToEventFree(distinct[k].ToCompositeValue(dated[s]));
        });
        var gridModelDepths = ensemble is null ? depths.Select(compositeEvents.ToEventFree).ToArray() : null;

        var med = new double[n];
        var lo = new double[n];
        var hi = new double[n];
        var rMed = new double[n];
        var rLo = new double[n];
        var rHi = new double[n];
        var extrapolated = new bool[n];
        int blocks = (n + SampleBlock - 1) / SampleBlock;
        // A block reads the ages of the samples its windows reach beyond it.
        int reach = Enumerable.Range(0, blocks).Select(b => windowBase[Math.Min(n, (b + 1) * SampleBlock) - 1] - windowTop[b * SampleBlock] + 1).DefaultIfEmpty(0).Max();
        Parallel.For(0, blocks, options, () => (Ages: new double[SampleBlock * members], Times: new double[SampleBlock * members], Column: new double[members], Unbounded: new double[reach]), (blk, _, buf) =>
        {
            int from = blk * SampleBlock, len = Math.Min(SampleBlock, n - from);
            int first = windowTop[from], last = windowBase[from + len - 1];
            var outside = new int[len];
            for (int i = 0; i < members; i++)
            {
                var curve = curves[i];
                double[] zs = ensemble is null ? gridModelDepths! : composite[memberOf[i]];
                int segment = -1;
                for (int j = first; j <= last; j++) buf.Unbounded[j - first] = curve.UnboundedAgeAtAscending(zs[j], ref segment);
                for (int s = 0; s < len; s++)
                {
                    int at = from + s, top = windowTop[at], bottom = windowBase[at];
                    // A core taken before the site's last coring is no younger than its own coring year.
                    buf.Ages[s * members + i] = Math.Max(youngestBP, curve.Floored(buf.Unbounded[at - first]));
                    double span = eventFree[bottom] - eventFree[top];
                    if (span > 0)
                        buf.Times[s * members + i] = (buf.Unbounded[bottom - first] - buf.Unbounded[top - first]) / span;
                    else
                    {
                        curve.AgeAt(zs[at], out double yearsPerUnit);
                        buf.Times[s * members + i] = ensemble is null ? yearsPerUnit : yearsPerUnit * distinct[memberOf[i]].RateRatioAt(dated[at]);
                    }
                    if (curve.IsExtrapolated(zs[at])) outside[s]++;
                }
            }
            for (int s = 0; s < len; s++)
            {
                (med[from + s], lo[from + s], hi[from + s]) = Percentiles(buf.Ages.AsSpan(s * members, members), buf.Column);
                // Percentiles of deposition time (yr per unit) inverted are the rate's, ends swapped.
                var (tMed, tLo, tHi) = Percentiles(buf.Times.AsSpan(s * members, members), buf.Column);
                rMed[from + s] = 1 / tMed;
                rLo[from + s] = 1 / tHi;
                rHi[from + s] = 1 / tLo;
                extrapolated[from + s] = 2 * outside[s] > members;
            }
            return buf;
        }, _ => { });
        return new AgeSeries(id, isComposite, unit, depths, med, lo, hi, rMed, rLo, rHi, extrapolated) { EventFreeDepths = eventFree };
    }

    /// <summary>
    /// Per sample, the first and last sample whose (ascending) depth lies within half of <paramref name="window"/> of
    /// its own, widened to its neighbours where the window holds no other sample.
    /// </summary>
    private static (int[] Top, int[] Base) RateWindows(double[] ascendingDepths, double window)
    {
        int n = ascendingDepths.Length;
        var top = new int[n];
        var bottom = new int[n];
        for (int s = 0, a = 0, b = 0; s < n; s++)
        {
            while (ascendingDepths[a] < ascendingDepths[s] - window / 2) a++;
            if (b < s) b = s;
            while (b + 1 < n && ascendingDepths[b + 1] <= ascendingDepths[s] + window / 2) b++;
            top[s] = Math.Min(a, Math.Max(0, s - 1));
            bottom[s] = Math.Max(b, Math.Min(n - 1, s + 1));
        }
        return (top, bottom);
    }

    /// <summary>
    /// Median, 2.5 and 97.5 percentiles (type 7, as <see cref="Statistics.PercentileSorted"/>) of one member column.
    /// The six order statistics they interpolate are selected together (<see cref="OrderStatistics.SelectRanks"/>) and
    /// combined by the arithmetic of <see cref="ArrayStatistics.QuantileCustomInplace(double[], double, QuantileDefinition)"/>,
    /// so the values are the same to the bit as three separate quantile selections, for half the passes over the column.
    /// The column is reordered in place; <paramref name="scratch"/> (as long as the column) serves the general path.
    /// </summary>
    private static (double Median, double Lo, double Hi) Percentiles(Span<double> column, double[] scratch)
    {
        int n = column.Length;
        int mid = QuantileRank(n, 0.5, out double midFraction);
        int lo = QuantileRank(n, 0.025, out double loFraction);
        int hi = QuantileRank(n, 0.975, out double hiFraction);
        // Small ensembles can share ranks between the quantiles or reach the ends: the general path handles those.
        if (lo < 0 || lo + 1 >= mid || mid + 1 >= hi || hi + 1 > n - 1)
        {
            column.CopyTo(scratch);
            return (ArrayStatistics.QuantileCustomInplace(scratch, 0.5, QuantileDefinition.R7),
                    ArrayStatistics.QuantileCustomInplace(scratch, 0.025, QuantileDefinition.R7),
                    ArrayStatistics.QuantileCustomInplace(scratch, 0.975, QuantileDefinition.R7));
        }
        OrderStatistics.SelectRanks(column, [lo, lo + 1, mid, mid + 1, hi, hi + 1]);
        return (Between(column, mid, midFraction), Between(column, lo, loFraction), Between(column, hi, hiFraction));

        static double Between(Span<double> v, int rank, double fraction) => v[rank] + fraction * (v[rank + 1] - v[rank]);
    }

    /// <summary>The lower of the two ranks (0-based) a type-7 quantile interpolates, and the fraction towards the upper, computed as <see cref="ArrayStatistics.QuantileCustomInplace(double[], double, QuantileDefinition)"/> does.</summary>
    private static int QuantileRank(int n, double tau, out double fraction)
    {
        double h = (n - 1) * tau + 1d;
        int hf = (int)h;
        fraction = h - hf;
        return hf - 1;
    }

    private static void NoteExtrapolation(AgeSeries series, FindingList findings)
    {
        int firstInside = Array.IndexOf(series.Extrapolated, false);
        int lastInside = Array.LastIndexOf(series.Extrapolated, false);
        if (firstInside < 0)
        {
            findings.Add(Finding.Note(AgeModelCodes.Extrapolated,
                $"every sample of core {series.Id} lies outside the age controls: its ages are extrapolated with the rate of the nearest segment.") with { Core = series.Id });
            return;
        }
        if (firstInside > 0)
            findings.Add(Finding.Note(AgeModelCodes.Extrapolated,
                $"{firstInside} sample(s) of core {series.Id} ({Depth(series.Depths[0], series.Unit)} to {Depth(series.Depths[firstInside - 1], series.Unit)}) lie above the shallowest age control: their ages are extrapolated with the rate of the top segment.") with { Core = series.Id, Depth = series.Depths[0] });
        if (lastInside < series.Count - 1)
            findings.Add(Finding.Note(AgeModelCodes.Extrapolated,
                $"{series.Count - 1 - lastInside} sample(s) of core {series.Id} ({Depth(series.Depths[lastInside + 1], series.Unit)} to {Depth(series.Depths[^1], series.Unit)}) lie below the deepest age control: their ages are extrapolated with the rate of the bottom segment.") with { Core = series.Id, Depth = series.Depths[lastInside + 1] });
    }

    /// <summary>
    /// Warns of a calendar age or a varve count's anchor younger than its core's coring year by more than twice its
    /// error: no sediment is younger than its coring, so the age, its core or the coring year is wrong.
    /// </summary>
    private static void NoteAgesAfterCoring(Project p, FindingList findings)
    {
        var coring = p.Cores.Where(c => c.CoringYear is not null).ToDictionary(c => c.Id, c => c.CoringYear!.Value, StringComparer.Ordinal);
        if (coring.Count == 0) return;
        foreach (var spec in p.Ages)
        {
            (double Age, double Error, string[] Cores) control = spec switch
            {
                CalendarAgeControl { Core: { } core } cal => (cal.Age.YearsBP, cal.Error, [core]),
                CalendarAgeControl { Marker: { } marker } cal => (cal.Age.YearsBP, cal.Error,
                    p.Markers.FirstOrDefault(m => m.Id == marker)?.Depths.Select(d => d.CoreId).ToArray() ?? []),
                VarveCountControl v => (v.AnchorAge.YearsBP, v.AnchorError, [v.Core]),
                _ => (double.NaN, 0, []),
            };
            var (age, error, cores) = control;
            foreach (string core in cores)
            {
                if (!coring.TryGetValue(core, out int year)) continue;
                double surface = CalendarAge.FromYearCE(year).YearsBP;
                if (age < surface - 2 * error)
                    findings.Add(Finding.Warning(AgeModelCodes.AfterCoring,
                        $"age control {spec.Id} ({age.ToString("0.#", CultureInfo.InvariantCulture)} cal BP) is younger than core {core}'s coring year {year} CE ({surface.ToString("0.#", CultureInfo.InvariantCulture)} cal BP): no sediment is younger than its coring; check the age, its core or cores[{core}].coring_year.")
                        with { Item = spec.Id, Core = core });
            }
        }
    }

    private static string Depth(double v, DepthUnit unit) => v.ToString("0.###", CultureInfo.InvariantCulture) + " " + unit.Symbol();
    private static string Pct(double share) => (100 * share).ToString("0", CultureInfo.InvariantCulture);

    private static double Median(IEnumerable<double> values)
    {
        var sorted = values.ToArray();
        Array.Sort(sorted);
        return Statistics.PercentileSorted(sorted, 50);
    }
}
