namespace StratLink.Analysis;

/// <summary>Data taper applied to each segment of a segment-averaged spectrum (Harris 1978, Proc. IEEE 66:51).</summary>
public enum TaperWindow
{
    Rectangular,

    /// <summary>1 - (2x - 1)^2 on x in [0, 1].</summary>
    Welch,

    /// <summary>sin^2(pi x), also called Hanning.</summary>
    Hann,

    /// <summary>1 - |2x - 1| (Bartlett).</summary>
    Triangular,
}
