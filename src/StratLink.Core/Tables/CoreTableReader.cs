using System.Globalization;
using StratLink.Checks;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Quantities;

namespace StratLink.Tables;

/// <summary>
/// Reads one core's table: the depth column, the signals (those the core names, else every numeric
/// column but depth and section), section-relative depths made absolute (section top + depth), and
/// depths checked to increase strictly (or sorted when the core says <c>sort: true</c>).
/// Signals the core names but the table lacks are left out here; <c>ProjectLoader</c> reports them
/// against the project file, where the fix usually is.
/// </summary>
public static class CoreTableReader
{
    /// <summary>The column that holds section ids when depths are section-relative.</summary>
    public const string SectionColumn = "section";

    /// <summary>The core's table, or null when its problems (all in <paramref name="problems"/>) make it unusable.</summary>
    public static CoreTable? Read(string path, CoreSpec spec, DepthUnit unit, FindingList problems, CancellationToken ct = default)
    {
        var options = new DelimitedReadOptions
        {
            KeyColumn = spec.DepthColumn,
            HeaderLine = spec.HeaderLine,
            MissingValues = spec.MissingValues,
            TextColumns = spec.DepthColumn == SectionColumn ? [] : [SectionColumn],
        };
        var table = DelimitedTextReader.Read(path, options, problems, ct);
        if (table is null) return null;
        var report = new TableProblems(problems, path);
        int header = table.Layout.HeaderLine;
        var raw = table.Numeric[spec.DepthColumn];

        var offsets = SectionOffsets(table, spec, unit, report);
        if (offsets is null) return null;

        var keep = new List<int>(raw.Length);
        for (int i = 0; i < raw.Length; i++)
        {
            if (double.IsNaN(offsets[i])) continue;
            if (double.IsNaN(raw[i]))
            {
                report.Warning(ProjectCodes.TableMissingDepth, $"line {table.Lines[i]} has no depth; the row is left out", table.Lines[i], spec.DepthColumn);
                continue;
            }
            keep.Add(i);
        }
        if (report.HasErrors) { report.Flush(); return null; }

        // Every row kept (the usual case): the reader's arrays become the table's, with no copies.
        bool allKept = keep.Count == raw.Length;
        var depths = allKept ? raw : new double[keep.Count];
        var lines = allKept ? table.Lines : new int[keep.Count];
        for (int k = 0; k < keep.Count; k++)
        {
            depths[k] = raw[keep[k]] + offsets[keep[k]];
            lines[k] = table.Lines[keep[k]];
        }
        int[]? order = spec.Sort ? SortOrder(depths, lines) : null;
        if (order is not null)
        {
            depths = [.. order.Select(i => depths[i])];
            lines = [.. order.Select(i => lines[i])];
        }

        var signals = new Dictionary<string, double[]>(StringComparer.Ordinal);
        foreach (var (column, name) in SignalColumns(table, spec, header, report))
        {
            var values = table.Numeric[column];
            if (!allKept || order is not null)
            {
                var picked = new double[keep.Count];
                for (int k = 0; k < picked.Length; k++) picked[k] = values[keep[order?[k] ?? k]];
                values = picked;
            }
            signals[name] = values;
        }
        if (spec.RepeatedDepths != RepeatedDepths.Error)
            (depths, lines, signals) = ReplicateCombiner.Combine(depths, lines, signals, spec, report);
        CheckIncreasing(depths, lines, spec, report);
        report.Flush();
        return report.HasErrors ? null : new CoreTable(spec.Id, unit, depths, signals, path, lines);
    }

