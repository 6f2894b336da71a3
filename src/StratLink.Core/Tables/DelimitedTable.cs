namespace StratLink.Tables;

/// <summary>
/// A delimited text table as read: numeric columns as double arrays (NaN = missing or unreadable),
/// the requested text columns, and the file line of every row. Rows are in file order.
/// </summary>
public sealed class DelimitedTable
{
    internal DelimitedTable(string file, TableLayout layout, IReadOnlyDictionary<string, double[]> numeric,
        IReadOnlyDictionary<string, string?[]> text, IReadOnlyList<string> textOnly, int[] lines)
    {
        File = file;
        Layout = layout;
        Numeric = numeric;
        Text = text;
        TextOnlyColumns = textOnly;
        Lines = lines;
    }

    public string File { get; }
    public TableLayout Layout { get; }

    /// <summary>Columns holding numbers, by header name, in file order.</summary>
    public IReadOnlyDictionary<string, double[]> Numeric { get; }

    /// <summary>The columns asked for as text (null = missing cell).</summary>
    public IReadOnlyDictionary<string, string?[]> Text { get; }

    /// <summary>Columns without a single number (ids, comments, species names): not signals.</summary>
    public IReadOnlyList<string> TextOnlyColumns { get; }

    /// <summary>1-based file line of each row.</summary>
    public int[] Lines { get; }

    public int RowCount => Lines.Length;
    public IReadOnlyList<string> Columns => Layout.Columns;
}
