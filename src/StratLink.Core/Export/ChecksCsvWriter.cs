using StratLink.Checks;
using StratLink.ProjectIO;
using StratLink.Quantities;

namespace StratLink.Export;

/// <summary>
/// <c>checks.csv</c>: one row per finding with columns severity, code, core, item, depth_&lt;unit&gt;,
/// message (the shared delimited-table rules: invariant numbers, RFC 4180 quoting).
/// </summary>
public static class ChecksCsvWriter
{
    public static string FileName(TableFormat format = TableFormat.Csv) => "checks" + format.Extension();

    public static void Write(TextWriter writer, IEnumerable<Finding> findings, DepthUnit unit, TableFormat format = TableFormat.Csv)
    {
        var table = new DelimitedTableWriter(writer, format);
        table.Header(["severity", "code", "core", "item", $"depth_{unit.Symbol()}", "message"]);
        foreach (var f in findings)
        {
            table.Text(f.Severity.ToString().ToLowerInvariant()).Text(f.Code).Text(f.Core).Text(f.Item)
                .Number(f.Depth ?? double.NaN).Text(f.Message);
            table.EndRow();
        }
    }

    /// <summary>Writes <c>checks.csv</c> into <paramref name="directory"/> (atomically) and returns its path.</summary>
    public static string WriteFile(string directory, IEnumerable<Finding> findings, DepthUnit unit, TableFormat format = TableFormat.Csv)
    {
        string path = Path.Combine(directory, FileName(format));
        AtomicFile.Write(path, w => Write(w, findings, unit, format), keepBackup: false);
        return path;
    }
}
