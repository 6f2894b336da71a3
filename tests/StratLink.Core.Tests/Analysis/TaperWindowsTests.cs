using StratLink.Analysis;

namespace StratLink.Tests.Analysis;

public class TaperWindowsTests
{
    [Theory]
    // Harris 1978 (Proc. IEEE 66:51) Table 1, overlap correlation at 50 % overlap: rectangle 50.0 %,
    // triangle 25.0 %, Hanning 16.7 %; Welch 0.344 as tabulated with Schulz and Mudelsee's (2002) method.
    [InlineData(TaperWindow.Rectangular, 0.500, 0.001)]
    [InlineData(TaperWindow.Triangular, 0.250, 0.001)]
    [InlineData(TaperWindow.Hann, 0.167, 0.001)]
    [InlineData(TaperWindow.Welch, 0.344, 0.001)]
    public void HalfOverlapCorrelation_MatchesPublishedTable(TaperWindow window, double expected, double tol) =>
        Assert.Equal(expected, window.HalfOverlapCorrelation(), tol);

    [Theory]
    // Harris 1978 Table 1, 6.0-dB bandwidth in bins: rectangle 1.21, triangle 1.78, Hanning 2.00;
    // Welch 1.59 as tabulated with Schulz and Mudelsee's (2002) method. Tables give 2 decimals: +-0.01.
    [InlineData(TaperWindow.Rectangular, 1.21)]
    [InlineData(TaperWindow.Triangular, 1.78)]
    [InlineData(TaperWindow.Hann, 2.00)]
    [InlineData(TaperWindow.Welch, 1.59)]
    public void SixDecibelBandwidth_MatchesPublishedTable(TaperWindow window, double expected) =>
        Assert.Equal(expected, window.SixDecibelBandwidthBins(), 0.01);

    [Fact]
    public void DegreesOfFreedom_SingleSegmentIsTwo_AndRectangleThreeSegmentsFollowsWelch()
    {
        // One periodogram: chi-square with 2 dof. Rectangle, n = 3, c = 0.5: 6 / (1 + 0.5 - 0.5/3) = 4.5 (Welch 1967 formula).
        Assert.Equal(2.0, TaperWindow.Hann.EquivalentDegreesOfFreedom(1), 1e-12);
        Assert.Equal(4.5, TaperWindow.Rectangular.EquivalentDegreesOfFreedom(3), 1e-3);
    }
}
