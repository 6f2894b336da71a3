using StratLink.Alignment;
using StratLink.Model;
using Xunit.Abstractions;

namespace StratLink.Tests.Alignment;

/// <summary>
/// Alignment against a known warp (invented two-core site, see <see cref="SyntheticCores"/>):
/// the truth is the generating mapping, an outside reference for the method.
/// </summary>
public class SyntheticAlignmentTests(ITestOutputHelper output)
{
    private static (double Rms, double Coverage) Score(SyntheticCores s, MappingEnsemble e)
    {
        double sq = 0;
        int n = 0, inside = 0;
        foreach (double z in s.Core.Depths)
        {
            if (s.Gap.ContainsValue(z)) continue;
            double truth = s.TrueComposite(z);
            double err = e.Median.ToCompositeValue(z) - truth;
            sq += err * err;
            n++;
            var (lo, hi) = e.CompositeRange(z);
            if (truth >= lo && truth <= hi) inside++;
        }
        return (Math.Sqrt(sq / n), (double)inside / n);
    }

    [Fact]
    public void Dtw_halves_the_straight_line_error_and_its_band_covers_the_truth()
    {
        var s = SyntheticCores.Make(seed: 11);
        var ties = CoreAligner.Align(s.Project.WithProject(s.Project.Project with { Alignment = s.Project.Project.Alignment with { Method = AlignmentMethods.Ties } }), null, default);
        var dtw = CoreAligner.Align(s.Project, null, default);
        var (tiesRms, _) = Score(s, ties.Mappings["CORE"]);
        var (dtwRms, coverage) = Score(s, dtw.Mappings["CORE"]);
        var d = dtw.Diagnostics["CORE"];
        output.WriteLine($"RMS error: ties {tiesRms:0.00} cm, dtw {dtwRms:0.00} cm; 95% band covers {coverage:P1}; T = {d.Temperature:0.000} (mean cost {d.MeanCost:0.000} x tau {d.AutocorrelationCells:0.0}), segments {d.Segments}");
        Assert.Equal("dtw", d.Method);
        Assert.Equal(200, dtw.Mappings["CORE"].Members.Count);
        // Acceptance bound: dtw at most half the straight-line-ties error; the 95% band holds the truth at >= 90% of samples.
        Assert.True(dtwRms <= 0.5 * tiesRms, $"dtw RMS {dtwRms:0.00} cm is not at most half the ties RMS {tiesRms:0.00} cm");
        Assert.True(coverage >= 0.90, $"the 95% band covers the truth at {coverage:P1} of samples");
    }
}
