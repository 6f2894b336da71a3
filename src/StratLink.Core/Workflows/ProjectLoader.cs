using System.Globalization;
using StratLink.Alignment;
using StratLink.Checks;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Tables;

namespace StratLink.Workflows;

/// <summary>
/// Reads a project file and every core table it names, then runs the checks that need the tables
/// (depths outside a core's sampled range, signals a table lacks). Bad input never throws: every
/// problem, unexpected IO errors included, is a finding in <see cref="LoadedProject.Problems"/>.
/// </summary>
public static class ProjectLoader
{
    public static LoadedProject Load(string path, CancellationToken ct = default)
    {
        var problems = new FindingList();
        ProjectDocument doc;
        try
        {
            doc = ProjectReader.Load(path);
        }
        catch (Exception e) when (e is not OperationCanceledException)
        {
            problems.AddError(ProjectCodes.Unreadable, $"cannot read the project file: {e.Message}", path);
            return new LoadedProject(new ProjectDocument(path, null, problems, new SourceMap(path)), new Project(), new Dictionary<string, CoreTable>(), problems);
        }
        problems.AddRange(doc.Problems);
        if (doc.Project is not { } project) return new LoadedProject(doc, new Project(), new Dictionary<string, CoreTable>(), problems);

        var paths = new FilePaths(doc, problems);
        var tableFiles = project.Cores.Select(c => paths.Check(c.Table, $"cores[{c.Id}].table", "table")).ToArray();
        foreach (var a in project.Ages)
        {
            switch (a)
            {
                case RadiocarbonAgeControl r:
                    paths.Check(r.Curve, $"ages[{a.Id}].curve", "calibration curve");
                    if (r.AtmosphericCurve is not null) paths.Check(r.AtmosphericCurve, $"ages[{a.Id}].atmospheric_curve", "calibration curve");
                    break;
                case VarveCountControl v:
                    paths.Check(v.Table, $"ages[{a.Id}].table", "varve table");
                    break;
            }
        }

        string? targetFile = project.Target is { Table.Length: > 0 } ts ? paths.Check(ts.Table, "target.table", "target table") : null;
        string? targetAgeFile = project.Target?.AgeModel is { Table.Length: > 0 } tam ? paths.Check(tam.Table, "target.age_model.table", "target age model table") : null;

        var tables = ReadTables(project, tableFiles, problems, ct);
        var checks = new TableChecks(project, tables, doc.Lines, problems);
        checks.DepthsInsideCores();
        checks.SignalsPresent();
        checks.EventLayers();
        var target = targetFile is null || (project.Target!.AgeModel is not null && targetAgeFile is null) ? null
            : ReadTarget(targetFile, targetAgeFile, project, tables, doc.Lines, problems, ct);
        return new LoadedProject(doc, project, tables, problems) { Target = target };
    }

