namespace StratLink.Compositing;

/// <summary>Calendar age at each composite grid row from the age model: median and 95 % range, years cal BP.</summary>
public sealed class CompositeAges
{
    public CompositeAges(double[] medianBP, double[] loBP, double[] hiBP)
    {
        if (loBP.Length != medianBP.Length || hiBP.Length != medianBP.Length) throw new ArgumentException("Age columns differ in length.");
        MedianBP = medianBP;
        LoBP = loBP;
        HiBP = hiBP;
    }

    public IReadOnlyList<double> MedianBP { get; }

    /// <summary>2.5 percentile (younger bound).</summary>
    public IReadOnlyList<double> LoBP { get; }

    /// <summary>97.5 percentile (older bound).</summary>
    public IReadOnlyList<double> HiBP { get; }
}
