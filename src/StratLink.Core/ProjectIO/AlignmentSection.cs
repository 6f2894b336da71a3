using System.Collections.Immutable;
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
        };
        if (s.Window is <= 0 or > 1) m.Error("window", $"the band half-width is a fraction of the longer core, between 0 and 1 (found {s.Window})");
        if (s.Ensemble < 0) m.Error("ensemble", "the ensemble size cannot be negative");
        if (!AlignmentMethods.All.Contains(s.Method)) m.Error("method", $"unknown alignment method '{s.Method}' ({string.Join(" or ", AlignmentMethods.All)})");
        m.Finish();
        return s;
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
        return n;
    }
}
