using StratLink.Model;
using YamlDotNet.RepresentationModel;

namespace StratLink.ProjectIO;

internal static class ChecksSection
{
    public static CheckSettings Read(YamlMap? m)
    {
        var s = new CheckSettings();
        if (m is null) return s;
        s = s with
        {
            RateJumpFactor = m.Double("rate_jump_factor") ?? s.RateJumpFactor,
            TieMisfitSigmas = m.Double("tie_misfit_sigmas") ?? s.TieMisfitSigmas,
        };
        if (s.RateJumpFactor <= 1) m.Error("rate_jump_factor", "the rate jump factor must be above 1");
        if (s.TieMisfitSigmas <= 0) m.Error("tie_misfit_sigmas", "the tie misfit threshold must be positive");
        m.Finish();
        return s;
    }

    /// <summary>Null when every setting is the default, so the section stays out of files that never used it.</summary>
    public static YamlMappingNode? Write(CheckSettings s)
    {
        if (s == new CheckSettings()) return null;
        return new YamlMappingNode
        {
            { "rate_jump_factor", YamlOut.Num(s.RateJumpFactor) },
            { "tie_misfit_sigmas", YamlOut.Num(s.TieMisfitSigmas) },
        };
    }
}
