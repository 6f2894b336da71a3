using StratLink.Checks;
using StratLink.Model;
using StratLink.Quantities;
using StratLink.Tables;
using StratLink.Workflows;

namespace StratLink.Alignment;

/// <summary>
/// Aligns every core of a project to the reference core: the one entry point of both methods,
/// <c>dtw</c> (default) and <c>ties</c> (straight lines between marker ties). With three or more
/// cores aligned by dtw, the site scale (<c>alignment.scale: site</c>) then aligns each
/// again to the stack of the others (<see cref="SiteAligner"/>). Cores run in parallel;
/// results are the same whatever the scheduling (each core's randomness is seeded from the run's
/// seed and its id).
/// </summary>
public static class CoreAligner
{
    /// <summary>The dtw grid step: <c>alignment.step</c>, or the reference core's median sample spacing (NaN with fewer than two samples).</summary>
    public static double GridStep(AlignmentSettings settings, CoreTable reference) => settings.Step ?? SignalPreparation.MedianSpacing(reference.Depths);

    public static AlignmentResult Align(LoadedProject project, IProgress<WorkProgress>? progress, CancellationToken ct)
    {
        var p = project.Project;
        var settings = p.Alignment;
        string reference = p.ReferenceCoreId;
        if (p.FindCore(reference) is null) throw new InvalidOperationException($"The reference core '{reference}' is not among the project's cores.");
        var findings = new FindingList();
        var network = TieNetwork.Build(p, project.Tables, findings);
        int seed = settings.Seed ?? p.AgeModel.Seed;
        var cores = p.Cores.Where(c => c.Id != reference).ToList();
        var mappings = new MappingEnsemble?[cores.Count];
        var diagnostics = new CoreAlignmentDiagnostics?[cores.Count];
        var coreFindings = new FindingList[cores.Count];
        for (int k = 0; k < cores.Count; k++) coreFindings[k] = [];

        PreparedSignals? refSignals = null;
        double step = 0;
        if (settings.Method == AlignmentMethods.Dtw)
        {
            if (!project.Tables.TryGetValue(reference, out var refTable))
                throw new InvalidOperationException($"The table of the reference core {reference} could not be read; alignment by dtw needs it.");
            step = GridStep(settings, refTable);
            if (!(step > 0)) throw new InvalidOperationException($"Reference core {reference} has too few samples to set a grid step; give alignment.step.");
            var refSpec = p.FindCore(reference)!;
            refSignals = StageTimes.Measure("prepare", () => SignalPreparation.Prepare(refTable, Unusable(refSpec), CandidateSignals(refSpec, refTable, settings), step, settings));
        }

        // The site scale starts from the optimal mappings to the reference and samples its ensemble
        // only against the settled stack, so the first pass asks for none.
        bool site = settings.Method == AlignmentMethods.Dtw && settings.Scale == AlignmentScales.Site && cores.Count >= 2;
        int done = 0;
        progress?.Report(new WorkProgress("alignment", 0));
        Parallel.For(0, cores.Count, new ParallelOptions { CancellationToken = ct }, k =>
        {
            var spec = cores[k];
            var local = coreFindings[k];
            (mappings[k], diagnostics[k]) = settings.Method == AlignmentMethods.Dtw
                ? AlignByDtw(project, spec, refSignals!, step, network, seed, site ? 0 : settings.Ensemble, local, ct)
                : ByTies(p, spec, network, project.Tables, local);
            int now = Interlocked.Increment(ref done);
            progress?.Report(new WorkProgress("alignment", (double)now / cores.Count, spec.Id));
        });

        var result = new Dictionary<string, MappingEnsemble>(StringComparer.Ordinal);
        var diag = new Dictionary<string, CoreAlignmentDiagnostics>(StringComparer.Ordinal);
        var (rTop, rBottom) = Extent(project.Tables, reference);
        result[reference] = new MappingEnsemble(DepthMapping.Identity(reference, p.DepthUnit, rTop, rBottom), []);
        diag[reference] = new CoreAlignmentDiagnostics { CoreId = reference, Method = "identity" };
        for (int k = 0; k < cores.Count; k++)
        {
            result[cores[k].Id] = mappings[k]!;
            diag[cores[k].Id] = diagnostics[k]!;
        }
        if (site)
            AlignToSite(project, cores, refSignals!, step, network, seed, result, diag, coreFindings, findings, ct);
        else
            foreach (var f in coreFindings) findings.AddRange(f);
        return new AlignmentResult(reference, settings.Method, result, findings, diag, settings.Method == AlignmentMethods.Dtw ? seed : null);
    }

