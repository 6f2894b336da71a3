using StratLink.Alignment;

namespace StratLink.Tests.Alignment;

/// <summary>
/// Which core carries the composite scale past an end of the reference. The carrier's long-run rate
/// ratio is fitted over the record it shares with the reference, and the error of a ratio fitted
/// over length L falls as 1 / sqrt(L) for offsets of a fixed correlation length (the standard error
/// of a mean over L / correlation-length independent values, textbook statistics), so a core
/// sharing a fifth of another's record extrapolates with more than twice its ratio error.
/// </summary>
public class SiteAlignerCarrierTests
{
    [Fact]
    public void A_short_core_placed_furthest_does_not_carry_the_scale_beside_cores_spanning_the_reference()
    {
        // A freeze core sharing 45 cm, extrapolated furthest above the top; two piston cores share 300 cm.
        var above = new SiteAligner.CarrierCandidate[] { new("P1", 42.5, 300), new("P2", 40.7, 300), new("F4", 50.5, 45) };
        Assert.Equal("P1", SiteAligner.CarrierAmong(above));
    }

    [Fact]
    public void Among_cores_sharing_comparable_records_the_one_reaching_furthest_carries_the_scale()
    {
        // 160 cm is more than half of 300 cm: both ratios are within a factor sqrt(300 / 160) = 1.37 of each other's error.
        var below = new SiteAligner.CarrierCandidate[] { new("P1", 380, 300), new("P2", 350, 160) };
        Assert.Equal("P1", SiteAligner.CarrierAmong(below));
        var reversed = new SiteAligner.CarrierCandidate[] { new("P1", 350, 300), new("P2", 380, 160) };
        Assert.Equal("P2", SiteAligner.CarrierAmong(reversed));
    }

    [Fact]
    public void A_core_alone_past_an_end_carries_nothing()
    {
        Assert.Null(SiteAligner.CarrierAmong([new SiteAligner.CarrierCandidate("P1", 380, 300)]));
        Assert.Null(SiteAligner.CarrierAmong([]));
    }
}
