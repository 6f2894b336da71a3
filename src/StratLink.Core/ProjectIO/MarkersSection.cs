using System.Collections.Immutable;
using StratLink.Model;
using StratLink.Quantities;
using YamlDotNet.Core.Events;
using YamlDotNet.RepresentationModel;

namespace StratLink.ProjectIO;

internal static class MarkersSection
{
    public static ImmutableList<MarkerSpec> Read(YamlMap root)
    {
        var seq = root.Sequence("markers");
        if (seq is null) return [];
        var list = ImmutableList.CreateBuilder<MarkerSpec>();
        int i = 0;
        foreach (var item in seq)
        {
            if (item is not YamlMappingNode node)
            {
                root.Context.Problems.AddError(ProjectCodes.InvalidValue, "each marker must be a mapping (id, kind, depths)", root.Context.File, (int)item.Start.Line, $"markers[{i++}]");
                continue;
            }
            string id = new YamlMap(node, $"markers[{i}]", root.Context).String("id", required: true) ?? $"#{i + 1}";
            var m = new YamlMap(node, $"markers[{id}]", root.Context);
            root.Context.Map.Set($"markers[{id}]", m.Line);
            m.String("id");
            var kind = MarkerKind.Other;
            if (m.String("kind") is string k && !MarkerKinds.TryParse(k, out kind))
                m.Error("kind", $"unknown marker kind '{k}' (tephra, turbidite, flood, event or other)");
            double unc = m.Double("uncertainty") ?? 0;
            if (unc < 0) m.Error("uncertainty", "a depth uncertainty cannot be negative");
            var depths = ImmutableList.CreateBuilder<MarkerDepth>();
            if (m.Map("depths") is { } dm)
            {
                foreach (string core in dm.Keys.ToList())
                    if (dm.Depth(core) is CoreDepth d) depths.Add(new MarkerDepth(core, d));
                dm.Finish();
            }
            else if (!m.Has("depths"))
            {
                root.Context.Problems.AddError(ProjectCodes.MissingKey, "required key 'depths' is missing", root.Context.File, m.Line, m.Join("depths"));
            }
            m.Finish();
            list.Add(new MarkerSpec { Id = id, Kind = kind, Depths = depths.ToImmutable(), Uncertainty = Math.Max(0, unc) });
            i++;
        }
        return list.ToImmutable();
    }

    public static YamlSequenceNode Write(IEnumerable<MarkerSpec> markers, DepthUnit unit)
    {
        var seq = new YamlSequenceNode();
        foreach (var mk in markers)
        {
            var depths = new YamlMappingNode { Style = MappingStyle.Flow };
            foreach (var d in mk.Depths) depths.Add(YamlOut.Str(d.CoreId), YamlOut.Num(d.Depth.In(unit)));
            var n = new YamlMappingNode
            {
                { "id", YamlOut.Str(mk.Id) },
                { "kind", mk.Kind.Name() },
                { "depths", depths },
            };
            if (mk.Uncertainty != 0) n.Add("uncertainty", YamlOut.Num(mk.Uncertainty));
            seq.Add(n);
        }
        return seq;
    }
}