    private static (MappingEnsemble, CoreAlignmentDiagnostics) AlignByDtw(LoadedProject project, CoreSpec spec, PreparedSignals refSignals, double step,
        TieNetwork network, int seed, int ensemble, FindingList findings, CancellationToken ct)
    {
        var p = project.Project;
        var settings = p.Alignment;
        if (!project.Tables.TryGetValue(spec.Id, out var table))
        {
            findings.Add(Warn("alignment.no-table", spec.Id, $"the table of core {spec.Id} could not be read; it is placed by its marker ties only"));
            return ByTies(p, spec, network, project.Tables, findings);
        }
        var (names, weights) = SharedSignals(spec, table, settings, refSignals);
        if (names.Count == 0)
        {
            findings.Add(Warn("alignment.no-common-signal", spec.Id, $"core {spec.Id} shares no alignment signal with reference {refSignals.CoreId}; it is placed by its marker ties only"));
            return ByTies(p, spec, network, project.Tables, findings);
        }
        try
        {
            var coreSignals = StageTimes.Measure("prepare", () => SignalPreparation.Prepare(table, Unusable(spec), names, step, settings));
            var ties = network.TiesOf(spec.Id);
            if (ties.Count == 0)
                findings.Add(new Finding { Severity = Severity.Note, Code = "alignment.dtw-only", Core = spec.Id, Message = $"core {spec.Id} shares no marker with the reference or a tied core; it is aligned by its signals alone" });
            using (StageTimes.Measure("align"))
                return DtwCoreAligner.Align(coreSignals, refSignals.Select(names), [.. weights], ties, DtwCoreOptions.From(settings, seed) with { Ensemble = ensemble }, p.DepthUnit, findings, ct);
        }
        catch (Exception e) when (e is InvalidOperationException or ArgumentException)
        {
            findings.Add(Warn("alignment.dtw-failed", spec.Id, $"core {spec.Id} could not be aligned by dtw ({e.Message}); it is placed by its marker ties only"));
            return ByTies(p, spec, network, project.Tables, findings);
        }
    }

    /// <summary>The core's alignment signals that the reference also has, with their weights (none of weight 0).</summary>
    private static (List<string> Names, List<double> Weights) SharedSignals(CoreSpec spec, CoreTable table, AlignmentSettings settings, PreparedSignals refSignals)
    {
        var names = new List<string>();
        var weights = new List<double>();
        foreach (string name in CandidateSignals(spec, table, settings))
        {
            if (Array.IndexOf(refSignals.Signals, name) < 0) continue;
            double w = settings.Signals.Count == 0 ? 1 : settings.Signals.First(s => s.Signal == name).Weight;
            if (w <= 0) continue;
            names.Add(name);
            weights.Add(w);
        }
        return (names, weights);
    }

