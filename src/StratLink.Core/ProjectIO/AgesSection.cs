using System.Collections.Immutable;
using StratLink.Model;
using StratLink.Quantities;
using YamlDotNet.RepresentationModel;

namespace StratLink.ProjectIO;

internal static class AgesSection
{
    public static ImmutableList<AgeControlSpec> Read(YamlMap root)
    {
        var seq = root.Sequence("ages");
        if (seq is null) return [];
        var list = ImmutableList.CreateBuilder<AgeControlSpec>();
        int i = 0;
        foreach (var item in seq)
        {
            if (item is not YamlMappingNode node)
            {
                root.Context.Problems.AddError(ProjectCodes.InvalidValue, "each age control must be a mapping (id, kind, ...)", root.Context.File, (int)item.Start.Line, $"ages[{i++}]");
                continue;
            }
            string id = new YamlMap(node, $"ages[{i}]", root.Context).String("id", required: true) ?? $"#{i + 1}";
            var m = new YamlMap(node, $"ages[{id}]", root.Context);
            root.Context.Map.Set($"ages[{id}]", m.Line);
            m.String("id");
            var control = m.String("kind", required: true) switch
            {
                "calendar" => ReadCalendar(m, id),
                "radiocarbon" => ReadRadiocarbon(m, id),
                "varve-count" => ReadVarves(m, id),
                null => null,
                string other => Unknown(m, other),
            };
            bool exclude = m.Bool("exclude") ?? false;
            double outlierPrior = m.Double("outlier_prior") ?? AgeControlSpec.DefaultOutlierPrior;
            if (outlierPrior is < 0 or >= 1) m.Error("outlier_prior", "the prior outlier probability is a fraction, at least 0 and below 1 (0.05 = 5 %)");
            if (control is not null)
            {
                m.Finish();
                list.Add(control with { Exclude = exclude, OutlierPrior = outlierPrior });
            }
            i++;
        }
        return list.ToImmutable();
    }

    private static AgeControlSpec? Unknown(YamlMap m, string kind)
    {
        m.Error("kind", $"unknown age control kind '{kind}' (calendar, radiocarbon or varve-count)");
        return null;
    }

    private static AgeControlSpec? ReadCalendar(YamlMap m, string id)
    {
        string? marker = m.String("marker");
        string? core = m.String("core");
        var depth = m.Depth("depth");
        double? age = m.Double("age", required: true);
        double error = m.Double("error") ?? 0;
        if (error < 0) m.Error("error", "an age error cannot be negative");
        if (marker is null && (core is null || depth is null))
        {
            m.Error("marker", "a calendar age needs either 'marker' or both 'core' and 'depth'");
            return null;
        }
        if (marker is not null && (core is not null || depth is not null))
            m.Error("marker", "give either 'marker' or 'core' and 'depth', not both");
        if (age is null) return null;
        return new CalendarAgeControl { Id = id, Marker = marker, Core = core, Depth = depth, Age = CalendarAge.FromYearsBP(age.Value), Error = error };
    }

    private static AgeControlSpec? ReadRadiocarbon(YamlMap m, string id)
    {
        string? core = m.String("core", required: true);
        var depth = m.Depth("depth", required: true);
        double? c14 = m.Double("c14_age", required: true);
        double? err = m.Double("c14_error", required: true);
        string? curve = m.String("curve", required: true);
        double dr = m.Double("reservoir_offset") ?? 0, drErr = m.Double("reservoir_error") ?? 0;
        double? fraction = m.Double("marine_fraction");
        string? atm = m.String("atmospheric_curve");
        if (err is <= 0) m.Error("c14_error", "a radiocarbon error must be positive");
        if (drErr < 0) m.Error("reservoir_error", "a reservoir error cannot be negative");
        if (fraction is < 0 or > 1) m.Error("marine_fraction", "the marine fraction is between 0 and 1");
        if (fraction is not null && atm is null) m.Error("atmospheric_curve", "a marine fraction needs the atmospheric curve to mix with");
        if (core is null || depth is null || c14 is null || err is null || curve is null) return null;
        return new RadiocarbonAgeControl
        {
            Id = id, Core = core, Depth = depth.Value, C14Age = RadiocarbonAge.FromYearsBP(c14.Value), C14Error = err.Value,
            Curve = curve, ReservoirOffset = dr, ReservoirError = drErr, MarineFraction = fraction, AtmosphericCurve = atm,
        };
    }

    private static AgeControlSpec? ReadVarves(YamlMap m, string id)
    {
        string? core = m.String("core", required: true);
        string? table = m.String("table", required: true);
        var anchorDepth = m.Depth("anchor_depth", required: true);
        double? anchorAge = m.Double("anchor_age", required: true);
        double anchorError = m.Double("anchor_error") ?? 0;
        double countError = m.Double("count_error") ?? 0;
        double miscount = m.Double("miscount_rate") ?? VarveCountControl.DefaultMiscountRate;
        if (countError is < 0 or >= 1) m.Error("count_error", "the relative counting error is a fraction between 0 and 1 (0.02 = 2 %)");
        if (miscount is <= 0 or >= 1) m.Error("miscount_rate", "the miscount rate is a fraction strictly between 0 and 1 (0.02 = 2 % of varves missed or split)");
        if (anchorError < 0) m.Error("anchor_error", "an age error cannot be negative");
        var uncertain = ReadUncertain(m);
        if (core is null || table is null || anchorDepth is null || anchorAge is null) return null;
        return new VarveCountControl
        {
            Id = id, Core = core, Table = table, AnchorDepth = anchorDepth.Value, AnchorAge = CalendarAge.FromYearsBP(anchorAge.Value),
            AnchorError = anchorError, CountError = countError, MiscountRate = miscount, Uncertain = uncertain,
        };
    }