    /// <summary>Per row, what to add to the table depth: 0 without sections, the section top with them, NaN for a row to drop.</summary>
    private static double[]? SectionOffsets(DelimitedTable table, CoreSpec spec, DepthUnit unit, TableProblems report)
    {
        var offsets = new double[table.RowCount];
        table.Text.TryGetValue(SectionColumn, out var ids);
        if (spec.Sections.Count == 0)
        {
            if (ids is not null)
                report.Warning(ProjectCodes.TableSectionsIgnored,
                    $"the table has a '{SectionColumn}' column but core '{spec.Id}' lists no sections; depths are read as they are", table.Layout.HeaderLine, SectionColumn);
            return offsets;
        }
        if (ids is null)
        {
            report.Error(ProjectCodes.TableMissingColumn,
                $"core '{spec.Id}' lists sections, so its table needs a '{SectionColumn}' column; the header has: {string.Join(", ", table.Columns)}", table.Layout.HeaderLine, SectionColumn);
            report.Flush();
            return null;
        }
        var tops = new Dictionary<string, double>(StringComparer.Ordinal);
        foreach (var s in spec.Sections) tops.TryAdd(s.Id, s.Top.In(unit));
        string known = string.Join(", ", spec.Sections.Select(s => s.Id));
        for (int i = 0; i < offsets.Length; i++)
        {
            if (ids[i] is not string id)
            {
                report.Error(ProjectCodes.TableUnknownSection, $"line {table.Lines[i]} has no section id", table.Lines[i], SectionColumn);
                offsets[i] = double.NaN;
            }
            else if (tops.TryGetValue(id, out double top)) offsets[i] = top;
            else
            {
                report.Error(ProjectCodes.TableUnknownSection, $"section '{id}' at line {table.Lines[i]} is not one of core '{spec.Id}''s sections ({known})", table.Lines[i], SectionColumn);
                offsets[i] = double.NaN;
            }
        }
        return offsets;
    }

    /// <summary>Row order by depth, ties kept in file order so repeated depths are reported top to bottom.</summary>
    private static int[] SortOrder(double[] depths, int[] lines)
    {
        var order = Enumerable.Range(0, depths.Length).ToArray();
        Array.Sort(order, (a, b) => depths[a] != depths[b] ? depths[a].CompareTo(depths[b]) : lines[a].CompareTo(lines[b]));
        return order;
    }

    private static void CheckIncreasing(double[] depths, int[] lines, CoreSpec spec, TableProblems report)
    {
        for (int i = 1; i < depths.Length; i++)
        {
            if (depths[i] > depths[i - 1]) continue;
            string d = Format(depths[i]), prev = Format(depths[i - 1]);
            string message = depths[i] == depths[i - 1]
                ? $"depth {d} at line {lines[i]} repeats the depth at line {lines[i - 1]}; each depth holds one sample (or set repeated_depths: mean, median or first for core '{spec.Id}')"
                : $"depth {d} at line {lines[i]} lies above the depth {prev} at line {lines[i - 1]}; depths must increase down the table (or set sort: true for core '{spec.Id}')";
            report.Error(ProjectCodes.TableDepthOrder, message, lines[i], spec.DepthColumn);
        }
    }

    /// <summary>The signals as (table column, signal name) pairs, the core's <c>columns</c> renaming applied.</summary>
    private static List<(string Column, string Name)> SignalColumns(DelimitedTable table, CoreSpec spec, int header, TableProblems report)
    {
        foreach (string column in spec.Columns.Keys.Where(c => !table.Columns.Contains(c, StringComparer.Ordinal)).Order(StringComparer.Ordinal))
            report.Error(ProjectCodes.TableMissingColumn,
                $"core '{spec.Id}' renames column '{column}' but the header has no such column; it has: {string.Join(", ", table.Columns)}", header, column);
        string NameOf(string column) => spec.Columns.TryGetValue(column, out var n) ? n : column;
        var pairs = new List<(string, string)>();
        if (spec.Signals.Count == 0)
        {
            foreach (string column in table.Numeric.Keys.Where(k => k != spec.DepthColumn && k != SectionColumn))
                pairs.Add((column, NameOf(column)));
        }
        else
        {
            foreach (string s in spec.Signals.Distinct(StringComparer.Ordinal))
            {
                string column = spec.ColumnOf(s);
                if (column == spec.DepthColumn) continue;
                if (table.Numeric.ContainsKey(column)) pairs.Add((column, s));
                else if (table.TextOnlyColumns.Contains(column, StringComparer.Ordinal))
                    report.Error(ProjectCodes.TableNotNumeric, $"signal column '{column}' holds no numbers", header, column);
            }
        }
        foreach (var g in pairs.GroupBy(p => p.Item2, StringComparer.Ordinal).Where(g => g.Count() > 1))
            report.Error(ProjectCodes.TableDuplicateColumn,
                $"columns {string.Join(" and ", g.Select(p => $"'{p.Item1}'"))} would both be signal '{g.Key}' of core '{spec.Id}'; rename one under columns", header, g.Key);
        return pairs.GroupBy(p => p.Item2, StringComparer.Ordinal).Select(g => g.First()).ToList();
    }

    private static string Format(double v) => v.ToString("R", CultureInfo.InvariantCulture);
}
