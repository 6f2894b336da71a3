using System.Collections.Immutable;
using StratLink.Model;
using StratLink.Quantities;
using YamlDotNet.Core.Events;
using YamlDotNet.RepresentationModel;

namespace StratLink.ProjectIO;

internal static class CompositeSection
{
    public static CompositeSettings Read(YamlMap? m)
    {
        var s = new CompositeSettings();
        if (m is null) return s;
        s = s with
        {
            Step = m.Double("step") ?? s.Step,
            Splice = ReadSplice(m),
            Standardise = m.Bool("standardise") ?? false,
            KeepEvents = m.Bool("keep_events") ?? false,
        };
        if (s.Step <= 0) m.Error("step", "the composite step must be positive");
        m.Finish();
        return s;
    }

    private static ImmutableList<SpliceInterval>? ReadSplice(YamlMap m)
    {
        var node = m.Get("splice");
        if (node is null || node is YamlScalarNode { Value: "auto" }) return null;
        if (node is not YamlSequenceNode seq)
        {
            m.Error("splice", "the splice is 'auto' or a list of {core, from, to}");
            return null;
        }
        var list = ImmutableList.CreateBuilder<SpliceInterval>();
        int k = 0;
        foreach (var item in seq)
        {
            string path = $"{m.Join("splice")}[{k++}]";
            if (item is not YamlMappingNode im)
            {
                m.Context.Problems.AddError(ProjectCodes.InvalidValue, "a splice interval is written {core: ..., from: ..., to: ...}", m.Context.File, (int)item.Start.Line, path);
                continue;
            }
            var sm = new YamlMap(im, path, m.Context);
            string? core = sm.String("core", required: true);
            double? from = sm.Double("from", required: true), to = sm.Double("to", required: true);
            sm.Finish();
            if (from > to)
                m.Context.Problems.AddError(ProjectCodes.IntervalInverted, $"splice interval from {from} lies below its end {to}", m.Context.File, sm.Line, path);
            else if (core is not null && from is not null && to is not null)
                list.Add(new SpliceInterval(core, CompositeDepth.From(from.Value, m.Context.Unit), CompositeDepth.From(to.Value, m.Context.Unit)));
        }
        return list.ToImmutable();
    }

    public static YamlMappingNode Write(CompositeSettings s, DepthUnit unit)
    {
        var n = new YamlMappingNode { { "step", YamlOut.Num(s.Step) } };
        if (s.Splice is null) n.Add("splice", "auto");
        else
        {
            var seq = new YamlSequenceNode();
            foreach (var iv in s.Splice)
                seq.Add(new YamlMappingNode
                {
                    { "core", YamlOut.Str(iv.Core) }, { "from", YamlOut.Num(iv.From.In(unit)) }, { "to", YamlOut.Num(iv.To.In(unit)) },
                }.WithStyle(MappingStyle.Flow));
            n.Add("splice", seq);
        }
        if (s.Standardise) n.Add("standardise", YamlOut.Bool(true));
        if (s.KeepEvents) n.Add("keep_events", YamlOut.Bool(true));
        return n;
    }

    private static YamlMappingNode WithStyle(this YamlMappingNode n, MappingStyle style)
    {
        n.Style = style;
        return n;
    }
}
