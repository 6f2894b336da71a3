using System.Collections.Immutable;
using StratLink.Alignment;
using StratLink.Model;
using YamlDotNet.Core.Events;
using YamlDotNet.RepresentationModel;

namespace StratLink.ProjectIO;

internal static class AlignmentSection
{
    public static AlignmentSettings Read(YamlMap? m)
    {
        var s = new AlignmentSettings();
        if (m is null) return s;
        var signals = ImmutableList.CreateBuilder<SignalWeight>();
        if (m.Map("signals") is { } sm)
        {
            foreach (string name in sm.Keys.ToList())
                if (sm.Double(name) is double w)
                {
                    if (w < 0) sm.Error(name, "a signal weight cannot be negative");
                    else signals.Add(new SignalWeight(name, w));
                }
            sm.Finish();
        }
        s = s with
        {
            Reference = m.String("reference"),
            Signals = signals.ToImmutable(),
            Window = m.Double("window") ?? s.Window,
            Ensemble = m.Int("ensemble") ?? s.Ensemble,
            Method = m.String("method") ?? s.Method,
            Pattern = m.String("pattern") ?? s.Pattern,
            Step = m.Double("step"),
            Standardise = m.String("standardise") ?? s.Standardise,
            Derivative = m.Bool("derivative") ?? s.Derivative,
            Detrend = m.Bool("detrend") ?? s.Detrend,
            RatePenalty = m.Double("rate_penalty") ?? s.RatePenalty,
            OpenBegin = BoolOrAuto(m, "open_begin"),
            OpenEnd = BoolOrAuto(m, "open_end"),
            Seed = m.Int("seed"),
            Scale = m.String("scale") ?? s.Scale,
        };
        if (s.Window is <= 0 or > 1) m.Error("window", $"the band half-width is a fraction of the longer core, between 0 and 1 (found {s.Window})");
        if (s.Ensemble < 0) m.Error("ensemble", "the ensemble size cannot be negative");
        if (!AlignmentMethods.All.Contains(s.Method)) m.Error("method", $"unknown alignment method '{s.Method}' ({string.Join(" or ", AlignmentMethods.All)})");
        if (StepPattern.Find(s.Pattern) is not { } pattern)
            m.Error("pattern", $"unknown step pattern '{s.Pattern}' ({string.Join(", ", StepPattern.Names)})");
        else s = s with { Pattern = pattern.Name };
        if (s.Step is <= 0) m.Error("step", $"the grid step must be positive (found {s.Step})");
        if (!StandardiseMethods.All.Contains(s.Standardise)) m.Error("standardise", $"unknown standardisation '{s.Standardise}' ({string.Join(" or ", StandardiseMethods.All)})");
        if (!AlignmentScales.All.Contains(s.Scale)) m.Error("scale", $"unknown alignment scale '{s.Scale}' ({string.Join(" or ", AlignmentScales.All)})");
        if (s.RatePenalty < 0) m.Error("rate_penalty", "the rate-change penalty cannot be negative (0 = off)");
        m.Finish();
        return s;
    }

    /// <summary>true, false or auto (null).</summary>
    private static bool? BoolOrAuto(YamlMap m, string key)
    {
        if (m.Get(key) is YamlScalarNode { Value: { } v } && v.Trim().Equals("auto", StringComparison.OrdinalIgnoreCase)) return null;
        return m.Bool(key);
    }

    public static YamlMappingNode Write(AlignmentSettings s)
    {
        var n = new YamlMappingNode();
        if (s.Reference is not null) n.Add("reference", YamlOut.Str(s.Reference));
        n.Add("method", YamlOut.Str(s.Method));
        if (s.Signals.Count > 0)
        {
            var sig = new YamlMappingNode { Style = MappingStyle.Flow };
            foreach (var w in s.Signals) sig.Add(YamlOut.Str(w.Signal), YamlOut.Num(w.Weight));
            n.Add("signals", sig);
        }
        n.Add("window", YamlOut.Num(s.Window));
        n.Add("ensemble", YamlOut.Num(s.Ensemble));
        var d = new AlignmentSettings();
        if (s.Pattern != d.Pattern) n.Add("pattern", YamlOut.Str(s.Pattern));
        if (s.Step is double step) n.Add("step", YamlOut.Num(step));
        if (s.Standardise != d.Standardise) n.Add("standardise", YamlOut.Str(s.Standardise));
        if (s.Derivative) n.Add("derivative", YamlOut.Bool(true));
        if (s.Detrend) n.Add("detrend", YamlOut.Bool(true));
        if (s.RatePenalty != 0) n.Add("rate_penalty", YamlOut.Num(s.RatePenalty));
        if (s.OpenBegin is bool ob) n.Add("open_begin", YamlOut.Bool(ob));
        if (s.OpenEnd is bool oe) n.Add("open_end", YamlOut.Bool(oe));
        if (s.Seed is int seed) n.Add("seed", YamlOut.Num(seed));
        if (s.Scale != d.Scale) n.Add("scale", YamlOut.Str(s.Scale));
        return n;
    }
}
