using System.Collections.Immutable;
using StratLink.Model;
using StratLink.Quantities;
using YamlDotNet.RepresentationModel;

namespace StratLink.ProjectIO;

internal static class CoresSection
{
    public static ImmutableList<CoreSpec> Read(YamlMap root)
    {
        var seq = root.Sequence("cores");
        if (seq is null) return [];
        var cores = ImmutableList.CreateBuilder<CoreSpec>();
        int i = 0;
        foreach (var item in seq)
        {
            if (item is not YamlMappingNode node)
            {
                root.Context.Problems.AddError(ProjectCodes.InvalidValue, "each core must be a mapping (id, table, ...)", root.Context.File, (int)item.Start.Line, $"cores[{i}]");
                i++;
                continue;
            }
            string provisional = $"cores[{i}]";
            var m = new YamlMap(node, provisional, root.Context);
            string id = m.String("id", required: true) ?? $"#{i + 1}";
            string path = $"cores[{id}]";
            root.Context.Map.Set(path, m.Line);
            var cm = new YamlMap(node, path, root.Context);
            var core = ReadCore(cm, id);
            if (core is not null) cores.Add(core);
            i++;
        }
        return cores.ToImmutable();
    }

    private static CoreSpec? ReadCore(YamlMap m, string id)
    {
        m.String("id");
        var unit = m.Context.Unit;
        var core = new CoreSpec
        {
            Id = id,
            Table = m.String("table", required: true) ?? "",
            DepthColumn = m.String("depth_column") ?? "depth",
            Signals = (m.StringList("signals") ?? []).ToImmutableList(),
            Gaps = ReadIntervals(m, "gaps", unit),
            Disturbed = ReadIntervals(m, "disturbed", unit),
            Events = ReadEvents(m, unit),
            Sections = ReadSections(m, unit),
            MissingValues = (m.StringList("missing_values") ?? []).ToImmutableList(),
            HeaderLine = m.Int("header_line"),
            Sort = m.Bool("sort") ?? false,
            Type = m.String("type"),
            RepeatedDepths = ReadRepeatedDepths(m),
            Columns = m.StringMap("columns"),
            Citation = m.String("citation"),
            Latitude = m.Double("latitude"),
            Longitude = m.Double("longitude"),
            CoringYear = m.Int("coring_year"),
            Units = m.StringMap("units"),
        };
        if (core.HeaderLine is < 1) m.Error("header_line", "header_line counts lines from 1");
        if (core.Latitude is < -90 or > 90) m.Error("latitude", $"latitude {core.Latitude} is outside -90..90");
        if (core.Longitude is < -180 or > 360) m.Error("longitude", $"longitude {core.Longitude} is outside -180..360");
        if (core.CoringYear is < 1800 or > 2200) m.Error("coring_year", $"coring_year {core.CoringYear} is not a year CE of sediment coring (e.g. 2019)");
        foreach (var g in core.Columns.GroupBy(c => c.Value, StringComparer.Ordinal).Where(g => g.Count() > 1))
            m.Error("columns", $"columns {string.Join(" and ", g.Select(c => $"'{c.Key}'").Order(StringComparer.Ordinal))} are both mapped onto signal '{g.Key}'");
        m.Finish();
        return core;
    }

    internal static RepeatedDepths ReadRepeatedDepths(YamlMap m)
    {
        string? text = m.String("repeated_depths");
        if (text is null) return RepeatedDepths.Error;
        if (Enum.TryParse<RepeatedDepths>(text.Trim(), ignoreCase: true, out var v) && Enum.IsDefined(v) && !char.IsDigit(text.Trim()[0])) return v;
        m.Error("repeated_depths", $"repeated_depths is '{text}'; write error, mean, median or first");
        return RepeatedDepths.Error;
    }

    /// <summary>Event layers, sorted by top; two that overlap are an error at the later one's line.</summary>
    private static ImmutableList<DepthInterval> ReadEvents(YamlMap m, DepthUnit unit)
    {
        var events = ReadIntervals(m, "events", unit);
        var sorted = events.Select((e, k) => (Event: e, Index: k)).OrderBy(e => e.Event.Top).ToList();
        for (int k = 1; k < sorted.Count; k++)
        {
            var (before, after) = (sorted[k - 1], sorted[k]);
            if (after.Event.Top >= before.Event.Bottom) continue;
            string path = $"{m.Join("events")}[{Math.Max(before.Index, after.Index)}]";
            m.Context.Problems.AddError(ProjectCodes.IntervalOverlap,
                $"event layer {after.Event} overlaps event layer {before.Event}: one deposit is one interval", m.Context.File, m.Context.Map.LineOf(path) ?? m.Line, path);
        }
        return [.. sorted.Select(e => e.Event)];
    }

