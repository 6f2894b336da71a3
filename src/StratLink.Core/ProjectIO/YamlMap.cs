using System.Globalization;
using System.Text.RegularExpressions;
using StratLink.Checks;
using StratLink.Quantities;
using YamlDotNet.RepresentationModel;

namespace StratLink.ProjectIO;

/// <summary>
/// Reads one YAML mapping of the project file with line-numbered problems. Every key read is
/// remembered; <see cref="Finish"/> reports the keys nobody asked for, so a misspelt key is an error
/// instead of a silently lost setting.
/// </summary>
internal sealed partial class YamlMap
{
    private readonly YamlMappingNode _node;
    private readonly ReadContext _ctx;
    private readonly HashSet<string> _known = new(StringComparer.Ordinal);

    public YamlMap(YamlMappingNode node, string path, ReadContext ctx)
    {
        _node = node;
        Path = path;
        _ctx = ctx;
        foreach (var (k, v) in node.Children)
            if (k is YamlScalarNode ks && ks.Value is not null) ctx.Map.Set(Join(ks.Value), (int)k.Start.Line);
    }

    public string Path { get; }
    public int Line => (int)_node.Start.Line;
    public ReadContext Context => _ctx;

    public IEnumerable<string> Keys =>
        _node.Children.Keys.OfType<YamlScalarNode>().Select(k => k.Value ?? "");

    public string Join(string key) => Path.Length == 0 ? key : Path + "." + key;

    public bool Has(string key) => Get(key) is not null;

    /// <summary>This mapping's place in the format: its path with list positions and ids written <c>[]</c>.</summary>
    public string Section => ListIndex().Replace(Path, "[]");

    public YamlNode? Get(string key)
    {
        if (_known.Add(key)) _ctx.KeysAsked.Add((Section, key));
        return _node.Children.TryGetValue(new YamlScalarNode(key), out var n) ? n : null;
    }

    public int LineOf(string key) => Get(key) is { } n ? (int)n.Start.Line : Line;

    public void Error(string key, string message) =>
        _ctx.Problems.AddError(ProjectCodes.InvalidValue, message, _ctx.File, LineOf(key), Join(key));

    private void Missing(string key) =>
        _ctx.Problems.AddError(ProjectCodes.MissingKey, $"required key '{key}' is missing", _ctx.File, Line, Join(key));

    public string? String(string key, bool required = false)
    {
        var n = Get(key);
        if (n is null) { if (required) Missing(key); return null; }
        if (n is YamlScalarNode s && !IsNull(s)) return s.Value;
        if (n is YamlScalarNode) { if (required) Missing(key); return null; }
        Error(key, "expected a single value");
        return null;
    }

    public double? Double(string key, bool required = false)
    {
        var n = Get(key);
        if (n is null) { if (required) Missing(key); return null; }
        return ReadDouble(n, Join(key), _ctx);
    }

    public int? Int(string key, bool required = false)
    {
        var n = Get(key);
        if (n is null) { if (required) Missing(key); return null; }
        if (n is YamlScalarNode s && int.TryParse(s.Value, NumberStyles.Integer, CultureInfo.InvariantCulture, out int v)) return v;
        Error(key, $"expected a whole number, found '{Describe(n)}'");
        return null;
    }

    public bool? Bool(string key)
    {
        var n = Get(key);
        if (n is null) return null;
        if (n is YamlScalarNode s)
        {
            switch (s.Value?.Trim().ToLowerInvariant())
            {
                case "true" or "yes" or "on": return true;
                case "false" or "no" or "off": return false;
            }
        }
        Error(key, $"expected true or false, found '{Describe(n)}'");
        return null;
    }

    public CoreDepth? Depth(string key, bool required = false) =>
        Double(key, required) is double d ? CoreDepth.From(d, _ctx.Unit) : null;

    public YamlMap? Map(string key)
    {
        var n = Get(key);
        if (n is null || n is YamlScalarNode { Value: null or "" or "~" or "null" }) return null;
        if (n is YamlMappingNode m) return new YamlMap(m, Join(key), _ctx);
        Error(key, "expected a mapping of keys to values");
        return null;
    }

    public YamlSequenceNode? Sequence(string key)
    {
        var n = Get(key);
        if (n is null || n is YamlScalarNode { Value: null or "" or "~" or "null" }) return null;
        if (n is YamlSequenceNode s) return s;
        Error(key, "expected a list");
        return null;
    }

    /// <summary>A list of strings, written either as a YAML list or a single value.</summary>
    public List<string>? StringList(string key)
    {
        var n = Get(key);
        if (n is null) return null;
        if (n is YamlScalarNode s) return IsNull(s) ? [] : [s.Value!];
        if (n is YamlSequenceNode seq)
        {
            var list = new List<string>();
            foreach (var item in seq)
            {
                if (item is YamlScalarNode si && si.Value is not null) list.Add(si.Value);
                else _ctx.Problems.AddError(ProjectCodes.InvalidValue, "expected a single value in the list", _ctx.File, (int)item.Start.Line, Join(key));
            }
            return list;
        }
        Error(key, "expected a list");
        return null;
    }

