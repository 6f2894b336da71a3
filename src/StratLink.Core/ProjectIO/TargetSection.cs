using System.Collections.Immutable;
using StratLink.Model;
using YamlDotNet.RepresentationModel;

namespace StratLink.ProjectIO;

internal static class TargetSection
{
    public static DatedTargetSpec? Read(YamlMap? m)
    {
        if (m is null) return null;
        var s = new DatedTargetSpec
        {
            Table = m.String("table", required: true) ?? "",
            Signal = m.String("signal", required: true) ?? "",
            AgeColumn = m.String("age_column") ?? "age",
            DepthColumn = m.String("depth_column"),
            AgeModel = ReadAgeModel(m.Map("age_model")),
            RepeatedDepths = CoresSection.ReadRepeatedDepths(m),
            AgeUnit = m.String("age_unit") ?? DatedTargetAgeUnits.Years,
            Columns = m.StringMap("columns"),
            HeaderLine = m.Int("header_line"),
            AgeError = m.Double("age_error"),
            AgeErrorColumn = m.String("age_error_column"),
            Cores = (m.StringList("cores") ?? []).ToImmutableList(),
            Spacing = m.Double("spacing"),
            AgeSpan = ReadSpan(m),
        };
        if (!DatedTargetAgeUnits.All.Contains(s.AgeUnit))
            m.Error("age_unit", $"unknown age unit '{s.AgeUnit}' ({string.Join(", ", DatedTargetAgeUnits.All)}; all cal BP)");
        if (s.DepthColumn is not null && s.AgeModel is null)
            m.Error("depth_column", "a target on depth needs its age model: give age_model with its table (depth and age columns)");
        if (s.DepthColumn is null && s.AgeModel is not null)
            m.Error("age_model", "an age model dates a target on depth: give the target table's depth_column too");
        if (s.DepthColumn is not null && m.Has("age_column"))
            m.Error("age_column", "a target on depth takes its ages from age_model; age_column is for a target on age");
        if (s.AgeModel?.ErrorColumn is not null && (s.AgeError is not null || s.AgeErrorColumn is not null))
            m.Error(s.AgeError is not null ? "age_error" : "age_error_column", "give the target's age error once: here or as age_model.error_column");
        if (s.HeaderLine is < 1) m.Error("header_line", "header_line counts lines from 1");
        if (s.AgeError is < 0) m.Error("age_error", "the target's age error is a 1-sigma in years, 0 or more");
        if (s.AgeError is not null && s.AgeErrorColumn is not null)
            m.Error("age_error", "give the target's age error either as age_error or as age_error_column, not both");
        if (s.Spacing is <= 0) m.Error("spacing", "the spacing of the transferred ages must be positive");
        m.Finish();
        return s;
    }

    private static DatedTargetAgeModel? ReadAgeModel(YamlMap? m)
    {
        if (m is null) return null;
        var a = new DatedTargetAgeModel
        {
            Table = m.String("table", required: true) ?? "",
            DepthColumn = m.String("depth_column") ?? "depth",
            AgeColumn = m.String("age_column") ?? "age",
            ErrorColumn = m.String("error_column"),
            HeaderLine = m.Int("header_line"),
        };
        if (a.HeaderLine is < 1) m.Error("header_line", "header_line counts lines from 1");
        m.Finish();
        return a;
    }

    private static (double Young, double Old)? ReadSpan(YamlMap m)
    {
        var node = m.Get("age_span");
        if (node is null || node is YamlScalarNode s && YamlMap.IsNull(s)) return null;
        if (node is not YamlSequenceNode { Children.Count: 2 } pair)
        {
            m.Error("age_span", "the age span is written [youngest, oldest]");
            return null;
        }
        double? young = YamlMap.ReadDouble(pair[0], m.Join("age_span"), m.Context), old = YamlMap.ReadDouble(pair[1], m.Join("age_span"), m.Context);
        if (young is null || old is null) return null;
        if (!(old > young))
        {
            m.Error("age_span", $"the age span [{young}, {old}] must run from the youngest to an older age");
            return null;
        }
        return (young.Value, old.Value);
    }

    public static YamlMappingNode Write(DatedTargetSpec s)
    {
        var n = new YamlMappingNode { { "table", YamlOut.Str(s.Table) } };
        if (s.DepthColumn is not null) n.Add("depth_column", YamlOut.Str(s.DepthColumn));
        else if (s.AgeColumn != "age") n.Add("age_column", YamlOut.Str(s.AgeColumn));
        if (s.AgeUnit != DatedTargetAgeUnits.Years) n.Add("age_unit", YamlOut.Str(s.AgeUnit));
        if (s.HeaderLine is int h) n.Add("header_line", YamlOut.Num(h));
        if (s.RepeatedDepths != RepeatedDepths.Error) n.Add("repeated_depths", YamlOut.Str(s.RepeatedDepths.ToString().ToLowerInvariant()));
        n.Add("signal", YamlOut.Str(s.Signal));
        if (s.Columns.Count > 0) n.Add("columns", YamlOut.FlowMap(s.Columns));
        if (s.AgeError is double e) n.Add("age_error", YamlOut.Num(e));
        if (s.AgeErrorColumn is not null) n.Add("age_error_column", YamlOut.Str(s.AgeErrorColumn));
        if (s.AgeSpan is var (young, old)) n.Add("age_span", YamlOut.FlowNums(young, old));
        if (s.Cores.Count > 0) n.Add("cores", YamlOut.FlowStrs(s.Cores));
        if (s.Spacing is double sp) n.Add("spacing", YamlOut.Num(sp));
        if (s.AgeModel is { } a)
        {
            var am = new YamlMappingNode { { "table", YamlOut.Str(a.Table) } };
            if (a.DepthColumn != "depth") am.Add("depth_column", YamlOut.Str(a.DepthColumn));
            if (a.AgeColumn != "age") am.Add("age_column", YamlOut.Str(a.AgeColumn));
            if (a.ErrorColumn is not null) am.Add("error_column", YamlOut.Str(a.ErrorColumn));
            if (a.HeaderLine is int ah) am.Add("header_line", YamlOut.Num(ah));
            n.Add("age_model", am);
        }
        return n;
    }
}
