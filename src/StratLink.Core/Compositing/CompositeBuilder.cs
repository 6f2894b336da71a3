using StratLink.AgeModelling;
using StratLink.Alignment;
using StratLink.Checks;
using StratLink.Quantities;
using StratLink.Workflows;

namespace StratLink.Compositing;

/// <summary>
/// Builds the composite: the reference core's depth scale extended by the other cores through their
/// mappings (composite depth, CCSF-A in the IODP terms of methods.md section 5), the splice, the
/// stacked records with their bands, and ages on the composite.
/// </summary>
public static class CompositeBuilder
{
    public const string NoTable = "composite.no-table";
    public const string NoMapping = "composite.no-mapping";
    public const string NoZScore = "composite.no-zscore";

    /// <summary>Builds the composite of every core that has both a table and a mapping.</summary>
    /// <param name="ages">The age model on composite depth; null leaves the ages empty.</param>
    /// <exception cref="ArgumentException">No core has both a table and a mapping.</exception>
    public static CompositeResult Build(LoadedProject project, AlignmentResult alignment, ICompositeAgeScale? ages,
        IProgress<WorkProgress>? progress, CancellationToken ct)
    {
        var model = project.Project;
        var settings = model.Composite;
        var unit = model.DepthUnit;
        var findings = new FindingList();
        string reference = alignment.ReferenceCore;

        progress?.Report(new WorkProgress("composite: mappings", 0));
        var specs = model.Cores.OrderBy(c => c.Id == reference ? 0 : 1).ToList();
        var signals = new List<string>();
        var prepared = new List<(Model.CoreSpec Spec, Tables.CoreTable Table, MappingEnsemble Ensemble, List<string> Signals)>();
        foreach (var spec in specs)
        {
            if (!project.Tables.TryGetValue(spec.Id, out var table) || table.Count == 0)
            {
                findings.Add(CoreFinding(NoTable, spec.Id, $"Core {spec.Id} has no readable samples; it is left out of the composite."));
                continue;
            }
            if (!alignment.Mappings.TryGetValue(spec.Id, out var ensemble))
            {
                if (spec.Id != reference)
                {
                    findings.Add(CoreFinding(NoMapping, spec.Id, $"Core {spec.Id} has no mapping to the reference core {reference}; it is left out of the composite."));
                    continue;
                }
                // The reference core defines composite depth: its own depths, by identity.
                ensemble = new MappingEnsemble(DepthMapping.Identity(spec.Id, unit, table.Depths[0], Math.Max(table.Depths[^1], table.Depths[0] + 1)), []);
            }
            var own = (spec.Signals.Count > 0 ? spec.Signals.Where(table.Signals.ContainsKey) : table.SignalNames).ToList();
            foreach (string s in own) if (!signals.Contains(s)) signals.Add(s);
            prepared.Add((spec, table, ensemble, own));
        }
        if (prepared.Count == 0)
            throw new ArgumentException($"No core of {project.FilePath} has both readable samples and a mapping to the reference core; there is nothing to composite.");

        var cores = prepared.Select((p, i) => new CompositeCore(i, p.Spec, p.Table, p.Ensemble, p.Signals, settings.Standardise, unit, settings.KeepEvents)).ToList();
        if (settings.Standardise)
            foreach (var core in cores)
                foreach (var (name, samples) in core.Samples)
                    if (samples.Depths.Length == 0 && !(samples.Scale > 0))
                        findings.Add(CoreFinding(NoZScore, core.Id, $"Signal {name} of core {core.Id} has fewer than two distinct usable values, so it has no z-score and is left out of the standardised stack."));

        var mappings = new CoreMappingTable[cores.Count];
        Parallel.For(0, cores.Count, new ParallelOptions { CancellationToken = ct }, c => mappings[c] = MappingTables.Build(cores[c], ct));

        double top = mappings.Min(m => m.Median[0]);
        double bottom = mappings.Max(m => m.Median[m.Count - 1]);
        var grid = CompositeGrid.Spanning(unit, settings.Step, top, bottom);

        progress?.Report(new WorkProgress("composite: splice", 0));
        var splice = settings.Splice is { } manual
            ? ManualSplice.Check(grid, manual, cores, project.Document.Lines, findings)
            : AutomaticSplicer.Choose(grid, cores, mappings, findings, ct);

        var records = Stacker.Stack(grid, cores, signals, splice, settings.Standardise, progress, ct);

        CompositeAges? onComposite = null;
        if (ages is not null)
        {
            progress?.Report(new WorkProgress("composite: ages", 0));
            var med = new double[grid.Count];
            var lo = new double[grid.Count];
            var hi = new double[grid.Count];
            var depths = new CompositeDepth[grid.Count];
            for (int r = 0; r < grid.Count; r++) depths[r] = grid.DepthAt(r);
            ages.AgesAt(depths, med, lo, hi, ct);
            onComposite = new CompositeAges(med, lo, hi);
        }
        progress?.Report(new WorkProgress("composite", 1));
        return new CompositeResult(reference, grid, splice, records, onComposite, mappings, settings.Standardise, findings);
    }

    private static Finding CoreFinding(string code, string core, string message) =>
        new() { Severity = Severity.Warning, Code = code, Core = core, Message = message };
}
