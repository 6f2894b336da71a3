using System.Collections.Immutable;
using System.Globalization;
using System.Text;
using System.Text.RegularExpressions;
using StratLink.Checks;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Tables;

namespace StratLink.Workflows;

/// <summary>
/// Turns a folder or a list of core tables into a project file: sniffs each table, proposes core ids
/// from the file names, finds the signals common to the cores (a column named differently but meaning
/// the same signal is mapped onto one name), picks the longest core as the reference and writes a
/// commented project that reads without errors. Behind <c>stratlink new</c> and the dashboard's
/// "new project from tables".
/// </summary>
public static partial class NewProjectWorkflow
{
    /// <summary>File endings read as tables when a folder is given.</summary>
    public static readonly string[] TableExtensions = [".csv", ".tsv", ".txt", ".tab", ".dat"];

    /// <summary>One table as it will enter the project.</summary>
    public sealed record CoreDraft(string File, CoreSpec Spec, TableProbe.Result Probe, ArchiveMetadata Metadata,
        int Rows, int Repeats, double Top, double Bottom, IReadOnlyList<string> NotSignals);

    /// <summary>The project about to be written, or the problems that stop it (<see cref="Problems"/> has errors).</summary>
    public sealed record Plan(string ProjectPath, DepthUnit Unit, IReadOnlyList<CoreDraft> Cores, IReadOnlyList<string> Signals,
        string? Reference, double Step, IReadOnlyList<string> Skipped, FindingList Problems, string Yaml)
    {
        public bool CanWrite => !Problems.HasErrors && Yaml.Length > 0;
    }

    /// <summary>Reads the tables and drafts the project; writes nothing.</summary>
    public static Plan Draft(IReadOnlyList<string> inputs, string? projectPath, CancellationToken ct = default)
    {
        var problems = new FindingList();
        var skipped = new List<string>();
        var files = TableFiles(inputs, problems);
        string project = Path.GetFullPath(projectPath ?? DefaultProjectPath(inputs));
        string projectDir = Path.GetDirectoryName(project)!;
        Plan Fail() => new(project, DepthUnit.Centimetre, [], [], null, 0, skipped, problems, "");
        if (problems.HasErrors) return Fail();
        if (files.Count == 0)
        {
            problems.AddError(ProjectCodes.MissingFile, $"no table files ({string.Join(", ", TableExtensions)}) found in {string.Join(", ", inputs)}", inputs.FirstOrDefault());
            return Fail();
        }

        var probed = new List<(string File, TableProbe.Result Probe)>();
        foreach (string f in files)
        {
            ct.ThrowIfCancellationRequested();
            var p = TableProbe.Probe(f);
            if (p.DepthColumn is null)
            {
                if (TableProbe.IsLayerTable(p.Columns.Count > 0 ? p.Columns : HeaderGuess(f)))
                {
                    skipped.Add($"{Path.GetFileName(f)}: a layer table (depth_top, depth_bottom), e.g. varve counts; add it under ages as a varve-count control");
                    continue;
                }
                problems.AddError(ProjectCodes.TableNoHeader,
                    "no column named like a depth (depth, depth [m], depth_cm, mcd, mbsf ...) with a number under it; rename the depth column or leave the file out", f);
                continue;
            }
            probed.Add((f, p));
        }
        if (problems.HasErrors) return Fail();

        var units = probed.Select(p => p.Probe.Unit).Where(u => u is not null).Distinct().ToList();
        if (units.Count > 1)
        {
            problems.AddError(ProjectCodes.UnknownUnit,
                $"the tables give depths in different units ({string.Join("; ", probed.Where(p => p.Probe.Unit is not null).Select(p => $"{Path.GetFileName(p.File)}: {p.Probe.Unit!.Value.Symbol()}"))}); one project holds one depth unit: convert the tables first",
                probed[0].File);
            return Fail();
        }

        var drafts = new List<CoreDraft>();
        DepthUnit unit = units.FirstOrDefault() ?? DepthUnit.Centimetre;
        foreach (var (file, probe) in probed)
            if (Draft(file, Path.GetFileNameWithoutExtension(file), probe, unit, projectDir, problems, skipped, ct) is { } d) drafts.Add(d);
        var ids = CoreIds(drafts.Select(d => d.File).ToList());
        drafts = drafts.Select((d, i) => d with { Spec = d.Spec with { Id = ids[i] } }).ToList();
        if (problems.HasErrors) return Fail();
        if (drafts.Count == 0)
        {
            problems.AddError(ProjectCodes.MissingFile, $"none of the files is a core table: {string.Join("; ", skipped)}", inputs.FirstOrDefault());
            return Fail();
        }
        // A depth unit named in an archive's metadata counts when no column name says it.
        string unitNote = units.Count > 0 ? UnitReason(drafts) : "no table names its depth unit: cm assumed (check)";
        if (units.Count == 0 && drafts.Select(d => d.Metadata.Units.GetValueOrDefault(d.Spec.DepthColumn)).FirstOrDefault(u => u is not null) is { } metaUnit
            && DepthUnits.TryParse(metaUnit, out var mu))
            (unit, unitNote) = (mu, "from the archive metadata");

        var signals = CommonSignals(drafts, out var renames);
        if (signals.Count == 0)
        {
            problems.AddError(ProjectCodes.UnknownSignal,
                $"the tables share no signal column, so the cores cannot be aligned: {string.Join("; ", drafts.Select(d => $"{Path.GetFileName(d.File)} has {List(SignalColumnsOf(d))}"))}",
                drafts[0].File);
            return Fail();
        }
        drafts = drafts.Select(d => d with
        {
            Spec = d.Spec with
            {
                Signals = [.. signals],
                Columns = renames.GetValueOrDefault(d.Spec.Id) ?? ImmutableDictionary<string, string>.Empty,
                Units = d.Metadata.Units.Where(u => u.Key != d.Spec.DepthColumn && (signals.Contains(u.Key) || renames.GetValueOrDefault(d.Spec.Id)?.ContainsKey(u.Key) == true))
                    .ToImmutableDictionary(u => renames.GetValueOrDefault(d.Spec.Id)?.GetValueOrDefault(u.Key) ?? u.Key, u => u.Value, StringComparer.Ordinal),
            },
        }).ToList();

        var reference = drafts.OrderByDescending(d => d.Bottom - d.Top).ThenBy(d => d.Spec.Id, StringComparer.Ordinal).First();
        double step = NiceStep(reference);
        string yaml = ProjectText(Path.GetFileName(project).Split('.')[0], drafts, signals, reference.Spec.Id, step, unit, unitNote, skipped);

        // The text must read back without errors before anything is written.
        var doc = ProjectReader.Parse(yaml, project);
        foreach (var f in doc.Problems.Where(f => f.Severity == Severity.Error)) problems.Add(f);
        return new Plan(project, unit, drafts, signals, reference.Spec.Id, step, skipped, problems, problems.HasErrors ? "" : yaml);
    }

