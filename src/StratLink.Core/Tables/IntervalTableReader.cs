using System.Globalization;
using StratLink.Checks;
using StratLink.ProjectIO;
using StratLink.Quantities;

namespace StratLink.Tables;

/// <summary>
/// Reads a table of depth intervals (columns <c>depth_top</c> and <c>depth_bottom</c>, one row per
/// interval, e.g. one per varve) with the same reader as core tables. Rows are sorted by top; a row
/// whose top is not above its bottom, or that overlaps the next, is an error naming its line.
/// </summary>
public static class IntervalTableReader
{
    public const string TopColumn = "depth_top";
    public const string BottomColumn = "depth_bottom";

    /// <summary>The intervals, or null when problems (all in <paramref name="problems"/>) make the table unusable.</summary>
    public static IntervalTable? Read(string path, DepthUnit unit, FindingList problems, CancellationToken ct = default)
    {
        var table = DelimitedTextReader.Read(path, new DelimitedReadOptions { KeyColumn = TopColumn }, problems, ct);
        if (table is null) return null;
        var report = new TableProblems(problems, path);
        if (!table.Numeric.TryGetValue(BottomColumn, out var bottoms))
        {
            report.Error(ProjectCodes.TableMissingColumn,
                $"an interval table needs columns '{TopColumn}' and '{BottomColumn}'; the header has: {string.Join(", ", table.Columns)}", table.Layout.HeaderLine, BottomColumn);
            return null;
        }
        var tops = table.Numeric[TopColumn];
        var rows = new List<int>(tops.Length);
        for (int i = 0; i < tops.Length; i++)
        {
            int line = table.Lines[i];
            if (double.IsNaN(tops[i]) || double.IsNaN(bottoms[i]))
                report.Error(ProjectCodes.TableMissingDepth, $"line {line} lacks its top or bottom depth", line);
            else if (!(tops[i] < bottoms[i]))
                report.Error(ProjectCodes.TableIntervalInverted, $"at line {line} the top {Format(tops[i])} is not above the bottom {Format(bottoms[i])}", line, TopColumn);
            else rows.Add(i);
        }
        rows.Sort((a, b) => tops[a] != tops[b] ? tops[a].CompareTo(tops[b]) : a.CompareTo(b));
        for (int k = 1; k < rows.Count; k++)
        {
            int a = rows[k - 1], b = rows[k];
            if (tops[b] < bottoms[a])
                report.Error(ProjectCodes.TableIntervalOverlap,
                    $"the interval at line {table.Lines[b]} ({Format(tops[b])}-{Format(bottoms[b])}) overlaps the one at line {table.Lines[a]} ({Format(tops[a])}-{Format(bottoms[a])})",
                    table.Lines[b], TopColumn);
        }
        report.Flush();
        if (report.HasErrors) return null;
        return new IntervalTable(unit, [.. rows.Select(i => tops[i])], [.. rows.Select(i => bottoms[i])], path, [.. rows.Select(i => table.Lines[i])]);
    }

    private static string Format(double v) => v.ToString("R", CultureInfo.InvariantCulture);
}
