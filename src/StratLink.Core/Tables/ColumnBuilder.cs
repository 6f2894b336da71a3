using System.Text;

namespace StratLink.Tables;

/// <summary>
/// Collects one column while the rows stream past. Whether a column is numeric is only known at the
/// end (a text column such as a sample id or a comment is simply not a signal), so the numbers go
/// into a buffer and the first few text cells are remembered for the messages.
/// </summary>
internal sealed class ColumnBuilder(string name, bool keepText, Encoding encoding)
{
    /// <summary>Text cells remembered per column for messages.</summary>
    public const int TextSamples = 20;

    private readonly GrowableBuffer<double> _values = new();
    private readonly List<(int Line, string Text)> _textSamples = [];
    private readonly GrowableBuffer<int> _textCodes = new();
    private readonly Dictionary<string, int> _textCodeOf = new(StringComparer.Ordinal);
    private readonly List<string> _texts = [];

    public string Name { get; } = name;
    public int Numbers { get; private set; }
    public int TextCells { get; private set; }
    public IReadOnlyList<(int Line, string Text)> TextSamplesSeen => _textSamples;

    public void Add(ReadOnlySpan<byte> cell, int line, CellParser parser)
    {
        var kind = parser.Parse(cell, out double v);
        _values.Add(v);
        if (kind == CellKind.Number) Numbers++;
        if (kind == CellKind.Text)
        {
            TextCells++;
            if (_textSamples.Count < TextSamples) _textSamples.Add((line, Decode(cell, 80)));
        }
        if (keepText)
        {
            // Text columns kept whole (section ids) store a code per row, each distinct text once.
            if (kind == CellKind.Missing) _textCodes.Add(-1);
            else
            {
                string s = Decode(cell, int.MaxValue);
                if (!_textCodeOf.TryGetValue(s, out int code))
                {
                    code = _texts.Count;
                    _textCodeOf.Add(s, code);
                    _texts.Add(s);
                }
                _textCodes.Add(code);
            }
        }
    }

    public double[] NumbersArray() => _values.ToArray();

    /// <summary>Cell texts of a kept text column, null where missing.</summary>
    public string?[] TextArray()
    {
        var result = new string?[_textCodes.Count];
        for (int i = 0; i < result.Length; i++) result[i] = _textCodes[i] < 0 ? null : _texts[_textCodes[i]];
        return result;
    }

    private string Decode(ReadOnlySpan<byte> cell, int maxBytes)
    {
        var trimmed = CellParser.Trim(cell);
        if (trimmed.Length > maxBytes) trimmed = trimmed[..maxBytes];
        return encoding.GetString(trimmed);
    }
}
