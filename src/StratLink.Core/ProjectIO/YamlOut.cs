using System.Globalization;
using YamlDotNet.Core;
using YamlDotNet.Core.Events;
using YamlDotNet.RepresentationModel;

namespace StratLink.ProjectIO;

/// <summary>Node builders for writing project files: invariant numbers, quoting where a plain scalar would change type.</summary>
internal static class YamlOut
{
    public static YamlScalarNode Num(double v) => new(v.ToString("R", CultureInfo.InvariantCulture));
    public static YamlScalarNode Num(int v) => new(v.ToString(CultureInfo.InvariantCulture));
    public static YamlScalarNode Bool(bool v) => new(v ? "true" : "false");

    public static YamlScalarNode Str(string v)
    {
        bool ambiguous = v.Length == 0 || YamlMap.TryParseNumber(v, out _) || v.Trim() != v
            || v.ToLowerInvariant() is "true" or "false" or "yes" or "no" or "on" or "off" or "null" or "~"
            || v.IndexOfAny([':', '#', '[', ']', '{', '}', ',', '&', '*', '!', '|', '>', '\'', '"', '%', '@', '`']) >= 0
            || v.StartsWith('-') || v.StartsWith('?');
        return new YamlScalarNode(v) { Style = ambiguous ? ScalarStyle.DoubleQuoted : ScalarStyle.Any };
    }

    public static YamlSequenceNode FlowNums(params double[] values)
    {
        var s = new YamlSequenceNode(values.Select(v => (YamlNode)Num(v))) { Style = SequenceStyle.Flow };
        return s;
    }

    public static YamlSequenceNode FlowStrs(IEnumerable<string> values) =>
        new(values.Select(v => (YamlNode)Str(v))) { Style = SequenceStyle.Flow };

    public static YamlMappingNode FlowMap(IEnumerable<KeyValuePair<string, string>> pairs)
    {
        var n = new YamlMappingNode { Style = MappingStyle.Flow };
        foreach (var (k, v) in pairs.OrderBy(p => p.Key, StringComparer.Ordinal)) n.Add(Str(k), Str(v));
        return n;
    }
}
