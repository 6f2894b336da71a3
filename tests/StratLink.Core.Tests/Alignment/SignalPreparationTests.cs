using StratLink.Alignment;
using StratLink.Model;
using StratLink.Quantities;
using StratLink.Tables;

namespace StratLink.Tests.Alignment;

/// <summary>
/// Resampling onto the alignment grid (linear interpolation between the two samples around a row):
/// one missing sample is bridged, a longer run is a hole left missing (our rule, the same as the
/// stacks'), and each row records the spacing of the samples it was read from.
/// </summary>
public class SignalPreparationTests
{
    [Fact]
    public void One_missing_sample_is_bridged_and_a_longer_run_is_a_hole()
    {
        // Samples every 1 cm from 0 to 20 except 5 (one missing) and 11-12 (two missing).
        double[] depths = [.. Enumerable.Range(0, 21).Where(d => d != 5 && d != 11 && d != 12).Select(d => (double)d)];
        var table = new CoreTable("C", DepthUnit.Centimetre, depths, new Dictionary<string, double[]> { ["x"] = [.. depths.Select(d => d * d)] });
        var p = SignalPreparation.Prepare(table, [], ["x"], 1, new AlignmentSettings { Standardise = StandardiseMethods.ZScore });
        var raw = Enumerable.Range(0, p.Count).Select(r => p.Value(r, 0)).ToArray();
        // Standardising is affine, so the bridged row lies halfway between its neighbours (linear interpolation of 16 and 36).
        Assert.Equal((raw[4] + raw[6]) / 2, raw[5], 1e-12);
        Assert.True(double.IsNaN(raw[11]) && double.IsNaN(raw[12]), "a run of two missing samples must stay missing");
        Assert.False(double.IsNaN(raw[10]) || double.IsNaN(raw[13]));
        var spacing = p.SampleSpacing!;
        Assert.Equal(2, spacing[5], 1e-12);
        Assert.Equal(1, spacing[8], 1e-12);
        // Sample 4 stands for the half-spacings either side: (1 + 2) / 2.
        Assert.Equal(1.5, spacing[4], 1e-12);
    }
}
