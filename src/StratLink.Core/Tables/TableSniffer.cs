using System.Text;
using StratLink.Checks;
using StratLink.ProjectIO;

namespace StratLink.Tables;

/// <summary>
/// Finds a table's layout from its first lines: the encoding (UTF-8, else Latin-1), the header line
/// (given, or the first non-comment line holding the key column, so free-text preambles, <c>#</c> lines
/// and a <c>/* ... */</c> data description are skipped)
/// and the delimiter (the first of tab, semicolon, comma and blank runs that splits the key column out
/// of the header line).
/// </summary>
internal static class TableSniffer
{
    private const int HeadBytes = 64 * 1024;

    public static TableLayout? Find(string path, DelimitedReadOptions options, FindingList problems)
    {
        using var stream = OpenRead(path);
        var head = new byte[HeadBytes];
        int n = stream.ReadAtLeast(head, head.Length, throwOnEndOfStream: false);
        var headSpan = head.AsSpan(0, n);
        if (headSpan.StartsWith((ReadOnlySpan<byte>)[0xFF, 0xFE]) || headSpan.StartsWith((ReadOnlySpan<byte>)[0xFE, 0xFF]))
        {
            problems.AddError(ProjectCodes.TableProblem, "the file is UTF-16 text; save the table as UTF-8 (or Latin-1) text", path, 1);
            return null;
        }
        int nul = headSpan.IndexOf((byte)0);
        if (nul >= 0)
        {
            problems.AddError(ProjectCodes.TableProblem, $"this is not a text table: byte {nul} is a NUL byte (a spreadsheet or other binary file?); export the table as delimited text", path);
            return null;
        }
        var encoding = TextDecoding.Detect(headSpan);
        stream.Position = 0;

        using var lines = new ByteLineReader(stream, options.MaxLineBytes);
        var fields = new List<Range>();
        var parser = new CellParser(decimalCommaAllowed: true, []);
        string? caseHint = null;
        TableLayout? candidate = null, firstRejected = null;
        bool inMetadataBlock = false;
        int limit = options.HeaderLine ?? options.MaxHeaderSearchLines;
        while (lines.LineNumber < limit && lines.TryReadLine())
        {
            var line = lines.Current;
            if (options.HeaderLine is int wanted)
            {
                if (lines.LineNumber < wanted) continue;
                return ExplicitHeader(line, wanted, encoding, options, fields, path, problems);
            }
            if (inMetadataBlock || StartsMetadataBlock(line))
            {
                inMetadataBlock = line.IndexOf("*/"u8) < 0;
                continue;
            }
            if (IsBlankOrComment(line)) continue;
            // A preamble sentence can hold the key word too ("depth in cm"): a header must be followed by a
            // row of as many fields with a number (or nothing) under the key column.
            if (candidate is not null)
            {
                if (FitsHeader(line, candidate, options.KeyColumn, fields, parser)) return candidate;
                firstRejected ??= candidate;
                candidate = null;
            }
            foreach (var d in Delimiters.DetectionOrder)
            {
                var names = Names(line, d, encoding, fields);
                if (names.Contains(options.KeyColumn, StringComparer.Ordinal))
                {
                    candidate = new TableLayout(lines.LineNumber, d, encoding, names);
                    break;
                }
                caseHint ??= names.FirstOrDefault(x => string.Equals(x, options.KeyColumn, StringComparison.OrdinalIgnoreCase)) is string near
                    ? $"; line {lines.LineNumber} has '{near}' (column names are case-sensitive)" : null;
            }
        }
        // No header with a fitting row: take the first line holding the key; its rows' problems get reported then.
        if ((candidate ?? firstRejected) is { } found && !lines.LineTooLong) return found;
        if (lines.LineTooLong)
        {
            problems.AddError(ProjectCodes.TableLineTooLong, $"line {lines.LineNumber} is longer than {options.MaxLineBytes} bytes; this is not a delimited text table", path, lines.LineNumber);
            return null;
        }
        if (options.HeaderLine is int h)
        {
            problems.AddError(ProjectCodes.TableNoHeader, $"header_line is {h} but the file has only {lines.LineNumber} lines", path);
            return null;
        }
        string searched = lines.LineNumber < options.MaxHeaderSearchLines ? "no line" : $"none of the first {options.MaxHeaderSearchLines} lines";
        problems.AddError(ProjectCodes.TableNoHeader,
            $"{searched} holds a column named '{options.KeyColumn}'{caseHint}; name the depth column (depth_column) or the header line (header_line)", path, null, options.KeyColumn);
        return null;
    }

    public static FileStream OpenRead(string path) =>
        new(path, FileMode.Open, FileAccess.Read, FileShare.Read, 64 * 1024, FileOptions.SequentialScan);

    /// <summary>A <c>/* ... */</c> block before the header holds an archive's data description, not rows.</summary>
    public static bool StartsMetadataBlock(ReadOnlySpan<byte> line) => CellParser.Trim(line).StartsWith("/*"u8);

    public static bool IsBlankOrComment(ReadOnlySpan<byte> line)
    {
        var t = CellParser.Trim(line);
        return t.IsEmpty || t[0] == (byte)'#';
    }

    private static TableLayout? ExplicitHeader(ReadOnlySpan<byte> line, int lineNumber, Encoding encoding, DelimitedReadOptions options, List<Range> fields, string path, FindingList problems)
    {
        foreach (var d in Delimiters.DetectionOrder)
        {
            var names = Names(line, d, encoding, fields);
            if (names.Contains(options.KeyColumn, StringComparer.Ordinal)) return new TableLayout(lineNumber, d, encoding, names);
        }
        // Say what the line holds, split the way that gives the most columns.
        string[] best = [];
        foreach (var d in Delimiters.DetectionOrder)
            if (Names(line, d, encoding, fields) is { } names && names.Length > best.Length) best = names;
        problems.AddError(ProjectCodes.TableMissingColumn,
            $"header line {lineNumber} has no column '{options.KeyColumn}'; its columns are: {string.Join(", ", best.Take(30))}", path, lineNumber, options.KeyColumn);
        return null;
    }

    private static bool FitsHeader(ReadOnlySpan<byte> line, TableLayout header, string key, List<Range> fields, CellParser parser)
    {
        FieldSplitter.Split(line, header.Delimiter, fields);
        int used = fields.Count;
        while (used > 0 && CellParser.Trim(line[fields[used - 1]]).IsEmpty) used--;
        if (used > header.Columns.Count || fields.Count < header.Columns.Count) return false;
        int k = 0;
        while (header.Columns[k] != key) k++;
        var cell = line[fields[k]];
        var t = CellParser.Trim(cell);
        if (t.Length >= 2 && t[0] == (byte)'"' && t[^1] == (byte)'"') t = t[1..^1];
        return parser.Parse(t, out _) != CellKind.Text;
    }

    private static string[] Names(ReadOnlySpan<byte> line, Delimiter d, Encoding encoding, List<Range> fields)
    {
        FieldSplitter.Split(line, d, fields);
        var names = new string[fields.Count];
        for (int i = 0; i < names.Length; i++)
        {
            names[i] = FieldSplitter.Text(line[fields[i]], encoding);
            if (names[i].Length == 0) names[i] = $"(column {i + 1})";
        }
        return names;
    }
}