    /// <summary>
    /// The target's table read like a core's (its age column in place of depth; or, for a target on depth, its
    /// depths dated by its age model), cut to its age span, in years; null with an error naming the <c>target</c>
    /// key when it is unusable.
    /// </summary>
    private static DatedTargetRecord? ReadTarget(string file, string? ageModelFile, Project project, IReadOnlyDictionary<string, CoreTable> tables, SourceMap lines,
        FindingList problems, CancellationToken ct)
    {
        var spec = project.Target!;
        void Error(string key, string code, string message) => problems.AddError(code, message, lines.File, lines.LineOf("target." + key) ?? lines.LineOf("target"), "target." + key);
        string coresText = string.Join(", ", project.TargetCoreIds.Select(c => $"'{c}'"));
        foreach (string core in project.TargetCoreIds)
            if (tables.TryGetValue(core, out var t) && !t.Signals.ContainsKey(spec.Signal))
                Error("signal", ProjectCodes.UnknownSignal, $"the target is aligned on signal '{spec.Signal}', which core '{core}' does not have; its signals: {string.Join(", ", t.SignalNames)}");
        // Every numeric column is read, so a message about a missing one can list those the table has.
        var columns = new CoreSpec
        {
            Id = "target",
            Table = spec.Table,
            DepthColumn = spec.DepthColumn ?? spec.AgeColumn,
            HeaderLine = spec.HeaderLine,
            Columns = spec.Columns,
            RepeatedDepths = spec.RepeatedDepths,
        };
        CoreTable? table;
        try
        {
            table = CoreTableReader.Read(file, columns, project.DepthUnit, problems, ct);
        }
        catch (Exception e) when (e is not OperationCanceledException)
        {
            problems.AddError(ProjectCodes.Unreadable, $"cannot read the target table: {e.Message}", file);
            return null;
        }
        if (table is null) return null;
        if (!table.Signals.TryGetValue(spec.Signal, out var values))
        {
            Error("signal", ProjectCodes.UnknownSignal, $"the target table has no numeric column for signal '{spec.Signal}' (map a column onto it under target.columns); it has: {string.Join(", ", table.SignalNames)}");
            return null;
        }
        double[]? errors = null;
        if (spec.AgeErrorColumn is { } errorColumn && !table.Signals.TryGetValue(errorColumn, out errors))
        {
            Error("age_error_column", ProjectCodes.TableMissingColumn, $"the target table has no numeric column '{errorColumn}'; it has: {string.Join(", ", table.SignalNames)}");
            return null;
        }
        double[] ages = table.Depths;
        if (spec.AgeModel is { } model)
        {
            var dated = MasterCoreAges.Read(ageModelFile!, model, table, project.DepthUnit, lines, problems, ct);
            if (dated is null) return null;
            (ages, var modelErrors) = dated.Value;
            errors ??= modelErrors;
        }
        double young = spec.AgeSpan?.Young ?? double.NegativeInfinity, old = spec.AgeSpan?.Old ?? double.PositiveInfinity;
        var keep = Enumerable.Range(0, table.Count)
            .Where(i => ages[i] >= young && ages[i] <= old && double.IsFinite(values[i]) && (errors is null || double.IsFinite(errors[i]))).ToArray();
        if (keep.Length < 2)
        {
            Error(spec.AgeSpan is null ? "table" : "age_span", ProjectCodes.TableEmpty, $"the target has {keep.Length} row(s) with an age and a value of '{spec.Signal}'{(spec.AgeSpan is null ? "" : " inside its age span")}; aligning {coresText} to it needs at least two");
            return null;
        }
        double scale = spec.YearsPerUnit;
        return new DatedTargetRecord(keep.Select(i => ages[i] * scale).ToArray(), keep.Select(i => values[i]).ToArray(),
            errors is null ? null : keep.Select(i => errors[i] * scale).ToArray());
    }

    /// <summary>Reads the cores' tables in parallel; findings are merged in core order so output does not depend on timing.</summary>
    private static Dictionary<string, CoreTable> ReadTables(Project project, string?[] files, FindingList problems, CancellationToken ct)
    {
        var cores = project.Cores;
        var results = new CoreTable?[cores.Count];
        var found = new FindingList[cores.Count];
        Parallel.For(0, cores.Count, new ParallelOptions { CancellationToken = ct }, i =>
        {
            found[i] = [];
            if (files[i] is not string file) return;
            try
            {
                results[i] = CoreTableReader.Read(file, cores[i], project.DepthUnit, found[i], ct);
            }
            catch (Exception e) when (e is not OperationCanceledException)
            {
                found[i].AddError(ProjectCodes.Unreadable, $"cannot read the table of core '{cores[i].Id}': {e.Message}", file);
            }
        });
        var tables = new Dictionary<string, CoreTable>(StringComparer.Ordinal);
        for (int i = 0; i < cores.Count; i++)
        {
            problems.AddRange(found[i]);
            if (results[i] is { } t) tables.TryAdd(cores[i].Id, t);
        }
        return tables;
    }

    /// <summary>Resolves the file paths of a project: a missing file is an error, one outside the project folder a note.</summary>
    private sealed class FilePaths(ProjectDocument doc, FindingList problems)
    {
        private readonly string _folder = Path.TrimEndingDirectorySeparator(doc.Directory) + Path.DirectorySeparatorChar;