    /// <summary>A mapping of free names (column names, signal names) to single values; its names are data, not keys of the format.</summary>
    public System.Collections.Immutable.ImmutableDictionary<string, string> StringMap(string key)
    {
        var empty = System.Collections.Immutable.ImmutableDictionary<string, string>.Empty;
        var n = Get(key);
        if (n is null || n is YamlScalarNode s0 && IsNull(s0)) return empty;
        if (n is not YamlMappingNode map)
        {
            Error(key, "expected a mapping of names to values");
            return empty;
        }
        var b = System.Collections.Immutable.ImmutableDictionary.CreateBuilder<string, string>(StringComparer.Ordinal);
        foreach (var (k, v) in map.Children)
        {
            if (k is YamlScalarNode { Value: { Length: > 0 } name } && v is YamlScalarNode { Value: { Length: > 0 } value })
            {
                if (!b.TryAdd(name, value))
                    _ctx.Problems.AddError(ProjectCodes.InvalidValue, $"'{name}' is listed twice", _ctx.File, (int)k.Start.Line, Join(key));
            }
            else _ctx.Problems.AddError(ProjectCodes.InvalidValue, "expected name: value", _ctx.File, (int)k.Start.Line, Join(key));
        }
        return b.ToImmutable();
    }

    /// <summary>Reports every key present but never asked for, with a near spelling when there is one.</summary>
    public void Finish()
    {
        foreach (var (k, _) in _node.Children)
        {
            string name = (k as YamlScalarNode)?.Value ?? "";
            if (_known.Contains(name)) continue;
            string? near = _known.Where(c => Distance(c, name) <= 2).OrderBy(c => Distance(c, name)).FirstOrDefault();
            string hint = near is null ? $"; known keys here: {string.Join(", ", _known.Order(StringComparer.Ordinal))}" : $" (did you mean '{near}'?)";
            _ctx.Problems.AddError(ProjectCodes.UnknownKey, $"unknown key '{name}'{hint}", _ctx.File, (int)k.Start.Line, Join(name));
        }
    }

    internal static bool IsNull(YamlScalarNode s) =>
        s.Style == YamlDotNet.Core.ScalarStyle.Plain && s.Value is null or "" or "~" or "null" or "Null" or "NULL";

    internal static double? ReadDouble(YamlNode n, string path, ReadContext ctx)
    {
        if (n is YamlScalarNode s && TryParseNumber(s.Value, out double v))
        {
            if (double.IsFinite(v)) return v;
            ctx.Problems.AddError(ProjectCodes.InvalidValue, $"expected a finite number, found '{s.Value}'", ctx.File, (int)n.Start.Line, path);
            return null;
        }
        ctx.Problems.AddError(ProjectCodes.InvalidValue, $"expected a number, found '{Describe(n)}'", ctx.File, (int)n.Start.Line, path);
        return null;
    }

    /// <summary>Invariant numbers; a lone decimal comma (<c>152,3</c>) is accepted since a YAML scalar cannot be ambiguous about it.</summary>
    internal static bool TryParseNumber(string? text, out double value)
    {
        text = text?.Trim();
        if (string.IsNullOrEmpty(text)) { value = 0; return false; }
        if (DecimalComma().IsMatch(text)) text = text.Replace(',', '.');
        return double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out value);
    }

    internal static string Describe(YamlNode n) => n switch
    {
        YamlScalarNode s => s.Value is { Length: > 40 } v ? v[..40] + "..." : s.Value ?? "",
        YamlSequenceNode => "a list",
        YamlMappingNode => "a mapping",
        _ => "?",
    };

    private static int Distance(string a, string b)
    {
        var d = new int[a.Length + 1, b.Length + 1];
        for (int i = 0; i <= a.Length; i++) d[i, 0] = i;
        for (int j = 0; j <= b.Length; j++) d[0, j] = j;
        for (int i = 1; i <= a.Length; i++)
            for (int j = 1; j <= b.Length; j++)
                d[i, j] = Math.Min(Math.Min(d[i - 1, j] + 1, d[i, j - 1] + 1), d[i - 1, j - 1] + (a[i - 1] == b[j - 1] ? 0 : 1));
        return d[a.Length, b.Length];
    }

    [GeneratedRegex(@"^[+-]?\d+,\d+$")]
    private static partial Regex DecimalComma();

    [GeneratedRegex(@"\[[^\]]*\]")]
    private static partial Regex ListIndex();
}
