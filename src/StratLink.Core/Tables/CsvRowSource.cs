using System.Text;
using CsvHelper;

namespace StratLink.Tables;

/// <summary>
/// Rows of a table with a one-character delimiter (comma, semicolon, tab), read with CsvHelper's
/// streaming reader: RFC 4180 quotes, CR/LF/CRLF line ends, Latin-1 transcoding and a bounded record
/// size. The header and any free-text preamble before it were found by <see cref="TableSniffer"/>,
/// so every record up to the header line is passed over here, and fields are read as raw UTF-8 spans
/// (no record type: the columns are only known at run time).
/// </summary>
internal sealed class CsvRowSource : IRowSource
{
    private readonly CsvReader _reader;
    private readonly int _headerLine;

    public CsvRowSource(string path, TableLayout layout, int maxLineBytes)
    {
        var options = CsvReaderOptions.Default with
        {
            Separator = layout.Delimiter.Char(),
            HasHeader = false,
            TrackLineNumbers = true,
            CommentPrefix = '#',
            // One line, one record: an unbalanced quote in a preamble must not swallow the table.
            AllowLineBreaksInQuotes = false,
            TrimWhitespace = true,
            MaxRecordSize = maxLineBytes,
            Encoding = layout.Encoding.CodePage == Encoding.UTF8.CodePage ? null : layout.Encoding,
        };
        _reader = CsvReader.Create(TableSniffer.OpenRead(path), options, leaveOpen: false);
        _headerLine = layout.HeaderLine;
    }

    public int LineNumber { get; private set; }
    public int FieldCount => _reader.FieldCount;
    public Encoding FieldEncoding => Encoding.UTF8;
    public (string Message, int? Line)? Failure { get; private set; }

    public bool MoveNext()
    {
        try
        {
            while (_reader.Read())
            {
                LineNumber = (int)_reader.LineNumber;
                if (LineNumber <= _headerLine) continue;
                // A comment indented by blanks (CsvHelper only knows '#' in the first column).
                if (_reader.FieldCount > 0 && CellParser.Trim(_reader.GetSpan(0)) is [(byte)'#', ..]) continue;
                return true;
            }
            return false;
        }
        catch (CsvFormatException e)
        {
            int? line = e.LineNumber > 0 ? (int)e.LineNumber : null;
            Failure = (e.Message.Contains("MaxRecordSize", StringComparison.Ordinal)
                ? $"a line after line {LineNumber} is longer than {_reader.Options.MaxRecordSize} bytes; this is not a delimited text table"
                : e.Message, line);
            return false;
        }
    }

    public ReadOnlySpan<byte> Field(int index) => _reader.GetSpan(index);

    public void Dispose() => _reader.Dispose();
}
