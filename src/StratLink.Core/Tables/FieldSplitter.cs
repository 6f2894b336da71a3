using System.Text;

namespace StratLink.Tables;

/// <summary>Splits one line of bytes into field ranges: on runs of blanks, or on one delimiter honouring RFC 4180 quotes.</summary>
internal static class FieldSplitter
{
    public static void Split(ReadOnlySpan<byte> line, Delimiter delimiter, List<Range> fields)
    {
        fields.Clear();
        if (delimiter == Delimiter.Whitespace)
        {
            int i = 0;
            while (true)
            {
                while (i < line.Length && IsBlank(line[i])) i++;
                if (i == line.Length) return;
                int start = i;
                while (i < line.Length && !IsBlank(line[i])) i++;
                fields.Add(start..i);
            }
        }
        byte sep = (byte)delimiter.Char();
        int pos = 0;
        while (true)
        {
            int start = pos;
            int p = pos;
            while (p < line.Length && line[p] != sep && IsBlank(line[p])) p++;
            if (p < line.Length && line[p] == (byte)'"')
            {
                // Quoted: a doubled quote is a quote; the field runs to the closing quote, then to the delimiter.
                p++;
                while (p < line.Length)
                {
                    if (line[p] == (byte)'"')
                    {
                        if (p + 1 < line.Length && line[p + 1] == (byte)'"') p += 2;
                        else { p++; break; }
                    }
                    else p++;
                }
            }
            int end = line[p..].IndexOf(sep);
            end = end < 0 ? line.Length : p + end;
            fields.Add(start..end);
            if (end == line.Length) return;
            pos = end + 1;
        }
    }

    /// <summary>A field as text: blanks trimmed, surrounding quotes removed and doubled quotes undone.</summary>
    public static string Text(ReadOnlySpan<byte> field, Encoding encoding)
    {
        var t = CellParser.Trim(field);
        string s = encoding.GetString(t);
        if (s.Length >= 2 && s[0] == '"' && s[^1] == '"') s = s[1..^1].Replace("\"\"", "\"");
        return s.Trim();
    }

    public static bool IsBlank(byte b) => b is (byte)' ' or (byte)'\t';
}
