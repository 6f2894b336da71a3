using StratLink.Quantities;

namespace StratLink.AgeModelling;

/// <summary>
/// Ages along one depth series (a core's samples on its own depth scale, or the composite grid) summarised
/// over the age-model ensemble: median and 2.5/97.5 percentiles, and the accumulation rate with its range.
/// </summary>
public sealed class AgeSeries
{
    public AgeSeries(string id, bool isComposite, DepthUnit unit, double[] depths, double[] ageMedianBP, double[] ageLoBP, double[] ageHiBP,
        double[] rateMedian, double[] rateLo, double[] rateHi, bool[] extrapolated)
    {
        int n = depths.Length;
        if (new[] { ageMedianBP.Length, ageLoBP.Length, ageHiBP.Length, rateMedian.Length, rateLo.Length, rateHi.Length, extrapolated.Length }.Any(l => l != n))
            throw new ArgumentException("Series arrays differ in length.");
        Id = id;
        IsComposite = isComposite;
        Unit = unit;
        Depths = depths;
        AgeMedianBP = ageMedianBP;
        AgeLoBP = ageLoBP;
        AgeHiBP = ageHiBP;
        RateMedian = rateMedian;
        RateLo = rateLo;
        RateHi = rateHi;
        Extrapolated = extrapolated;
    }

    /// <summary>Core id, or <c>composite</c> for the composite grid.</summary>
    public string Id { get; }

    /// <summary>True when <see cref="Depths"/> are composite depths; false for a core's own depths.</summary>
    public bool IsComposite { get; }

    public DepthUnit Unit { get; }

    /// <summary>Depths, ascending, in <see cref="Unit"/>.</summary>
    public double[] Depths { get; }

    public double[] AgeMedianBP { get; }

    /// <summary>2.5 percentile (younger end of the 95 % range), cal BP.</summary>
    public double[] AgeLoBP { get; }

    /// <summary>97.5 percentile (older end of the 95 % range), cal BP.</summary>
    public double[] AgeHiBP { get; }

    /// <summary>
    /// Accumulation rate on event-free depth, depth units per year (median, 2.5 and 97.5 percentiles; inside an event
    /// layer the rate at its base); infinite where ages were pooled to one value. Its inverse is the deposition time.
    /// </summary>
    public double[] RateMedian { get; }
    public double[] RateLo { get; }
    public double[] RateHi { get; }

    /// <summary>True where the depth lies outside the age controls in most members (age extrapolated with the nearest segment's rate).</summary>
    public bool[] Extrapolated { get; }

    public int Count => Depths.Length;

    /// <summary>Event-free depths (the core's event layers, or the composite scale's, cut out), in <see cref="Unit"/>; equal to <see cref="Depths"/> without events.</summary>
    public double[] EventFreeDepths
    {
        get => _eventFree ?? Depths;
        init => _eventFree = value.Length == Depths.Length ? value : throw new ArgumentException("Event-free depths differ in length.");
    }

    private readonly double[]? _eventFree;
}