    /// <summary><c>uncertain: [[top, bottom, rate], ...]</c>: intervals counted with their own miscount rate, disjoint.</summary>
    private static ImmutableList<UncertainCount> ReadUncertain(YamlMap m)
    {
        var seq = m.Sequence("uncertain");
        if (seq is null) return [];
        var list = ImmutableList.CreateBuilder<UncertainCount>();
        int k = 0;
        foreach (var item in seq)
        {
            string path = $"{m.Join("uncertain")}[{k++}]";
            int line = (int)item.Start.Line;
            m.Context.Map.Set(path, line);
            if (item is not YamlSequenceNode triple || triple.Children.Count != 3)
            {
                m.Context.Problems.AddError(ProjectCodes.InvalidValue, "an uncertain-count interval is written [top, bottom, miscount rate]", m.Context.File, line, path);
                continue;
            }
            double? top = YamlMap.ReadDouble(triple[0], path, m.Context), bottom = YamlMap.ReadDouble(triple[1], path, m.Context);
            double? rate = YamlMap.ReadDouble(triple[2], path, m.Context);
            if (top is null || bottom is null || rate is null) continue;
            if (top > bottom)
                m.Context.Problems.AddError(ProjectCodes.IntervalInverted, $"interval top {top} lies below its bottom {bottom} (write [top, bottom, rate], top the shallower)", m.Context.File, line, path);
            else if (rate is <= 0 or >= 1)
                m.Context.Problems.AddError(ProjectCodes.InvalidValue, $"the miscount rate {rate} is not strictly between 0 and 1", m.Context.File, line, path);
            else if (list.Any(u => u.Interval.Top.In(m.Context.Unit) < bottom && u.Interval.Bottom.In(m.Context.Unit) > top))
                m.Context.Problems.AddError(ProjectCodes.IntervalOverlap, "uncertain-count intervals must not overlap", m.Context.File, line, path);
            else
                list.Add(new UncertainCount(DepthInterval.FromTopBottom(top.Value, bottom.Value, m.Context.Unit), rate.Value));
        }
        return list.ToImmutable();
    }

    public static YamlSequenceNode Write(IEnumerable<AgeControlSpec> ages, DepthUnit unit)
    {
        var seq = new YamlSequenceNode();
        foreach (var a in ages)
        {
            var n = new YamlMappingNode { { "id", YamlOut.Str(a.Id) }, { "kind", a.KindName } };
            switch (a)
            {
                case CalendarAgeControl c:
                    if (c.Marker is not null) n.Add("marker", YamlOut.Str(c.Marker));
                    if (c.Core is not null) n.Add("core", YamlOut.Str(c.Core));
                    if (c.Depth is CoreDepth d) n.Add("depth", YamlOut.Num(d.In(unit)));
                    n.Add("age", YamlOut.Num(c.Age.YearsBP));
                    n.Add("error", YamlOut.Num(c.Error));
                    break;
                case RadiocarbonAgeControl r:
                    n.Add("core", YamlOut.Str(r.Core));
                    n.Add("depth", YamlOut.Num(r.Depth.In(unit)));
                    n.Add("c14_age", YamlOut.Num(r.C14Age.Years));
                    n.Add("c14_error", YamlOut.Num(r.C14Error));
                    n.Add("curve", YamlOut.Str(r.Curve));
                    if (r.ReservoirOffset != 0 || r.ReservoirError != 0)
                    {
                        n.Add("reservoir_offset", YamlOut.Num(r.ReservoirOffset));
                        n.Add("reservoir_error", YamlOut.Num(r.ReservoirError));
                    }
                    if (r.MarineFraction is double f) n.Add("marine_fraction", YamlOut.Num(f));
                    if (r.AtmosphericCurve is not null) n.Add("atmospheric_curve", YamlOut.Str(r.AtmosphericCurve));
                    break;
                case VarveCountControl v:
                    n.Add("core", YamlOut.Str(v.Core));
                    n.Add("table", YamlOut.Str(v.Table));
                    n.Add("anchor_depth", YamlOut.Num(v.AnchorDepth.In(unit)));
                    n.Add("anchor_age", YamlOut.Num(v.AnchorAge.YearsBP));
                    if (v.AnchorError != 0) n.Add("anchor_error", YamlOut.Num(v.AnchorError));
                    n.Add("count_error", YamlOut.Num(v.CountError));
                    if (v.MiscountRate != VarveCountControl.DefaultMiscountRate) n.Add("miscount_rate", YamlOut.Num(v.MiscountRate));
                    if (v.Uncertain.Count > 0)
                    {
                        var us = new YamlSequenceNode();
                        foreach (var u in v.Uncertain) us.Add(YamlOut.FlowNums(u.Interval.Top.In(unit), u.Interval.Bottom.In(unit), u.MiscountRate));
                        n.Add("uncertain", us);
                    }
                    break;
            }
            if (a.OutlierPrior != AgeControlSpec.DefaultOutlierPrior) n.Add("outlier_prior", YamlOut.Num(a.OutlierPrior));
            if (a.Exclude) n.Add("exclude", YamlOut.Bool(true));
            seq.Add(n);
        }
        return seq;
    }
}
