using System.Text;
using StratLink.Checks;
using StratLink.Model;
using StratLink.Quantities;
using YamlDotNet.Core;
using YamlDotNet.Core.Events;
using YamlDotNet.RepresentationModel;

namespace StratLink.ProjectIO;

/// <summary>Reads and validates a project file, collecting every problem with its line and key.</summary>
public static class ProjectReader
{
    /// <summary>Project files are small; anything larger is not one (and would cost memory to parse).</summary>
    public const long MaxFileBytes = 16L * 1024 * 1024;

    private const int MaxNesting = 32;

    public static ProjectDocument Load(string path)
    {
        var ctx = new ReadContext(path);
        string text;
        try
        {
            var info = new FileInfo(path);
            if (!info.Exists)
            {
                ctx.Problems.AddError(ProjectCodes.Unreadable, "the project file does not exist", path);
                return new ProjectDocument(path, null, ctx.Problems, ctx.Map);
            }
            if (info.Length > MaxFileBytes)
            {
                ctx.Problems.AddError(ProjectCodes.Unreadable, $"the file is {info.Length} bytes; a project file is at most {MaxFileBytes} bytes", path);
                return new ProjectDocument(path, null, ctx.Problems, ctx.Map);
            }
            text = TextDecoding.Decode(File.ReadAllBytes(path));
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            ctx.Problems.AddError(ProjectCodes.Unreadable, e.Message, path);
            return new ProjectDocument(path, null, ctx.Problems, ctx.Map);
        }
        return Parse(text, path, ctx);
    }

    /// <summary>Parses project text; <paramref name="path"/> names it in messages and resolves relative paths.</summary>
    public static ProjectDocument Parse(string text, string path) => Parse(text, path, new ReadContext(path));

    /// <summary>The (section, key) pairs the reader asked for while reading <paramref name="text"/>: what it accepts there.</summary>
    internal static IReadOnlySet<(string Section, string Key)> KeysAccepted(string text)
    {
        var ctx = new ReadContext("keys.stratlink.yaml");
        Parse(text, ctx.File, ctx);
        return ctx.KeysAsked;
    }

    private static ProjectDocument Parse(string text, string path, ReadContext ctx)
    {
        var root = ParseYaml(text, ctx);
        if (root is null) return new ProjectDocument(path, null, ctx.Problems, ctx.Map);
        var m = new YamlMap(root, "", ctx);
        string? format = m.String("format", required: true);
        if (format is not null && format != Project.FormatName)
            m.Error("format", $"unknown format '{format}'; this program reads '{Project.FormatName}'");
        string? unitText = m.String("depth_unit", required: true);
        if (unitText is not null)
        {
            if (DepthUnits.TryParse(unitText, out var unit)) ctx.Unit = unit;
            else ctx.Problems.AddError(ProjectCodes.UnknownUnit, $"unknown depth unit '{unitText}' (mm, cm or m)", path, m.LineOf("depth_unit"), "depth_unit");
        }
        var project = new Project
        {
            Site = SiteSection.Read(m.Map("site")),
            DepthUnit = ctx.Unit,
            Cores = CoresSection.Read(m),
            Markers = MarkersSection.Read(m),
            Ages = AgesSection.Read(m),
            Alignment = AlignmentSection.Read(m.Map("alignment")),
            Composite = CompositeSection.Read(m.Map("composite")),
            AgeModel = AgeModelSection.Read(m.Map("age_model")),
            Checks = ChecksSection.Read(m.Map("checks")),
            Target = TargetSection.Read(m.Map("target")),
        };
        m.Finish();
        ProjectValidator.Validate(project, ctx.Problems, ctx.Map);
        return new ProjectDocument(path, project, ctx.Problems, ctx.Map);
    }

    private static YamlMappingNode? ParseYaml(string text, ReadContext ctx)
    {
        // A first pass over the events refuses aliases (the format has no use for them, and alias
        // bombs or recursive aliases would cost unbounded memory) and absurd nesting.
        int lastLine = 1;
        try
        {
            var parser = new Parser(new StringReader(text));
            int depth = 0, documents = 0;
            while (parser.MoveNext())
            {
                lastLine = (int)parser.Current!.End.Line;
                switch (parser.Current)
                {
                    case AnchorAlias a:
                        ctx.Problems.AddError(ProjectCodes.Syntax, $"YAML aliases (*{a.Value}) are not allowed in a project file; write the value out", ctx.File, (int)a.Start.Line);
                        return null;
                    case MappingStart or SequenceStart:
                        if (++depth > MaxNesting)
                        {
                            ctx.Problems.AddError(ProjectCodes.Syntax, $"nesting deeper than {MaxNesting} levels; this is not a project file", ctx.File, (int)parser.Current.Start.Line);
                            return null;
                        }
                        break;
                    case MappingEnd or SequenceEnd:
                        depth--;
                        break;
                    case DocumentStart:
                        if (++documents > 1)
                        {
                            ctx.Problems.AddError(ProjectCodes.Syntax, "a project file holds one YAML document; found a second '---'", ctx.File, (int)parser.Current.Start.Line);
                            return null;
                        }
                        break;
                }
            }
            var stream = new YamlStream();
            stream.Load(new StringReader(text));
            if (stream.Documents.Count == 0 || stream.Documents[0].RootNode is not YamlMappingNode root)
            {
                ctx.Problems.AddError(ProjectCodes.Syntax, "the file is empty or is not a mapping of keys (format, site, cores, ...)", ctx.File, 1);
                return null;
            }
            return root;
        }
        catch (YamlException e)
        {
            string msg = e.InnerException?.Message ?? e.Message;
            int cut = msg.IndexOf("): ", StringComparison.Ordinal);
            ctx.Problems.AddError(ProjectCodes.Syntax, cut >= 0 ? msg[(cut + 3)..] : msg, ctx.File, (int)e.Start.Line);
            return null;
        }
        catch (Exception e) when (e is InvalidOperationException or ArgumentException)
        {
            // The YAML library fails this way on some malformed input (a lone carriage return in a flow
            // mapping, e.g. "a: {\rb: 1}" in YamlDotNet 18.1; "the current event is of an unsupported
            // type" on a mutated block mapping found by the property tests) instead of a YamlException.
            ctx.Problems.AddError(ProjectCodes.Syntax, "the YAML cannot be read after this line (a stray control character or broken brackets?)", ctx.File, lastLine);
            return null;
        }
    }
}
