using System.Globalization;
using System.Text;

namespace StratLink.Export;

/// <summary>
/// Writes one table as delimited text: one header row (units belong in the column names), then rows
/// of cells. Numbers use the invariant culture and the shortest text that reads back to the same
/// double; NaN is an empty cell, infinities are <c>inf</c> and <c>-inf</c>. Text with the delimiter, a quote or a line break is quoted as in
/// RFC 4180. Lines end with LF. No comment lines.
/// </summary>
public sealed class DelimitedTableWriter
{
    private readonly TextWriter _out;
    private readonly char _delimiter;
    private int _columns = -1;
    private int _cell;

    public DelimitedTableWriter(TextWriter output, TableFormat format)
    {
        _out = output;
        _delimiter = format.Delimiter();
    }

    /// <summary>Writes the header row; every later row must have as many cells.</summary>
    public void Header(IReadOnlyList<string> columns)
    {
        if (_columns >= 0) throw new InvalidOperationException("The header is already written.");
        if (columns.Count == 0) throw new ArgumentException("A table needs at least one column.", nameof(columns));
        _columns = columns.Count;
        foreach (string c in columns) Text(c);
        EndRow();
    }

    public DelimitedTableWriter Number(double value) => Raw(Format(value));

    /// <summary>A number as a cell holds it, for numbers inside text cells and column names.</summary>
    public static string Format(double value) =>
        double.IsNaN(value) ? "" : double.IsPositiveInfinity(value) ? "inf" : double.IsNegativeInfinity(value) ? "-inf"
        : value.ToString("R", CultureInfo.InvariantCulture);

    public DelimitedTableWriter Bool(bool value) => Raw(value ? "true" : "false");

    public DelimitedTableWriter Number(int value) => Raw(value.ToString(CultureInfo.InvariantCulture));

    /// <summary>A text cell; null is an empty cell.</summary>
    public DelimitedTableWriter Text(string? value) => Raw(Quote(value ?? ""));

    public void EndRow()
    {
        if (_columns >= 0 && _cell != _columns)
            throw new InvalidOperationException($"A row has {_cell} cells for {_columns} columns.");
        _out.Write('\n');
        _cell = 0;
    }

    private DelimitedTableWriter Raw(string cell)
    {
        if (_cell > 0) _out.Write(_delimiter);
        _out.Write(cell);
        _cell++;
        return this;
    }

    private string Quote(string text)
    {
        if (text.IndexOfAny([_delimiter, '"', '\n', '\r']) < 0) return text;
        var sb = new StringBuilder(text.Length + 2).Append('"');
        foreach (char ch in text) sb.Append(ch == '"' ? "\"\"" : ch.ToString());
        return sb.Append('"').ToString();
    }
}
