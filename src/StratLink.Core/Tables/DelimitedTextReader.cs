using StratLink.Checks;
using StratLink.ProjectIO;

namespace StratLink.Tables;

/// <summary>
/// Reads a delimited text table (comma, semicolon, tab or blank runs; UTF-8 or Latin-1; CR, LF and CRLF
/// line ends; <c>#</c> comment lines and free-text preambles) into numeric columns, streaming: memory
/// grows with the numbers kept, not with the text. Every problem becomes a finding with file, line
/// and column. Returns null when the table cannot be used at all (no header, duplicate columns, an
/// oversized line, no rows); unreadable cells are reported and left as NaN.
/// </summary>
public static class DelimitedTextReader
{
    public static DelimitedTable? Read(string path, DelimitedReadOptions options, FindingList problems, CancellationToken ct = default)
    {
        var report = new TableProblems(problems, path);
        try
        {
            if (!File.Exists(path))
            {
                report.Error(ProjectCodes.MissingFile, "the table file does not exist");
                return null;
            }
            var layout = TableSniffer.Find(path, options, problems);
            if (layout is null) return null;
            if (!UniqueColumns(layout, report)) return null;
            var table = ReadRows(path, layout, options, report, ct);
            report.Flush();
            return table;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            report.Error(ProjectCodes.Unreadable, $"cannot read the table: {e.Message}");
            return null;
        }
    }

    private static bool UniqueColumns(TableLayout layout, TableProblems report)
    {
        bool ok = true;
        foreach (var g in layout.Columns.GroupBy(c => c, StringComparer.Ordinal).Where(g => g.Count() > 1))
        {
            report.Error(ProjectCodes.TableDuplicateColumn, $"the header names column '{g.Key}' {g.Count()} times; column names must be unique", layout.HeaderLine, g.Key);
            ok = false;
        }
        return ok;
    }

    private static DelimitedTable? ReadRows(string path, TableLayout layout, DelimitedReadOptions options, TableProblems report, CancellationToken ct)
    {
        using IRowSource rows = layout.Delimiter == Delimiter.Whitespace
            ? new BlankRunRowSource(path, layout, options.MaxLineBytes)
            : new CsvRowSource(path, layout, options.MaxLineBytes);
        var parser = new CellParser(decimalCommaAllowed: layout.Delimiter != Delimiter.Comma, options.MissingValues);
        var columns = layout.Columns
            .Select(name => new ColumnBuilder(name, options.TextColumns.Contains(name, StringComparer.Ordinal), rows.FieldEncoding))
            .ToArray();
        int width = columns.Length;
        var lines = new GrowableBuffer<int>();
        while (rows.MoveNext())
        {
            if ((lines.Count & 0xFFF) == 0) ct.ThrowIfCancellationRequested();
            int line = rows.LineNumber, n = rows.FieldCount;
            // Trailing delimiters (empty fields past the last column) are harmless; rows of empty fields are blank lines.
            int used = n;
            while (used > 0 && CellParser.Trim(rows.Field(used - 1)).IsEmpty) used--;
            if (used == 0) continue;
            if (used > width || n < width)
            {
                report.Error(ProjectCodes.TableFieldCount,
                    $"line {line} has {(used > width ? used : n)} fields but the header (line {layout.HeaderLine}) names {width} columns", line);
                continue;
            }
            for (int j = 0; j < width; j++) columns[j].Add(rows.Field(j), line, parser);
            lines.Add(line);
        }
        if (rows.Failure is { } failure)
        {
            report.Error(ProjectCodes.TableLineTooLong, failure.Message, failure.Line);
            return null;
        }
        if (lines.Count == 0)
        {
            report.Error(ProjectCodes.TableEmpty, $"no data rows below the header (line {layout.HeaderLine})", layout.HeaderLine);
            return null;
        }
        if (parser.SawDecimalComma && parser.SawDecimalPoint)
            report.Warning(ProjectCodes.TableMixedDecimalMarks, "the table mixes decimal points and decimal commas; check that no column uses thousands separators");

        var numeric = new Dictionary<string, double[]>(StringComparer.Ordinal);
        var text = new Dictionary<string, string?[]>(StringComparer.Ordinal);
        var textOnly = new List<string>();
        foreach (var c in columns)
        {
            if (options.TextColumns.Contains(c.Name, StringComparer.Ordinal)) text[c.Name] = c.TextArray();
            else if (c.Numbers == 0) textOnly.Add(c.Name);
            else
            {
                ReportTextCells(c, report);
                numeric[c.Name] = c.NumbersArray();
            }
        }
        if (!numeric.ContainsKey(options.KeyColumn) && !text.ContainsKey(options.KeyColumn))
        {
            report.Error(ProjectCodes.TableBadCell, $"column '{options.KeyColumn}' holds no numbers", layout.HeaderLine, options.KeyColumn);
            return null;
        }
        return new DelimitedTable(path, layout, numeric, text, textOnly, lines.ToArray());
    }

    /// <summary>A text cell in a column of numbers is an error (a typo, a unit, a flag), named by line and column.</summary>
    private static void ReportTextCells(ColumnBuilder c, TableProblems report)
    {
        foreach (var (line, cell) in c.TextSamplesSeen)
            report.Error(ProjectCodes.TableBadCell, $"'{cell}' in column '{c.Name}' is not a number (list it under missing_values if it means 'no value')", line, c.Name);
        int unlisted = c.TextCells - c.TextSamplesSeen.Count;
        if (unlisted > 0)
            report.Summary(ProjectCodes.TableBadCell, $"column '{c.Name}' holds {c.TextCells} cells that are not numbers in all; the first {c.TextSamplesSeen.Count} are listed", c.Name);
    }
}
