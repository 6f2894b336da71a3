using StratLink.Model;
using YamlDotNet.RepresentationModel;

namespace StratLink.ProjectIO;

internal static class AgeModelSection
{
    public static readonly IReadOnlyList<string> Interpolations = ["linear", "monotone-spline"];

    public static AgeModelSettings Read(YamlMap? m)
    {
        var s = new AgeModelSettings();
        if (m is null) return s;
        s = s with
        {
            Iterations = m.Int("iterations") ?? s.Iterations,
            Seed = m.Int("seed") ?? s.Seed,
            Interpolation = m.String("interpolation") ?? s.Interpolation,
            RateVariability = m.Double("rate_variability") ?? s.RateVariability,
            RateWindow = m.Double("rate_window"),
        };
        if (s.Iterations < 1) m.Error("iterations", "at least one iteration is needed");
        if (!Interpolations.Contains(s.Interpolation))
            m.Error("interpolation", $"unknown interpolation '{s.Interpolation}' ({string.Join(" or ", Interpolations)})");
        if (!(s.RateVariability >= 0) || double.IsInfinity(s.RateVariability))
            m.Error("rate_variability", "must be a finite number, 0 or more (0: straight lines between controls)");
        if (s.RateWindow is double w && !(w > 0 && !double.IsInfinity(w)))
            m.Error("rate_window", "must be a finite depth greater than 0 (the window over which accumulation rates are read)");
        m.Finish();
        return s;
    }

    public static YamlMappingNode Write(AgeModelSettings s)
    {
        var n = new YamlMappingNode
        {
            { "iterations", YamlOut.Num(s.Iterations) },
            { "seed", YamlOut.Num(s.Seed) },
        };
        if (s.Interpolation != "linear") n.Add("interpolation", YamlOut.Str(s.Interpolation));
        if (s.RateVariability != AgeModelSettings.DefaultRateVariability) n.Add("rate_variability", YamlOut.Num(s.RateVariability));
        if (s.RateWindow is double window) n.Add("rate_window", YamlOut.Num(window));
        return n;
    }
}
