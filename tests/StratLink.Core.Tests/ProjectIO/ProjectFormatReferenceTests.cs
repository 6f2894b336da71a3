using System.Globalization;
using System.Text;
using System.Text.Json;
using System.Text.RegularExpressions;
using StratLink.ProjectIO;
using StratLink.Tests.TestSupport;

namespace StratLink.Tests.ProjectIO;

/// <summary>
/// The project format documents itself: docs/project-file-reference.md (one table per section) and
/// docs/stratlink-project.schema.json must list exactly the keys the reader accepts. The reader's keys
/// come from its own code: a probe file holding every key the schema knows (one list item per age
/// kind) is read, and every key a section reader asked for is recorded. A key added to a reader
/// without the schema and the reference, or listed there but not read, fails here.
/// </summary>
public sealed partial class ProjectFormatReferenceTests
{
    private static readonly string Docs = Path.Combine(RepoPaths.Root, "docs");
    private static JsonElement Schema => JsonDocument.Parse(File.ReadAllText(Path.Combine(Docs, ProjectSchema.FileName))).RootElement;

    [Fact]
    public void The_schema_lists_exactly_the_keys_the_reader_accepts()
    {
        var (schemaKeys, freeMaps) = SchemaKeys(Schema);
        var asked = ProjectReader.KeysAccepted(Probe(Schema)).Where(k => !freeMaps.Contains(k.Section)).ToHashSet();
        var notInSchema = asked.Except(schemaKeys).Select(Show).Order(StringComparer.Ordinal).ToList();
        var notRead = schemaKeys.Except(asked).Select(Show).Order(StringComparer.Ordinal).ToList();
        Assert.True(notInSchema.Count == 0, "the reader accepts keys the schema does not list: " + string.Join(", ", notInSchema));
        Assert.True(notRead.Count == 0, "the schema lists keys the reader does not accept: " + string.Join(", ", notRead));
    }

    [Fact]
    public void The_reference_page_lists_exactly_the_keys_of_the_schema_with_type_default_unit_and_version()
    {
        var (schemaKeys, _) = SchemaKeys(Schema);
        var rows = ReferenceRows(File.ReadAllLines(Path.Combine(Docs, "project-file-reference.md")));
        var listed = rows.Select(r => (r.Section, r.Key)).ToHashSet();
        Assert.Equal(rows.Count, listed.Count); // no key twice
        Assert.True(listed.SetEquals(schemaKeys),
            "reference and schema differ: only in the reference " + string.Join(", ", listed.Except(schemaKeys).Select(Show))
            + "; only in the schema " + string.Join(", ", schemaKeys.Except(listed).Select(Show)));
        foreach (var r in rows)
        {
            Assert.True(r.Cells.Length == 6 && r.Cells[1..4].All(c => c.Length > 0), $"row {Show((r.Section, r.Key))} needs type, default and unit (— for none)");
            Assert.Matches(Version(), r.Cells[4]);
        }
        // The keys that came with tables as they are, archive metadata and `stratlink new`.
        foreach (string key in new[] { "repeated_depths", "columns", "units", "citation", "latitude", "longitude" })
            Assert.Equal("0.2.0", rows.Single(r => r.Section == "cores[]" && r.Key == key).Cells[4]);
    }

    [Fact]
    public void The_demo_project_names_the_schema_on_its_first_line_and_the_schema_is_shipped_beside_it()
    {
        string demo = Directory.GetFiles(RepoPaths.DemoDirectory, "*.stratlink.yaml").Single();
        Assert.Equal(ProjectSchema.ModelineComment, File.ReadLines(demo).First());
        Assert.Equal(File.ReadAllText(Path.Combine(Docs, ProjectSchema.FileName)), File.ReadAllText(Path.Combine(RepoPaths.DemoDirectory, ProjectSchema.FileName)));
        Assert.Equal(File.ReadAllText(Path.Combine(Docs, ProjectSchema.FileName)), ProjectSchema.Text);
    }

    private static string Show((string Section, string Key) k) => k.Section.Length == 0 ? k.Key : k.Section + "." + k.Key;

    /// <summary>Every (section, key) of the schema, and the sections that are mappings of free names.</summary>
    private static (HashSet<(string, string)> Keys, HashSet<string> FreeMaps) SchemaKeys(JsonElement root)
    {
        var keys = new HashSet<(string, string)>();
        var free = new HashSet<string>(StringComparer.Ordinal);
        void Walk(string section, JsonElement obj)
        {
            foreach (var p in obj.GetProperty("properties").EnumerateObject())
            {
                keys.Add((section, p.Name));
                string sub = section.Length == 0 ? p.Name : section + "." + p.Name;
                foreach (var (path, o) in Objects(sub, p.Value))
                    if (o.TryGetProperty("properties", out _)) Walk(path, o);
                    else free.Add(path);
            }
        }
        Walk("", root);
        return (keys, free);
    }

