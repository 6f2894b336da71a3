using StratLink.Model;
using StratLink.Quantities;
using YamlDotNet.RepresentationModel;

namespace StratLink.ProjectIO;

/// <summary>Writes a project file in the canonical key order; saving is atomic and keeps NAME.bak.</summary>
public static class ProjectWriter
{
    public static string ToYaml(Project p)
    {
        var root = new YamlMappingNode
        {
            { "format", p.Format },
            { "site", SiteSection.Write(p.Site) },
            { "depth_unit", p.DepthUnit.Symbol() },
            { "cores", CoresSection.Write(p.Cores, p.DepthUnit) },
        };
        if (p.Markers.Count > 0) root.Add("markers", MarkersSection.Write(p.Markers, p.DepthUnit));
        if (p.Ages.Count > 0) root.Add("ages", AgesSection.Write(p.Ages, p.DepthUnit));
        root.Add("alignment", AlignmentSection.Write(p.Alignment));
        root.Add("composite", CompositeSection.Write(p.Composite, p.DepthUnit));
        root.Add("age_model", AgeModelSection.Write(p.AgeModel));
        if (ChecksSection.Write(p.Checks) is { } checks) root.Add("checks", checks);
        if (p.Target is { } target) root.Add("target", TargetSection.Write(target));

        using var w = new StringWriter { NewLine = "\n" };
        new YamlStream(new YamlDocument(root)).Save(w, assignAnchors: false);
        string text = w.ToString();
        // YamlDotNet closes the document with "...": not needed for a single-document file.
        if (text.EndsWith("...\n", StringComparison.Ordinal)) text = text[..^4];
        return text;
    }

    /// <summary>Saves atomically; a YAML language server line heading the file it replaces heads the new one too.</summary>
    public static void Save(Project p, string path) => AtomicFile.WriteAllText(path, LanguageServerLine(path) + ToYaml(p));

    // The canonical writer keeps no comments, but this one line is what lets an editor check the file against its schema.
    private static string LanguageServerLine(string path)
    {
        if (!File.Exists(path)) return "";
        using var reader = new StreamReader(path);
        string? first = reader.ReadLine()?.TrimStart('\uFEFF');
        return first is not null && first.StartsWith("# yaml-language-server:", StringComparison.Ordinal) ? first.TrimEnd() + "\n" : "";
    }
}
