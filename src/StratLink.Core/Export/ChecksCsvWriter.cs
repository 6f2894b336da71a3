using System.Globalization;
using System.Text;
using StratLink.Checks;
using StratLink.ProjectIO;
using StratLink.Quantities;

namespace StratLink.Export;

/// <summary>
/// Writes findings as checks.csv: columns severity, code, core, item, depth_&lt;unit&gt;, message;
/// comma-separated, invariant culture, fields quoted where needed (RFC 4180).
/// </summary>
public static class ChecksCsvWriter
{
    public static string ToCsv(IEnumerable<Finding> findings, DepthUnit unit)
    {
        var sb = new StringBuilder();
        sb.Append("severity,code,core,item,depth_").Append(unit.Symbol()).Append(",message\n");
        foreach (var f in findings)
        {
            sb.Append(f.Severity.ToString().ToLowerInvariant()).Append(',')
              .Append(Field(f.Code)).Append(',')
              .Append(Field(f.Core)).Append(',')
              .Append(Field(f.Item)).Append(',')
              .Append(f.Depth is double d ? d.ToString("R", CultureInfo.InvariantCulture) : "").Append(',')
              .Append(Field(f.Message)).Append('\n');
        }
        return sb.ToString();
    }

    /// <summary>Writes the file atomically (no backup: it is an output, rebuilt on every run).</summary>
    public static void Write(string path, IEnumerable<Finding> findings, DepthUnit unit) =>
        AtomicFile.WriteAllText(path, ToCsv(findings, unit), keepBackup: false);

    private static string Field(string? text)
    {
        if (string.IsNullOrEmpty(text)) return "";
        if (text.IndexOfAny([',', '"', '\n', '\r']) < 0 && text.Trim() == text) return text;
        return "\"" + text.Replace("\"", "\"\"") + "\"";
    }
}