    /// <summary>
    /// Site scale: the cores aligned by dtw aligned again, each to the stack of all the others, until
    /// the mappings settle; their findings are those of the final round.
    /// </summary>
    private static void AlignToSite(LoadedProject project, List<CoreSpec> cores, PreparedSignals refSignals, double step, TieNetwork network, int seed,
        Dictionary<string, MappingEnsemble> result, Dictionary<string, CoreAlignmentDiagnostics> diag, FindingList[] coreFindings, FindingList findings, CancellationToken ct)
    {
        var p = project.Project;
        var members = new List<SiteAligner.Member>();
        for (int k = 0; k < cores.Count; k++)
        {
            var spec = cores[k];
            if (diag[spec.Id].Method != "dtw" || !project.Tables.TryGetValue(spec.Id, out var table)) continue;
            var (names, weights) = SharedSignals(spec, table, p.Alignment, refSignals);
            members.Add(new SiteAligner.Member(spec.Id, SignalPreparation.Prepare(table, Unusable(spec), names, step, p.Alignment), [.. weights], network.TiesOf(spec.Id)));
        }
        if (members.Count < 2)
        {
            // Too few cores aligned by dtw for a stack: they keep their alignment to the reference, now with the ensemble.
            for (int k = 0; k < cores.Count; k++)
            {
                if (members.Any(m => m.CoreId == cores[k].Id))
                {
                    coreFindings[k] = [];
                    (result[cores[k].Id], diag[cores[k].Id]) = AlignByDtw(project, cores[k], refSignals, step, network, seed, p.Alignment.Ensemble, coreFindings[k], ct);
                }
                findings.AddRange(coreFindings[k]);
            }
            return;
        }
        for (int k = 0; k < cores.Count; k++)
            if (!members.Any(m => m.CoreId == cores[k].Id)) findings.AddRange(coreFindings[k]);
        var (rounds, settled) = SiteAligner.Refine(refSignals, members, result, diag, DtwCoreOptions.From(p.Alignment, seed), p.DepthUnit, findings, ct);
        if (!settled)
            findings.Add(new Finding
            {
                Severity = Severity.Note,
                Code = "alignment.site-unsettled",
                Core = refSignals.CoreId,
                Message = $"aligning every core to the stack of the others had not settled to one grid step after {rounds} rounds; the last round's mappings are used",
            });
    }

    /// <summary>The <c>ties</c> method for one core: its straight-line-ties mapping, or the identity (with a warning) when it has no ties.</summary>
    private static (MappingEnsemble, CoreAlignmentDiagnostics) ByTies(Project p, CoreSpec spec, TieNetwork network, IReadOnlyDictionary<string, CoreTable> tables, FindingList findings)
    {
        if (network.LineOf(spec.Id) is { } line)
            return (new MappingEnsemble(line, []), new CoreAlignmentDiagnostics { CoreId = spec.Id, Method = "ties", Ties = network.TiesOf(spec.Id).Count, Optimal = line });
        findings.Add(Warn("alignment.untied", spec.Id, $"core {spec.Id} shares no marker with the reference or any tied core; its depths are used as composite depths unchanged"));
        var (top, bottom) = Extent(tables, spec.Id);
        var identity = DepthMapping.Identity(spec.Id, p.DepthUnit, top, bottom);
        return (new MappingEnsemble(identity, []), new CoreAlignmentDiagnostics { CoreId = spec.Id, Method = "identity", Optimal = identity });
    }

    /// <summary>Alignment signals of a core: the project's weighted list, else the core's own list, else every signal column.</summary>
    private static List<string> CandidateSignals(CoreSpec spec, CoreTable table, AlignmentSettings settings)
    {
        IEnumerable<string> names = settings.Signals.Count > 0 ? settings.Signals.Select(s => s.Signal)
            : spec.Signals.Count > 0 ? spec.Signals : table.SignalNames;
        return names.Where(n => table.Signals.ContainsKey(n)).ToList();
    }

    private static List<DepthInterval> Unusable(CoreSpec spec) => [.. spec.Gaps, .. spec.Disturbed];

    private static (double Top, double Bottom) Extent(IReadOnlyDictionary<string, CoreTable> tables, string core)
    {
        if (tables.TryGetValue(core, out var t) && t.Count > 0 && t.Depths[^1] > t.Depths[0]) return (t.Depths[0], t.Depths[^1]);
        return (0, 1);
    }

    private static Finding Warn(string code, string core, string message) =>
        new() { Severity = Severity.Warning, Code = code, Core = core, Message = message };
}
