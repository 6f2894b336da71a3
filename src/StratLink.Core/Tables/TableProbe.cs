using System.Globalization;
using System.Text.RegularExpressions;
using StratLink.ProjectIO;
using StratLink.Quantities;

namespace StratLink.Tables;

/// <summary>
/// Looks at a table nobody has described yet: finds its header line, delimiter, decimal mark and
/// depth column (a column named like a depth, with a number under it on the next row), the depth unit
/// when a name says it, and which columns are sample ids or ages rather than signals.
/// </summary>
public static partial class TableProbe
{
    private const int HeadLines = 2000;

    /// <summary>What was found; <see cref="Result.DepthColumn"/> null when no column is named like a depth.</summary>
    public sealed record Result(string? DepthColumn, DepthUnit? Unit, string? UnitReason, Delimiter Delimiter, bool DecimalComma, int HeaderLine, IReadOnlyList<string> Columns);

    public static Result Probe(string path)
    {
        byte[] head;
        using (var s = TableSniffer.OpenRead(path))
        {
            head = new byte[Math.Min(s.Length, 256 * 1024)];
            s.ReadExactly(head);
        }
        var lines = TextDecoding.Decode(head).ReplaceLineEndings("\n").Split('\n').Take(HeadLines).ToArray();
        bool inBlock = false;
        for (int i = 0; i < lines.Length; i++)
        {
            string t = lines[i].Trim();
            if (inBlock || t.StartsWith("/*", StringComparison.Ordinal))
            {
                inBlock = !t.Contains("*/", StringComparison.Ordinal);
                continue;
            }
            if (t.Length == 0 || t[0] == '#') continue;
            foreach (var d in Delimiters.DetectionOrder)
            {
                var names = Split(lines[i], d);
                // One field is no core table (a depth and at least one signal), and it would take "depth,ms" for a name.
                if (names.Length < 2) continue;
                int k = BestDepthColumn(names);
                if (k < 0) continue;
                string? next = lines.Skip(i + 1).FirstOrDefault(l => l.Trim().Length > 0 && !l.TrimStart().StartsWith('#'));
                if (next is null) continue;
                var cells = Split(next, d);
                if (cells.Length < names.Length || !IsNumber(cells[k], d)) continue;
                bool comma = d != Delimiter.Comma && lines.Skip(i + 1).Take(200).Any(l => Split(l, d).Any(c => DecimalComma().IsMatch(c)));
                var (unit, reason) = UnitOf(names[k]);
                return new Result(names[k], unit, reason, d, comma, i + 1, names);
            }
        }
        return new Result(null, null, null, Delimiter.Comma, false, 0, []);
    }

    /// <summary>Sample-id columns (site, hole, section, interval top ...): numbers, but not signals.</summary>
    public static bool IsSampleIdColumn(string name) => SampleId().IsMatch(Bare(name));

    /// <summary>Age columns (an age model's output, not a proxy signal).</summary>
    public static bool IsAgeColumn(string name) => AgeName().IsMatch(Bare(name));

    /// <summary>True for the top/bottom pair of a layer table (varve counts, event layers), which is not a core table.</summary>
    public static bool IsLayerTable(IReadOnlyList<string> columns) =>
        columns.Any(c => Bare(c) is "depth_top" or "depthtop" or "top_depth") && columns.Any(c => Bare(c) is "depth_bottom" or "depthbottom" or "bottom_depth");

    /// <summary>The name without a unit in brackets or parentheses, lower case.</summary>
    public static string Bare(string name) => Units().Replace(name, "").Trim().ToLowerInvariant();

    private static int BestDepthColumn(string[] names)
    {
        int best = -1, bestRank = int.MaxValue;
        for (int i = 0; i < names.Length; i++)
        {
            string b = Bare(names[i]);
            int rank = b == "depth" ? 0
                : b is "mcd" or "rmcd" or "amcd" or "cmcd" or "mbsf" or "composite depth" or "composite_depth" ? 1
                : b.StartsWith("depth", StringComparison.Ordinal) && !b.Contains("top") && !b.Contains("bot") && !b.Contains("water") ? 2
                : int.MaxValue;
            if (rank < bestRank) (best, bestRank) = (i, rank);
        }
        return best;
    }

    private static (DepthUnit?, string?) UnitOf(string name)
    {
        var m = UnitInName().Match(name);
        if (m.Success && DepthUnits.TryParse(m.Groups[1].Value.Trim(), out var u)) return (u, $"the column name '{name}'");
        var s = UnitSuffix().Match(name);
        if (s.Success && DepthUnits.TryParse(s.Groups[1].Value, out u)) return (u, $"the column name '{name}'");
        if (Bare(name) is "mcd" or "rmcd" or "amcd" or "cmcd" or "mbsf") return (DepthUnit.Metre, $"'{name}' (metres composite depth / below sea floor)");
        return (null, null);
    }

    private static string[] Split(string line, Delimiter d) => d == Delimiter.Whitespace
        ? line.Split([' ', '\t'], StringSplitOptions.RemoveEmptyEntries)
        : line.Split(d.Char()).Select(f => f.Trim().Trim('"')).ToArray();

    private static bool IsNumber(string cell, Delimiter d)
    {
        string c = cell.Trim();
        if (d != Delimiter.Comma && DecimalComma().IsMatch(c)) return true;
        return double.TryParse(c, NumberStyles.Float, CultureInfo.InvariantCulture, out _);
    }

    [GeneratedRegex(@"^[+-]?\d+,\d+$")]
    private static partial Regex DecimalComma();

    [GeneratedRegex(@"\s*(\[[^\]]*\]|\([^)]*\))")]
    private static partial Regex Units();

    [GeneratedRegex(@"[\[(]\s*(mm|cm|m)\s*[\])]", RegexOptions.IgnoreCase)]
    private static partial Regex UnitInName();

    [GeneratedRegex(@"[_ ](mm|cm|m)$", RegexOptions.IgnoreCase)]
    private static partial Regex UnitSuffix();

    [GeneratedRegex(@"^(site|hole|core|type|sect|section|top|bot|bottom|interval|leg|sample|sample_id|label|id|event|cruise|expedition|top_cm|bottom_cm|top interval|bottom interval)$")]
    private static partial Regex SampleId();

    [GeneratedRegex(@"^(age|ages|age[._ -].*|.*_age|yrbp|yr_bp|ka|kyr|ma|cal_bp|calbp|agemodel)$")]
    private static partial Regex AgeName();
}