    private static ImmutableList<DepthInterval> ReadIntervals(YamlMap m, string key, DepthUnit unit)
    {
        var seq = m.Sequence(key);
        if (seq is null) return [];
        var list = ImmutableList.CreateBuilder<DepthInterval>();
        int k = 0;
        foreach (var item in seq)
        {
            string path = $"{m.Join(key)}[{k++}]";
            m.Context.Map.Set(path, (int)item.Start.Line);
            if (item is not YamlSequenceNode pair || pair.Children.Count != 2)
            {
                m.Context.Problems.AddError(ProjectCodes.InvalidValue, "an interval is written [top, bottom]", m.Context.File, (int)item.Start.Line, path);
                continue;
            }
            double? top = YamlMap.ReadDouble(pair[0], path, m.Context), bottom = YamlMap.ReadDouble(pair[1], path, m.Context);
            if (top is null || bottom is null) continue;
            if (top > bottom)
            {
                m.Context.Problems.AddError(ProjectCodes.IntervalInverted,
                    $"interval top {top} lies below its bottom {bottom} (write [top, bottom], top the shallower)", m.Context.File, (int)item.Start.Line, path);
                continue;
            }
            list.Add(DepthInterval.FromTopBottom(top.Value, bottom.Value, unit));
        }
        return list.ToImmutable();
    }

    private static ImmutableList<SectionSpec> ReadSections(YamlMap m, DepthUnit unit)
    {
        var seq = m.Sequence("sections");
        if (seq is null) return [];
        var list = ImmutableList.CreateBuilder<SectionSpec>();
        int k = 0;
        foreach (var item in seq)
        {
            string path = $"{m.Join("sections")}[{k++}]";
            if (item is not YamlMappingNode node)
            {
                m.Context.Problems.AddError(ProjectCodes.InvalidValue, "a section is written {id: ..., top: ...}", m.Context.File, (int)item.Start.Line, path);
                continue;
            }
            var sm = new YamlMap(node, path, m.Context);
            string? sid = sm.String("id", required: true);
            var top = sm.Depth("top", required: true);
            sm.Finish();
            if (sid is not null && top is not null) list.Add(new SectionSpec(sid, top.Value));
        }
        return list.ToImmutable();
    }

    public static YamlSequenceNode Write(IEnumerable<CoreSpec> cores, DepthUnit unit)
    {
        var seq = new YamlSequenceNode();
        foreach (var c in cores)
        {
            var n = new YamlMappingNode { { "id", YamlOut.Str(c.Id) } };
            if (c.Type is not null) n.Add("type", YamlOut.Str(c.Type));
            n.Add("table", YamlOut.Str(c.Table));
            if (c.DepthColumn != "depth") n.Add("depth_column", YamlOut.Str(c.DepthColumn));
            if (c.HeaderLine is int h) n.Add("header_line", YamlOut.Num(h));
            if (c.MissingValues.Count > 0) n.Add("missing_values", YamlOut.FlowStrs(c.MissingValues));
            if (c.Sort) n.Add("sort", YamlOut.Bool(true));
            if (c.RepeatedDepths != RepeatedDepths.Error) n.Add("repeated_depths", YamlOut.Str(c.RepeatedDepths.ToString().ToLowerInvariant()));
            if (c.Columns.Count > 0) n.Add("columns", YamlOut.FlowMap(c.Columns));
            if (c.Signals.Count > 0) n.Add("signals", YamlOut.FlowStrs(c.Signals));
            if (c.Units.Count > 0) n.Add("units", YamlOut.FlowMap(c.Units));
            if (c.Citation is not null) n.Add("citation", YamlOut.Str(c.Citation));
            if (c.Latitude is double lat) n.Add("latitude", YamlOut.Num(lat));
            if (c.Longitude is double lon) n.Add("longitude", YamlOut.Num(lon));
            if (c.CoringYear is int year) n.Add("coring_year", YamlOut.Num(year));
            if (c.Gaps.Count > 0) n.Add("gaps", Intervals(c.Gaps, unit));
            if (c.Disturbed.Count > 0) n.Add("disturbed", Intervals(c.Disturbed, unit));
            if (c.Events.Count > 0) n.Add("events", Intervals(c.Events, unit));
            if (c.Sections.Count > 0)
            {
                var ss = new YamlSequenceNode();
                foreach (var s in c.Sections)
                    ss.Add(new YamlMappingNode { { "id", YamlOut.Str(s.Id) }, { "top", YamlOut.Num(s.Top.In(unit)) } }.AsFlow());
                n.Add("sections", ss);
            }
            seq.Add(n);
        }
        return seq;
    }

    private static YamlSequenceNode Intervals(IEnumerable<DepthInterval> intervals, DepthUnit unit)
    {
        var seq = new YamlSequenceNode();
        foreach (var g in intervals) seq.Add(YamlOut.FlowNums(g.Top.In(unit), g.Bottom.In(unit)));
        return seq;
    }

    private static YamlMappingNode AsFlow(this YamlMappingNode n)
    {
        n.Style = YamlDotNet.Core.Events.MappingStyle.Flow;
        return n;
    }
}
