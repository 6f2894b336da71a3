using System.Globalization;
using System.Text;

namespace StratLink.Tables;

/// <summary>
/// Parses table cells from their UTF-8 (or Latin-1: digits are ASCII in both) bytes without making
/// strings. Invariant numbers; where the delimiter is not a comma, a decimal comma (<c>12,5</c>) is
/// accepted as well. Empty, NA and NaN (any case) and the core's own missing-value texts are missing.
/// </summary>
internal sealed class CellParser
{
    private readonly bool _decimalCommaAllowed;
    private readonly byte[][] _missingTexts;
    private readonly double[] _missingNumbers;

    public CellParser(bool decimalCommaAllowed, IEnumerable<string> missingValues)
    {
        _decimalCommaAllowed = decimalCommaAllowed;
        var texts = new List<byte[]> { "NA"u8.ToArray(), "NaN"u8.ToArray() };
        var numbers = new List<double>();
        foreach (string m in missingValues)
        {
            string t = m.Trim();
            if (t.Length == 0) continue;
            texts.Add(Encoding.UTF8.GetBytes(t));
            // -999 also matches -999.0 and -999,00.
            if (double.TryParse(t.Replace(',', '.'), NumberStyles.Float, CultureInfo.InvariantCulture, out double v)) numbers.Add(v);
        }
        _missingTexts = [.. texts];
        _missingNumbers = [.. numbers];
    }

    /// <summary>Set once a cell used a decimal comma, for the mixed-marks warning.</summary>
    public bool SawDecimalComma { get; private set; }

    /// <summary>Set once a cell used a decimal point.</summary>
    public bool SawDecimalPoint { get; private set; }

    public CellKind Parse(ReadOnlySpan<byte> cell, out double value)
    {
        value = double.NaN;
        cell = Trim(cell);
        if (cell.IsEmpty) return CellKind.Missing;
        foreach (byte[] m in _missingTexts)
            if (System.Text.Ascii.EqualsIgnoreCase(cell, m) || cell.SequenceEqual(m)) return CellKind.Missing;
        if (!TryParseNumber(cell, out double v)) return CellKind.Text;
        foreach (double m in _missingNumbers)
            if (v == m) return CellKind.Missing;
        value = v;
        return CellKind.Number;
    }

    private bool TryParseNumber(ReadOnlySpan<byte> cell, out double value)
    {
        int comma = cell.IndexOf((byte)',');
        if (comma < 0)
        {
            if (!double.TryParse(cell, NumberStyles.Float, CultureInfo.InvariantCulture, out value) || !double.IsFinite(value)) return false;
            if (cell.Contains((byte)'.')) SawDecimalPoint = true;
            return true;
        }
        value = double.NaN;
        // One comma between digits, no point: a decimal comma.
        if (!_decimalCommaAllowed || cell.Length > 64 || cell.LastIndexOf((byte)',') != comma || cell.Contains((byte)'.')
            || comma == 0 || comma == cell.Length - 1 || !IsDigit(cell[comma - 1]) || !IsDigit(cell[comma + 1]))
            return false;
        Span<byte> copy = stackalloc byte[cell.Length];
        cell.CopyTo(copy);
        copy[comma] = (byte)'.';
        if (!double.TryParse(copy, NumberStyles.Float, CultureInfo.InvariantCulture, out value) || !double.IsFinite(value)) return false;
        SawDecimalComma = true;
        return true;
    }

    private static bool IsDigit(byte b) => b is >= (byte)'0' and <= (byte)'9';

    public static ReadOnlySpan<byte> Trim(ReadOnlySpan<byte> s)
    {
        int a = 0, b = s.Length;
        while (a < b && s[a] is (byte)' ' or (byte)'\t') a++;
        while (b > a && s[b - 1] is (byte)' ' or (byte)'\t') b--;
        return s[a..b];
    }
}
