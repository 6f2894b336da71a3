using System.Collections.Immutable;
using System.Globalization;
using System.Text.RegularExpressions;

namespace StratLink.Tables;

/// <summary>
/// Reads the metadata in a table's preamble, for the two layouts data archives serve: a
/// <c>/* DATA DESCRIPTION: ... */</c> block of <c>Field:&lt;tab&gt;value</c> lines (Citation, Event(s) with
/// LATITUDE and LONGITUDE, Parameter(s)), column names <c>Name [unit]</c>; and the NOAA paleoclimate
/// text layout, <c>#</c> lines holding the site, its position, the publication and the variables with
/// their units. Whatever is not there stays null; nothing here is required to read the table.
/// </summary>
public static partial class ArchiveMetadataReader
{
    public static ArchiveMetadata Read(string path, TableLayout layout)
    {
        var preamble = new List<string>();
        using (var reader = new StreamReader(path, layout.Encoding, detectEncodingFromByteOrderMarks: true))
        {
            string? line;
            while (preamble.Count < layout.HeaderLine - 1 && (line = reader.ReadLine()) is not null) preamble.Add(line);
        }
        var units = ImmutableDictionary.CreateBuilder<string, string>(StringComparer.Ordinal);
        foreach (string column in layout.Columns)
            if (BracketUnit().Match(column) is { Success: true } m) units[column] = m.Groups[1].Value.Trim();

        int blockStart = preamble.FindIndex(l => l.TrimStart().StartsWith("/*", StringComparison.Ordinal));
        var meta = blockStart >= 0 ? FromBlock(preamble, blockStart, units)
            : preamble.Any(l => l.TrimStart().StartsWith('#')) ? FromNoaa(preamble, layout.Columns, units)
            : new ArchiveMetadata();
        return meta with { Units = units.ToImmutable() };
    }

    private static ArchiveMetadata FromBlock(List<string> lines, int start, ImmutableDictionary<string, string>.Builder units)
    {
        var fields = new Dictionary<string, List<string>>(StringComparer.OrdinalIgnoreCase);
        List<string>? current = null;
        for (int i = start; i < lines.Count; i++)
        {
            string line = lines[i];
            if (i == start) line = line.TrimStart()[2..];
            bool last = line.Contains("*/", StringComparison.Ordinal);
            if (last) line = line[..line.IndexOf("*/", StringComparison.Ordinal)];
            if (BlockField().Match(line) is { Success: true } f)
            {
                current = [];
                fields[f.Groups[1].Value.Trim()] = current;
                if (f.Groups[2].Value.Trim() is { Length: > 0 } v) current.Add(v);
            }
            else if (current is not null && line.Trim() is { Length: > 0 } more) current.Add(more);
            if (last) break;
        }
        string? First(string key) => fields.TryGetValue(key, out var v) && v.Count > 0 ? v[0] : null;
        string? events = First("Event(s)"), coverage = string.Join(" * ", fields.GetValueOrDefault("Coverage") ?? []);
        double? lat = Tagged(events, "LATITUDE") ?? Tagged(coverage, "LATITUDE") ?? Tagged(coverage, "MINIMUM LATITUDE");
        double? lon = Tagged(events, "LONGITUDE") ?? Tagged(coverage, "LONGITUDE") ?? Tagged(coverage, "MINIMUM LONGITUDE");
        // Parameter(s) lines read "Name [unit] (Short name) * ...": the header may use either name.
        foreach (string p in fields.GetValueOrDefault("Parameter(s)") ?? [])
            if (ParameterLine().Match(p) is { Success: true } pm)
            {
                units.TryAdd(pm.Groups[1].Value.Trim(), pm.Groups[2].Value.Trim());
                if (pm.Groups[3].Success) units.TryAdd(pm.Groups[3].Value.Trim(), pm.Groups[2].Value.Trim());
            }
        return new ArchiveMetadata
        {
            Layout = ArchiveMetadata.DescriptionBlock,
            Site = events?.Split(" * ")[0].Trim() is { Length: > 0 } site ? site : null,
            Latitude = lat, Longitude = lon,
            Citation = First("Citation"),
        };
    }

