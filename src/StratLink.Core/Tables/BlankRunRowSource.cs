namespace StratLink.Tables;

/// <summary>
/// Rows of column-aligned text, fields separated by runs of spaces and tabs. Read with our own line
/// reader: CsvHelper's separator is one character, and a run of blanks would give empty fields.
/// </summary>
internal sealed class BlankRunRowSource : IRowSource
{
    private readonly ByteLineReader _lines;
    private readonly int _headerLine;
    private readonly List<Range> _fields = [];

    public BlankRunRowSource(string path, TableLayout layout, int maxLineBytes)
    {
        _lines = new ByteLineReader(TableSniffer.OpenRead(path), maxLineBytes);
        _headerLine = layout.HeaderLine;
        FieldEncoding = layout.Encoding;
    }

    public System.Text.Encoding FieldEncoding { get; }

    public int LineNumber => _lines.LineNumber;
    public int FieldCount => _fields.Count;
    public (string Message, int? Line)? Failure { get; private set; }

    public bool MoveNext()
    {
        while (_lines.TryReadLine())
        {
            if (_lines.LineNumber <= _headerLine || TableSniffer.IsBlankOrComment(_lines.Current)) continue;
            FieldSplitter.Split(_lines.Current, Delimiter.Whitespace, _fields);
            return true;
        }
        if (_lines.LineTooLong)
            Failure = ($"line {_lines.LineNumber} is longer than {_lines.MaxLineBytes} bytes; this is not a delimited text table", _lines.LineNumber);
        return false;
    }

    public ReadOnlySpan<byte> Field(int index) => _lines.Current[_fields[index]];

    public void Dispose() => _lines.Dispose();
}