    /// <summary>The mappings a property holds: itself, its list items (<c>[]</c>) and those of its alternatives.</summary>
    private static IEnumerable<(string Path, JsonElement Object)> Objects(string path, JsonElement p)
    {
        if (p.TryGetProperty("type", out var t) && t.GetString() == "object") yield return (path, p);
        if (p.TryGetProperty("items", out var items) && items.ValueKind == JsonValueKind.Object)
            foreach (var x in Objects(path + "[]", items)) yield return x;
        if (p.TryGetProperty("oneOf", out var alts))
            foreach (var a in alts.EnumerateArray())
                foreach (var x in Objects(path, a)) yield return x;
    }

    /// <summary>A YAML file giving every key of the schema a value of its type; the list of ages holds one item per kind.</summary>
    private static string Probe(JsonElement root)
    {
        var sb = new StringBuilder();
        foreach (var p in root.GetProperty("properties").EnumerateObject())
        {
            if (p.Name == "ages")
            {
                var item = p.Value.GetProperty("items");
                var kinds = item.GetProperty("properties").GetProperty("kind").GetProperty("enum").EnumerateArray().Select(k => k.GetString()!);
                sb.Append("ages: [").Append(string.Join(", ", kinds.Select((k, i) =>
                    "{" + string.Join(", ", item.GetProperty("properties").EnumerateObject().Select(q => q.Name + ": " + (q.Name == "kind" ? k : q.Name == "id" ? $"a{i}" : Value(q.Value)))) + "}"))).Append("]\n");
            }
            else sb.Append(p.Name).Append(": ").Append(Value(p.Value)).Append('\n');
        }
        return sb.ToString();
    }

    private static string Value(JsonElement p)
    {
        if (p.TryGetProperty("const", out var c)) return c.ToString();
        if (p.TryGetProperty("enum", out var e)) return e[0].ToString();
        if (p.TryGetProperty("oneOf", out var alts))
            return Value(alts.EnumerateArray().FirstOrDefault(a => a.TryGetProperty("type", out var at) && at.GetString() == "array", alts[0]));
        string type = p.TryGetProperty("type", out var t) ? t.GetString()! : "string";
        return type switch
        {
            "number" => p.TryGetProperty("minimum", out var min) ? min.GetDouble().ToString(CultureInfo.InvariantCulture) : "1",
            "integer" => p.TryGetProperty("minimum", out var imin) ? imin.GetInt32().ToString(CultureInfo.InvariantCulture) : "1",
            "boolean" => "false",
            "array" when p.GetProperty("items") is { } items => items.TryGetProperty("type", out var it) && it.GetString() == "array" ? "[[0, 1]]"
                : "[" + Value(items) + "]",
            "object" when p.TryGetProperty("properties", out var props) =>
                "{" + string.Join(", ", props.EnumerateObject().Select(q => q.Name + ": " + Value(q.Value))) + "}",
            "object" => "{a: " + Value(p.GetProperty("additionalProperties")) + "}",
            _ => "x",
        };
    }

    private sealed record Row(string Section, string Key, string[] Cells);

    /// <summary>The key rows of the reference: under each "## `section`" heading (or "## top level"), rows "| `key` | ... |".</summary>
    private static List<Row> ReferenceRows(string[] lines)
    {
        var rows = new List<Row>();
        string? section = null;
        foreach (string line in lines)
        {
            if (line.StartsWith("## ", StringComparison.Ordinal))
                section = line == "## top level" ? "" : Heading().Match(line) is { Success: true } h ? h.Groups[1].Value : null;
            else if (section is not null && KeyRow().Match(line) is { Success: true } m)
                rows.Add(new Row(section, m.Groups[1].Value, Cells(line)));
        }
        return rows;
    }

    private static string[] Cells(string line) =>
        Regex.Split(line.Trim().Trim('|'), @"(?<!\\)\|").Select(c => c.Trim()).ToArray();

    [GeneratedRegex(@"^## `([^`]+)`$")]
    private static partial Regex Heading();

    [GeneratedRegex(@"^\| `([^`]+)` \|")]
    private static partial Regex KeyRow();

    [GeneratedRegex(@"^\d+\.\d+\.\d+$")]
    private static partial Regex Version();
}