    private static ArchiveMetadata FromNoaa(List<string> lines, IReadOnlyList<string> columns, ImmutableDictionary<string, string>.Builder units)
    {
        var text = lines.Where(l => l.TrimStart().StartsWith('#')).Select(l => l.TrimStart().TrimStart('#')).ToList();
        string? Value(params string[] keys)
        {
            foreach (string t in text)
                foreach (string k in keys)
                    if (t.TrimStart().StartsWith(k + ":", StringComparison.OrdinalIgnoreCase))
                        return t.TrimStart()[(k.Length + 1)..].Trim() is { Length: > 0 } v ? v : null;
            return null;
        }
        string? missing = Value("Missing_Values", "Missing Values");
        if (missing is null && text.FirstOrDefault(t => t.Contains("Missing Values indicated by", StringComparison.OrdinalIgnoreCase)) is { } ml)
            missing = Quoted().Match(ml) is { Success: true } q ? q.Groups[1].Value : null;

        // Old-style variables list ("name  Description (unit)") and the template's "## name<tab>what,material,error,units,...".
        int vars = text.FindIndex(t => t.Trim().Equals("Variables:", StringComparison.OrdinalIgnoreCase));
        for (int i = vars + 1; vars >= 0 && i < text.Count && text[i].Trim().Length > 0 && !text[i].TrimStart().StartsWith('-'); i++)
        {
            var parts = text[i].Trim().Split((char[]?)null, 2, StringSplitOptions.RemoveEmptyEntries);
            if (parts.Length == 2 && columns.Contains(parts[0], StringComparer.Ordinal) && ShortUnit().Match(parts[1]) is { Success: true } u)
                units.TryAdd(parts[0], u.Groups[1].Value);
        }
        foreach (string l in lines.Where(l => l.StartsWith("##", StringComparison.Ordinal)))
        {
            var parts = l[2..].Trim().Split('\t', 2);
            if (parts.Length == 2 && parts[1].Split(',') is { Length: >= 4 } f && f[3].Trim() is { Length: > 0 } unit) units.TryAdd(parts[0].Trim(), unit);
        }
        var meta = new ArchiveMetadata
        {
            Layout = ArchiveMetadata.NoaaText,
            Site = Value("Site_Name", "Core/Site", "Site", "Core"),
            Latitude = Degrees(Value("Latitude", "Northernmost_Latitude")),
            Longitude = Degrees(Value("Longitude", "Easternmost_Longitude")),
            Citation = Value("Full_Citation", "Citation") ?? FirstPublication(text),
            MissingValue = missing?.Trim('\'', '"'),
        };
        // Comment lines that say none of this are just comments, not the archive's layout.
        bool said = meta.Site is not null || meta.Latitude is not null || meta.Longitude is not null || meta.Citation is not null || meta.MissingValue is not null;
        return said ? meta : new ArchiveMetadata();
    }

    /// <summary>The first entry of an old-style "Publications:" list: its first line and the more indented lines after it.</summary>
    private static string? FirstPublication(List<string> text)
    {
        int at = text.FindIndex(t => t.Trim().Equals("Publications:", StringComparison.OrdinalIgnoreCase) || t.Trim().Equals("Publication:", StringComparison.OrdinalIgnoreCase));
        if (at < 0 || at + 1 >= text.Count || text[at + 1].Trim().Length == 0) return null;
        int indent(string s) => s.Length - s.TrimStart().Length;
        var parts = new List<string> { text[at + 1].Trim() };
        int first = indent(text[at + 1]);
        for (int i = at + 2; i < text.Count && text[i].Trim().Length > 0 && indent(text[i]) > first; i++) parts.Add(text[i].Trim());
        return string.Join(" ", parts);
    }

    /// <summary>A position as decimal degrees: the number in parentheses when the text gives one (<c>0.11.00N ( 0.18333)</c>), else the first number.</summary>
    private static double? Degrees(string? text)
    {
        if (text is null) return null;
        var m = Parenthesised().Match(text);
        if (!m.Success) m = Number().Match(text);
        return m.Success && double.TryParse(m.Groups[1].Value, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) ? v : null;
    }

    private static double? Tagged(string? text, string tag)
    {
        if (text is null) return null;
        var m = Regex.Match(text, @"(?:^|\*)\s*" + Regex.Escape(tag) + @":\s*([+-]?\d+(?:\.\d+)?)", RegexOptions.CultureInvariant);
        return m.Success ? double.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture) : null;
    }

    [GeneratedRegex(@"\[([^\]]+)\]\s*$")]
    private static partial Regex BracketUnit();

    [GeneratedRegex(@"^([A-Za-z][A-Za-z ()/]*):\t?(.*)$")]
    private static partial Regex BlockField();

    [GeneratedRegex(@"^(.+?)\s*\[([^\]]+)\]\s*(?:\(([^)]+)\))?")]
    private static partial Regex ParameterLine();

    [GeneratedRegex(@"\((\w{1,8})\)\s*$")]
    private static partial Regex ShortUnit();

    [GeneratedRegex(@"'([^']*)'")]
    private static partial Regex Quoted();

    [GeneratedRegex(@"\(\s*([+-]?\d+(?:\.\d+)?)\s*\)")]
    private static partial Regex Parenthesised();

    [GeneratedRegex(@"([+-]?\d+(?:\.\d+)?)")]
    private static partial Regex Number();
}