        /// <summary>The full path when the file exists, else null (and an error).</summary>
        public string? Check(string relative, string key, string what)
        {
            int? line = doc.Lines.LineOf(key);
            string full;
            try
            {
                full = doc.Resolve(relative);
            }
            catch (Exception e) when (e is ArgumentException or NotSupportedException or PathTooLongException)
            {
                problems.AddError(ProjectCodes.InvalidValue, $"'{relative}' is not a usable file path: {e.Message}", doc.FilePath, line, key);
                return null;
            }
            if (!full.StartsWith(_folder, StringComparison.Ordinal))
                problems.AddNote(ProjectCodes.PathOutsideProject,
                    $"the {what} '{relative}' lies outside the project folder; it is read, but the project breaks if the folder is moved or shared alone", doc.FilePath, line, key);
            if (File.Exists(full)) return full;
            string reason = Directory.Exists(full) ? "is a folder, not a file" : "does not exist";
            problems.AddError(ProjectCodes.MissingFile, $"the {what} '{relative}' {reason} (looked for {full})", doc.FilePath, line, key);
            return null;
        }
    }

    /// <summary>Checks of the project file against the tables it names.</summary>
    private sealed class TableChecks(Project project, IReadOnlyDictionary<string, CoreTable> tables, SourceMap lines, FindingList problems)
    {
        private readonly string _unit = project.DepthUnit.Symbol();

        public void DepthsInsideCores()
        {
            foreach (var m in project.Markers)
                foreach (var d in m.Depths)
                    if (Outside(d.CoreId, d.Depth, out string range))
                        Add(Severity.Error, $"markers[{m.Id}].depths.{d.CoreId}", d.CoreId, m.Id, d.Depth,
                            $"marker '{m.Id}' at {Show(d.Depth)} lies outside core '{d.CoreId}''s sampled range {range} (check the depth and the depth unit)");
            foreach (var a in project.Ages)
            {
                var (core, depth, key) = a switch
                {
                    CalendarAgeControl { Core: string c, Depth: CoreDepth dd } => (c, dd, "depth"),
                    RadiocarbonAgeControl r => (r.Core, r.Depth, "depth"),
                    VarveCountControl v => (v.Core, v.AnchorDepth, "anchor_depth"),
                    _ => ((string?)null, default(CoreDepth), ""),
                };
                // Ages may sit just beyond the samples (a core-top age above the first sample): a warning, the model extrapolates.
                if (core is not null && Outside(core, depth, out string range))
                    Add(Severity.Warning, $"ages[{a.Id}].{key}", core, a.Id, depth,
                        $"age control '{a.Id}' at {Show(depth)} lies outside core '{core}''s sampled range {range}");
            }
            foreach (var c in project.Cores)
            {
                Intervals(c, c.Gaps, "gaps", "gap");
                Intervals(c, c.Disturbed, "disturbed", "disturbed interval");
                Intervals(c, c.Events, "events", "event layer");
                for (int k = 0; k < c.Sections.Count; k++)
                    if (Outside(c.Id, c.Sections[k].Top, out string range))
                        Add(Severity.Warning, $"cores[{c.Id}].sections[{k}].top", c.Id, c.Sections[k].Id, c.Sections[k].Top,
                            $"section '{c.Sections[k].Id}' starts at {Show(c.Sections[k].Top)}, outside core '{c.Id}''s sampled range {range}, so no sample lies in it");
            }
        }