    /// <summary>Writes the drafted project (atomically; an existing file is never replaced) and the schema beside it.</summary>
    public static void Write(Plan plan)
    {
        if (!plan.CanWrite) throw new InvalidOperationException("The draft has problems; nothing can be written.");
        if (File.Exists(plan.ProjectPath)) throw new IOException($"{plan.ProjectPath} exists; choose another name (--out) or remove it first");
        Directory.CreateDirectory(Path.GetDirectoryName(plan.ProjectPath)!);
        string schema = Path.Combine(Path.GetDirectoryName(plan.ProjectPath)!, ProjectSchema.FileName);
        AtomicFile.WriteAllText(schema, ProjectSchema.Text, keepBackup: false);
        AtomicFile.WriteAllText(plan.ProjectPath, plan.Yaml, keepBackup: false);
    }

    private static CoreDraft? Draft(string file, string id, TableProbe.Result probe, DepthUnit unit, string projectDir, FindingList problems, List<string> skipped, CancellationToken ct)
    {
        string depth = probe.DepthColumn!;
        var layout = new TableLayout(probe.HeaderLine, probe.Delimiter, Encoding.UTF8, probe.Columns);
        var meta = ArchiveMetadataReader.Read(file, layout with { Encoding = SniffEncoding(file) });
        var missing = meta.MissingValue is { } mv ? ImmutableList.Create(mv) : [];
        var local = new FindingList();
        var table = DelimitedTextReader.Read(file, new DelimitedReadOptions { KeyColumn = depth, MissingValues = missing, TextColumns = [] }, local, ct);
        if (table is null)
        {
            problems.AddRange(local.Where(f => f.Severity == Severity.Error));
            return null;
        }
        var notSignals = table.Numeric.Keys.Where(k => k != depth && (TableProbe.IsSampleIdColumn(k) || TableProbe.IsAgeColumn(k))).ToList();
        var candidates = table.Numeric.Keys.Where(k => k != depth && !notSignals.Contains(k)).ToList();
        if (candidates.Count == 0)
        {
            skipped.Add($"{Path.GetFileName(file)}: no signal columns besides {List([depth, .. notSignals])} (an age-depth table?); add its ages under ages");
            return null;
        }
        var raw = table.Numeric[depth].Where(d => !double.IsNaN(d)).ToArray();
        bool sorted = raw.Zip(raw.Skip(1)).All(p => p.Second >= p.First);
        int repeats = raw.Length - raw.Distinct().Count();
        var spec = new CoreSpec
        {
            Id = id,
            Table = Path.GetRelativePath(projectDir, file).Replace('\\', '/'),
            DepthColumn = depth,
            Signals = [.. candidates],
            MissingValues = missing,
            Sort = !sorted,
            RepeatedDepths = repeats > 0 ? RepeatedDepths.Mean : RepeatedDepths.Error,
            Citation = meta.Citation,
            Latitude = meta.Latitude,
            Longitude = meta.Longitude,
        };
        // Read as the project will: the draft is only offered when its table reads without errors.
        var check = new FindingList();
        var core = CoreTableReader.Read(file, spec, unit, check, ct);
        if (core is null)
        {
            problems.AddRange(check.Where(f => f.Severity == Severity.Error));
            return null;
        }
        return new CoreDraft(file, spec, probe, meta, core.Count, repeats, core.Depths[0], core.Depths[^1], [.. notSignals, .. table.TextOnlyColumns]);
    }

