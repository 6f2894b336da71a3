using System.Globalization;
using System.Text.Json;
using StratLink.Checks;

namespace StratLink.Cli.Commands;

/// <summary>Prints findings as an aligned table for people, or CSV / JSON for scripts.</summary>
internal static class FindingsPrinter
{
    public static readonly string[] Formats = ["table", "csv", "json"];

    public static void Print(IReadOnlyList<Finding> findings, string format, string depthUnit, TextWriter w)
    {
        switch (format)
        {
            case "csv": Csv(findings, depthUnit, w); break;
            case "json": Json(findings, w); break;
            default: Table(findings, w); break;
        }
    }

    private static void Table(IReadOnlyList<Finding> findings, TextWriter w)
    {
        if (findings.Count == 0)
        {
            w.WriteLine("No problems found.");
            return;
        }
        foreach (var f in findings.OrderByDescending(f => f.Severity))
        {
            string where = Where(f);
            w.WriteLine($"{f.Severity.ToString().ToLowerInvariant(),-7} {f.Code,-28} {where}");
            w.WriteLine($"        {f.Message}");
        }
        int errors = findings.Count(f => f.Severity == Severity.Error), warnings = findings.Count(f => f.Severity == Severity.Warning);
        int notes = findings.Count - errors - warnings;
        w.WriteLine($"{errors} error(s), {warnings} warning(s), {notes} note(s).");
    }

    private static string Where(Finding f)
    {
        var parts = new List<string>();
        if (f.File is not null) parts.Add(f.Line is int l ? $"{Path.GetFileName(f.File)}:{l}" : Path.GetFileName(f.File));
        if (f.Field is not null) parts.Add(f.Field);
        if (f.Core is not null) parts.Add("core " + f.Core);
        if (f.Item is not null) parts.Add(f.Item);
        if (f.Depth is double d) parts.Add("at " + d.ToString("0.###", CultureInfo.InvariantCulture));
        return string.Join("  ", parts);
    }

    private static void Csv(IReadOnlyList<Finding> findings, string unit, TextWriter w)
    {
        w.WriteLine($"severity,code,core,item,depth_{unit},message,file,line,field");
        foreach (var f in findings)
        {
            w.WriteLine(string.Join(',',
                f.Severity.ToString().ToLowerInvariant(), f.Code, Quote(f.Core), Quote(f.Item),
                f.Depth?.ToString("R", CultureInfo.InvariantCulture) ?? "", Quote(f.Message), Quote(f.File),
                f.Line?.ToString(CultureInfo.InvariantCulture) ?? "", Quote(f.Field)));
        }
    }

    private static string Quote(string? s) =>
        s is null ? "" : s.IndexOfAny([',', '"', '\n', '\r']) >= 0 ? "\"" + s.Replace("\"", "\"\"") + "\"" : s;

    private static void Json(IReadOnlyList<Finding> findings, TextWriter w)
    {
        var items = findings.Select(f => new
        {
            severity = f.Severity.ToString().ToLowerInvariant(),
            code = f.Code,
            message = f.Message,
            core = f.Core,
            item = f.Item,
            depth = f.Depth,
            file = f.File,
            line = f.Line,
            field = f.Field,
        });
        w.WriteLine(JsonSerializer.Serialize(items, new JsonSerializerOptions { WriteIndented = true }));
    }
}