        /// <summary>
        /// Event layers against the rest of the core: one overlapping a gap (nothing was recovered there to be an event),
        /// one thicker than the core's sampled length, a marker of an event kind whose depth lies in no event layer of a
        /// core that lists its event layers, and uncertain-count intervals of a varve count outside its core.
        /// </summary>
        public void EventLayers()
        {
            foreach (var c in project.Cores)
            {
                for (int k = 0; k < c.Events.Count; k++)
                {
                    var e = c.Events[k];
                    foreach (var g in c.Gaps.Where(g => g.Top < e.Bottom && g.Bottom > e.Top))
                        Add(Severity.Error, $"cores[{c.Id}].events[{k}]", c.Id, null, e.Top,
                            $"event layer {e} of core '{c.Id}' overlaps its gap {g}: no sediment was recovered there", ProjectCodes.EventInGap);
                    if (tables.TryGetValue(c.Id, out var t) && t.Count > 1 && e.Length > t.Depths[^1] - t.Depths[0])
                        Add(Severity.Error, $"cores[{c.Id}].events[{k}]", c.Id, null, e.Top,
                            $"event layer {e} is thicker than core '{c.Id}''s sampled range {Range(t)}", ProjectCodes.EventThickerThanCore);
                }
                if (c.Events.Count == 0) continue;
                foreach (var m in project.Markers.Where(m => m.Kind is MarkerKind.Tephra or MarkerKind.Turbidite or MarkerKind.Flood or MarkerKind.Event))
                    if (m.DepthIn(c.Id) is { } d && !c.Events.Any(e => d >= e.Top && d <= e.Bottom))
                        Add(Severity.Warning, $"markers[{m.Id}].depths.{c.Id}", c.Id, m.Id, d,
                            $"{m.Kind.Name()} marker '{m.Id}' at {Show(d)} lies in none of core '{c.Id}''s event layers: list the layer under the core's events, or check the depth", ProjectCodes.MarkerOutsideEvent);
            }
            foreach (var v in project.Ages.OfType<VarveCountControl>())
                for (int k = 0; k < v.Uncertain.Count; k++)
                    if (tables.TryGetValue(v.Core, out var t) && t.Count > 0
                        && (v.Uncertain[k].Interval.Top.In(t.Unit) < t.Depths[0] || v.Uncertain[k].Interval.Bottom.In(t.Unit) > t.Depths[^1]))
                        Add(Severity.Error, $"ages[{v.Id}].uncertain[{k}]", v.Core, v.Id, v.Uncertain[k].Interval.Top,
                            $"uncertain-count interval {v.Uncertain[k].Interval} of varve count '{v.Id}' reaches outside core '{v.Core}''s sampled range {Range(t)}", ProjectCodes.VarvesOutsideCore);
        }

        public void SignalsPresent()
        {
            foreach (var c in project.Cores)
            {
                if (!tables.TryGetValue(c.Id, out var t)) continue;
                foreach (string s in c.Signals.Where(s => s != c.DepthColumn && !t.Signals.ContainsKey(s)))
                    Add(Severity.Error, $"cores[{c.Id}].signals", c.Id, s, null,
                        $"core '{c.Id}' names signal '{s}' but its table has no numeric column '{s}'; it has: {List(t)}", ProjectCodes.UnknownSignal);
            }
            foreach (var w in project.Alignment.Signals)
                foreach (var c in project.Cores)
                    if (tables.TryGetValue(c.Id, out var t) && !t.Signals.ContainsKey(w.Signal))
                        Add(Severity.Error, $"alignment.signals.{w.Signal}", c.Id, w.Signal, null,
                            $"the alignment uses signal '{w.Signal}', which core '{c.Id}' does not have; its signals: {List(t)}", ProjectCodes.UnknownSignal);
        }

        private void Intervals(CoreSpec c, IReadOnlyList<DepthInterval> intervals, string key, string what)
        {
            if (!tables.TryGetValue(c.Id, out var t) || t.Count == 0) return;
            for (int k = 0; k < intervals.Count; k++)
            {
                var iv = intervals[k];
                if (iv.Bottom.In(t.Unit) >= t.Depths[0] && iv.Top.In(t.Unit) <= t.Depths[^1]) continue;
                Add(Severity.Warning, $"cores[{c.Id}].{key}[{k}]", c.Id, null, iv.Top,
                    $"{what} {iv} lies wholly outside core '{c.Id}''s sampled range {Range(t)}");
            }
        }

        private bool Outside(string coreId, CoreDepth depth, out string range)
        {
            range = "";
            if (!tables.TryGetValue(coreId, out var t) || t.Count == 0) return false;
            double d = depth.In(t.Unit);
            if (d >= t.Depths[0] && d <= t.Depths[^1]) return false;
            range = Range(t);
            return true;
        }

        private string Range(CoreTable t) => $"{Num(t.Depths[0])}-{Num(t.Depths[^1])} {_unit}";
        private string Show(CoreDepth d) => $"{Num(d.In(project.DepthUnit))} {_unit}";
        private static string Num(double v) => v.ToString("0.###", CultureInfo.InvariantCulture);
        private static string List(CoreTable t) => t.Signals.Count == 0 ? "(none)" : string.Join(", ", t.SignalNames);

        private void Add(Severity severity, string key, string core, string? item, CoreDepth? depth, string message, string code = ProjectCodes.DepthOutsideCore) =>
            problems.Add(new Finding
            {
                Severity = severity, Code = code, Message = message, Core = core, Item = item,
                Depth = depth?.In(project.DepthUnit), File = lines.File, Line = lines.LineOf(key), Field = key,
            });
    }
}