    private static IEnumerable<string> SignalColumnsOf(CoreDraft d) => d.Spec.Signals;

    /// <summary>
    /// Signals present in every core, by the name most cores use; a column whose normalised name (lower
    /// case, units and punctuation dropped, common isotope spellings folded) matches is renamed onto it.
    /// </summary>
    private static List<string> CommonSignals(List<CoreDraft> drafts, out Dictionary<string, ImmutableDictionary<string, string>> renames)
    {
        renames = [];
        var byKey = drafts.Select(d => d.Spec.Signals.GroupBy(SignalKey).ToDictionary(g => g.Key, g => g.First())).ToList();
        var common = byKey[0].Keys.Where(k => byKey.All(m => m.ContainsKey(k))).ToList();
        var names = new List<string>();
        foreach (string key in common)
        {
            // The name most tables use, ties to the first table's; a bare name wins over one carrying units.
            string name = byKey.Select(m => m[key]).GroupBy(n => n).OrderByDescending(g => g.Count()).ThenBy(g => g.Key.Length).First().Key;
            if (TableProbe.Bare(name) != name.ToLowerInvariant()) name = CanonicalName(key, name);
            names.Add(name);
            for (int i = 0; i < drafts.Count; i++)
            {
                string column = byKey[i][key];
                if (column == name) continue;
                var r = renames.GetValueOrDefault(drafts[i].Spec.Id) ?? ImmutableDictionary<string, string>.Empty.WithComparers(StringComparer.Ordinal);
                renames[drafts[i].Spec.Id] = r.SetItem(column, name);
            }
        }
        return names;
    }

    private static string SignalKey(string column)
    {
        string k = NonAlnum().Replace(TableProbe.Bare(column).Replace('δ', 'd'), "");
        if (k.StartsWith("d18o", StringComparison.Ordinal) || k.StartsWith("delta18o", StringComparison.Ordinal) || k == "o18" || k.StartsWith("o18", StringComparison.Ordinal)) return "d18o";
        if (k.StartsWith("d13c", StringComparison.Ordinal) || k.StartsWith("delta13c", StringComparison.Ordinal) || k == "c13" || k.StartsWith("c13", StringComparison.Ordinal)) return "d13c";
        return k;
    }

    private static string CanonicalName(string key, string name) => key switch
    {
        "d18o" => "d18O",
        "d13c" => "d13C",
        _ => NonIdentifier().Replace(TableProbe.Bare(name), "_").Trim('_') is { Length: > 0 } n ? n : key,
    };

    /// <summary>Core ids from file names: the name without its extension, less the words every file shares at its end.</summary>
    private static List<string> CoreIds(List<string> files)
    {
        var words = files.Select(f => WordSplit().Split(Path.GetFileNameWithoutExtension(f)).Where(w => w.Length > 0).ToList()).ToList();
        int common = 0;
        if (files.Count > 1)
            while (words.All(w => w.Count > common + 1) && words.Select(w => w[^(common + 1)]).Distinct(StringComparer.OrdinalIgnoreCase).Count() == 1) common++;
        var ids = new List<string>();
        for (int i = 0; i < files.Count; i++)
        {
            string stem = Path.GetFileNameWithoutExtension(files[i]);
            string id = common == 0 ? stem : string.Join("-", words[i].Take(words[i].Count - common));
            id = BadIdChars().Replace(id, "-").Trim('-');
            if (id.Length == 0) id = $"core{i + 1}";
            string unique = id;
            for (int n = 2; ids.Contains(unique, StringComparer.Ordinal); n++) unique = $"{id}-{n}";
            ids.Add(unique);
        }
        return ids;
    }

