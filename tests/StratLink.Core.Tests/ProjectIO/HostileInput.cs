using System.Text;
using FsCheck;
using FsCheck.Fluent;

namespace StratLink.Tests.ProjectIO;

/// <summary>Generators of hostile text for the readers: mutations of valid files and raw junk.</summary>
internal static class HostileInput
{
    /// <summary>Numbers that have broken parsers: overflow, underflow, NaN and infinity spellings, hex, locale forms.</summary>
    public static readonly string[] HostileNumbers =
    [
        "1e309", "-1e309", "1e-400", "NaN", "nan", ".nan", ".NaN", "Infinity", "-Infinity", ".inf", "-.inf", "∞",
        "99999999999999999999999999999999999999", "-0", "0x1F", "1,5", "1.5.5", "1e", "--1", "+", "", "4,294,967,296",
        "2147483648", "-2147483649", "1_000", "١٢٣",
    ];

    /// <summary>Fragments with a meaning in YAML: anchors, aliases, tags, flow and block markers, directives.</summary>
    public static readonly string[] YamlFragments =
    [
        "&a ", "*a", "&a [*a, *a]", "!!binary ", "!!python/object:os.system ", "!custom ", "? ", "- ", "{", "}", "[", "]",
        "|", ">", "%YAML 1.2\n", "---\n", "...\n", ": ", "#", "\"", "'", "\t", "\n", "\r", "\r\n", "\u0085", "\u2028",
        "\0", "\ufeff", "\ud800", "<<: *a\n", "key: &anchor\n  - *anchor\n", "  ", "    - [", "~", "null", "!!str ",
    ];

    /// <summary>Applies 1-4 random mutations to <paramref name="valid"/>.</summary>
    public static Gen<string> Mutated(string valid, string[] extraFragments) =>
        Gen.Choose(1, 4).SelectMany(n => Gen.ListOf(Mutation(extraFragments), n))
            .Select(ms => ms.Aggregate(valid, (text, m) => m(text)));

    private static Gen<Func<string, string>> Mutation(string[] extraFragments)
    {
        var position = Gen.Choose(0, 1_000_000).Select(p => (Func<string, int>)(t => t.Length == 0 ? 0 : p % (t.Length + 1)));
        var fragment = Gen.Elements(YamlFragments.Concat(HostileNumbers).Concat(extraFragments).ToArray());
        var junkBytes = Gen.Choose(1, 16).SelectMany(n => Gen.ArrayOf(Gen.Choose(0, 255).Select(b => (char)b), n))
            .Select(cs => new string(cs));
        return Gen.OneOf(
            // Truncate anywhere (a file cut short by a full disk or a killed editor).
            position.Select(at => (Func<string, string>)(t => t[..at(t)])),
            // Insert a meaningful fragment or raw bytes.
            Gen.Zip(position, fragment).Select(x => (Func<string, string>)(t => t.Insert(x.Item1(t), x.Item2))),
            Gen.Zip(position, junkBytes).Select(x => (Func<string, string>)(t => t.Insert(x.Item1(t), x.Item2))),
            // Replace every number with one hostile number.
            Gen.Elements(HostileNumbers).Select(h => (Func<string, string>)(t => System.Text.RegularExpressions.Regex.Replace(t, @"(?<=[:\[, ])-?\d+(\.\d+)?", h))),
            // Duplicate, delete or re-indent a line.
            Gen.Choose(0, 10_000).Select(k => (Func<string, string>)(t => EditLine(t, k, (ls, i) => ls.Insert(i, ls[i])))),
            Gen.Choose(0, 10_000).Select(k => (Func<string, string>)(t => EditLine(t, k, (ls, i) => ls.RemoveAt(i)))),
            Gen.Zip(Gen.Choose(0, 10_000), Gen.Choose(-4, 6)).Select(x => (Func<string, string>)(t => EditLine(t, x.Item1, (ls, i) =>
                ls[i] = x.Item2 >= 0 ? new string(' ', x.Item2) + ls[i] : ls[i].TrimStart()))));
    }

    private static string EditLine(string text, int k, Action<List<string>, int> edit)
    {
        var lines = text.Split('\n').ToList();
        edit(lines, k % lines.Count);
        return string.Join('\n', lines);
    }

    /// <summary>Short text from characters that matter to YAML and CSV readers, plus anything at all.</summary>
    public static Gen<string> Junk() =>
        Gen.ArrayOf(Gen.Frequency(
                (6, Gen.Elements(":-[]{},#&*!|>'\"\n\t ?%@`~0123456789.eE+abcdxyz_;".ToCharArray())),
                (1, Gen.Choose(0, 0xFFFF).Select(c => (char)c))))
            .Select(cs => new string(cs));

    /// <summary>Raw bytes as a file would hold them (decoded by the reader itself).</summary>
    public static Gen<byte[]> Bytes() => Gen.ArrayOf(Gen.Choose(0, 255).Select(b => (byte)b));

    public static string Utf8(byte[] bytes) => Encoding.UTF8.GetString(bytes);
}
