using StratLink.AgeModelling;
using StratLink.Compositing;
using StratLink.ProjectIO;
using StratLink.Workflows;

namespace StratLink.Export;

/// <summary>Writes the compositing stage's tables and figures into an output folder.</summary>
public static class CompositeOutputs
{
    /// <summary>One table to a writer (the <c>export</c> command's single-table form).</summary>
    public static void WriteTable(CompositeResult result, CompositeTableKind kind, TextWriter output, TableFormat format = TableFormat.Csv)
    {
        switch (kind)
        {
            case CompositeTableKind.Composite: CompositeCsvWriter.Write(result, output, format); break;
            case CompositeTableKind.Splice: SpliceCsvWriter.Write(result.Splice, result.Grid.Unit, output, format); break;
            case CompositeTableKind.Mappings: MappingCsvWriter.WriteAll(result.Mappings, result.Grid.Unit, output, format); break;
            default: throw new ArgumentOutOfRangeException(nameof(kind), kind, "Unknown composite table.");
        }
    }

    /// <summary>
    /// Writes <c>composite</c>, <c>splice</c> and one <c>mapping-&lt;core&gt;</c> table per core into
    /// <paramref name="directory"/>, and the figures into its <c>figures</c> folder. Returns the files written.
    /// </summary>
    public static IReadOnlyList<string> WriteAll(LoadedProject project, CompositeResult result, string directory, TableFormat format = TableFormat.Csv)
    {
        Directory.CreateDirectory(directory);
        var files = new List<string>
        {
            WriteFile(Path.Combine(directory, "composite" + format.Extension()), w => CompositeCsvWriter.Write(result, w, format)),
            WriteFile(Path.Combine(directory, "splice" + format.Extension()), w => SpliceCsvWriter.Write(result.Splice, result.Grid.Unit, w, format)),
        };
        foreach (var table in result.Mappings)
        {
            var events = project.Project.FindCore(table.CoreId) is { } core ? EventFreeScale.Of(core, table.Unit) : null;
            files.Add(WriteFile(Path.Combine(directory, MappingCsvWriter.FileName(table.CoreId, format)), w => MappingCsvWriter.Write(table, result.Mappings, w, format, events)));
        }
        string figures = Path.Combine(directory, "figures");
        files.AddRange(CompositeFigures.WriteAll(result, figures));
        files.Add(CorrelationPanel.Write(project, result, figures));
        return files;
    }

    /// <summary>Streams through <see cref="AtomicFile"/>, so a reader never sees half a table.</summary>
    private static string WriteFile(string path, Action<TextWriter> write)
    {
        AtomicFile.Write(path, write, keepBackup: false);
        return path;
    }
}