    private static List<string> TableFiles(IReadOnlyList<string> inputs, FindingList problems)
    {
        var files = new List<string>();
        foreach (string input in inputs)
        {
            if (Directory.Exists(input))
                files.AddRange(Directory.GetFiles(input)
                    .Where(f => TableExtensions.Contains(Path.GetExtension(f).ToLowerInvariant()) && !Path.GetFileName(f).StartsWith('.'))
                    .Order(StringComparer.Ordinal));
            else if (File.Exists(input)) files.Add(Path.GetFullPath(input));
            else problems.AddError(ProjectCodes.MissingFile, "no such file or folder", input);
        }
        return files.Distinct(StringComparer.Ordinal).ToList();
    }

    private static string DefaultProjectPath(IReadOnlyList<string> inputs)
    {
        string first = Path.GetFullPath(inputs.Count > 0 ? inputs[0] : ".");
        string dir = Directory.Exists(first) ? first : Path.GetDirectoryName(first)!;
        string name = BadIdChars().Replace(Path.GetFileName(Path.TrimEndingDirectorySeparator(dir)), "-");
        return Path.Combine(dir, (name.Length > 0 ? name : "site") + ".stratlink.yaml");
    }

    private static string[] HeaderGuess(string file)
    {
        string? line = File.ReadLines(file).FirstOrDefault(l => l.Trim().Length > 0 && !l.TrimStart().StartsWith('#'));
        return line?.Split([',', ';', '\t', ' '], StringSplitOptions.RemoveEmptyEntries) ?? [];
    }

    private static Encoding SniffEncoding(string file)
    {
        using var s = TableSniffer.OpenRead(file);
        var head = new byte[Math.Min(s.Length, 64 * 1024)];
        s.ReadExactly(head);
        return TextDecoding.Detect(head);
    }

    /// <summary>About the reference core's median sample spacing, rounded down to 1, 2 or 5 times a power of ten.</summary>
    private static double NiceStep(CoreDraft reference)
    {
        double spacing = (reference.Bottom - reference.Top) / Math.Max(1, reference.Rows - 1);
        if (!(spacing > 0)) return 1;
        double p = Math.Pow(10, Math.Floor(Math.Log10(spacing)));
        double m = spacing / p;
        return Math.Round((m >= 5 ? 5 : m >= 2 ? 2 : 1) * p, 10);
    }

    private static string ProjectText(string siteName, List<CoreDraft> drafts, List<string> signals, string reference, double step, DepthUnit unit, string unitNote, List<string> skipped)
    {
        var w = new StringBuilder();
        w.AppendLine(ProjectSchema.ModelineComment);
        w.AppendLine($"# Drafted by 'stratlink new' from {drafts.Count} table(s). Review the lines marked (check), add");
        w.AppendLine("# markers and age controls, then run 'stratlink check' and 'stratlink build'.");
        w.AppendLine("# Every key: docs/project-file-reference.md.");
        foreach (string s in skipped) w.AppendLine($"# left out: {s}");
        w.AppendLine($"format: {Project.FormatName}");
        var located = drafts.FirstOrDefault(d => d.Metadata.Site is not null || d.Spec.Latitude is not null);
        w.AppendLine("site:");
        w.AppendLine($"  name: {Q(located?.Metadata.Site ?? siteName)}" + (located is null ? "          # (check)" : "          # from the archive metadata"));
        w.AppendLine($"depth_unit: {unit.Symbol()}" + $"                  # {unitNote}");
        w.AppendLine("cores:");
        foreach (var d in drafts)
        {
            var p = d.Probe;
            w.AppendLine($"  # {Path.GetFileName(d.File)}: {DelimiterName(p.Delimiter)}, decimal {(p.DecimalComma ? "comma" : "point")}, header on line {p.HeaderLine}, {d.Rows} samples, {N(d.Top)}-{N(d.Bottom)} {unit.Symbol()}"
                + (d.Metadata.Layout is { } l ? $", {(l == ArchiveMetadata.NoaaText ? "NOAA paleo text" : "/* */ data description")}" : ""));
            if (d.NotSignals.Count > 0) w.AppendLine($"  # not signals: {string.Join(", ", d.NotSignals)} (sample ids, ages or text)");
            var c = d.Spec;
            w.AppendLine($"  - id: {Q(c.Id)}" + (d.Spec.Id == reference ? "                 # the longest core: the reference" : ""));
            w.AppendLine($"    table: {Q(c.Table)}");
            if (c.DepthColumn != "depth") w.AppendLine($"    depth_column: {Q(c.DepthColumn)}");
            w.AppendLine($"    signals: [{string.Join(", ", c.Signals.Select(s => Q(s)))}]");
            if (c.Columns.Count > 0) w.AppendLine($"    columns: {{{string.Join(", ", c.Columns.OrderBy(x => x.Key, StringComparer.Ordinal).Select(x => $"{Q(x.Key)}: {Q(x.Value)}"))}}}   # table column: signal name (check)");
            if (c.MissingValues.Count > 0) w.AppendLine($"    missing_values: [{string.Join(", ", c.MissingValues.Select(v => Q(v, force: true)))}]");
            if (c.Sort) w.AppendLine("    sort: true                     # the rows are not in depth order");
            if (c.RepeatedDepths != RepeatedDepths.Error)
                w.AppendLine($"    repeated_depths: mean          # {d.Repeats} rows repeat a depth (replicates); or median, first, error");
            if (c.Units.Count > 0) w.AppendLine($"    units: {{{string.Join(", ", c.Units.OrderBy(x => x.Key, StringComparer.Ordinal).Select(x => $"{Q(x.Key)}: {Q(x.Value, force: true)}"))}}}");
            if (c.Citation is not null) w.AppendLine($"    citation: {Q(c.Citation, force: true)}");
            if (c.Latitude is double lat) w.AppendLine($"    latitude: {N(lat)}");
            if (c.Longitude is double lon) w.AppendLine($"    longitude: {N(lon)}");
            w.AppendLine("    gaps: []                       # no recovery: [top, bottom] (check)");
        }
        w.AppendLine("markers: []                        # marker layers seen in two or more cores: add them");
        w.AppendLine("ages: []                           # age controls: without them the build aligns and composites on depth only");
        w.AppendLine("alignment:");
        w.AppendLine($"  reference: {Q(reference)}");
        w.AppendLine($"  signals: {{{string.Join(", ", signals.Select(s => $"{Q(s)}: 1.0"))}}}   # the signals every core has, equal weights");
        w.AppendLine("composite:");
        w.AppendLine($"  step: {N(step)}                        # about the reference core's sample spacing");
        w.AppendLine("age_model:");
        w.AppendLine("  seed: 42");
        return w.ToString();
    }

    private static string UnitReason(List<CoreDraft> drafts) => $"from {drafts.Select(d => d.Probe.UnitReason).First(r => r is not null)}";

    private static string DelimiterName(Delimiter d) => d switch
    {
        Delimiter.Tab => "tab-separated",
        Delimiter.Semicolon => "semicolon-separated",
        Delimiter.Comma => "comma-separated",
        _ => "blank-separated",
    };

    private static string List(IEnumerable<string> names) => names.Any() ? string.Join(", ", names) : "(none)";
    private static string N(double v) => v.ToString("0.######", CultureInfo.InvariantCulture);

    /// <summary>A YAML scalar: plain when safe, else double-quoted with escapes.</summary>
    private static string Q(string v, bool force = false)
    {
        bool plain = !force && PlainSafe().IsMatch(v) && !YamlMap.TryParseNumber(v, out _)
            && v.ToLowerInvariant() is not ("true" or "false" or "yes" or "no" or "on" or "off" or "null");
        return plain ? v : "\"" + v.Replace("\\", "\\\\").Replace("\"", "\\\"").Replace("\t", "\\t") + "\"";
    }

    [GeneratedRegex(@"^[A-Za-z_][A-Za-z0-9_.\-/]*$")]
    private static partial Regex PlainSafe();

    [GeneratedRegex(@"[^a-z0-9]")]
    private static partial Regex NonAlnum();

    [GeneratedRegex(@"[^A-Za-z0-9]+")]
    private static partial Regex NonIdentifier();

    [GeneratedRegex(@"[_\s.]+")]
    private static partial Regex WordSplit();

    [GeneratedRegex(@"[^A-Za-z0-9._-]+")]
    private static partial Regex BadIdChars();
}
