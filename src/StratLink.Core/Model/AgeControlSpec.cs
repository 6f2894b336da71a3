using System.Collections.Immutable;
using StratLink.Quantities;

namespace StratLink.Model;

/// <summary>An age control point: something that says how old the sediment is somewhere.</summary>
public abstract record AgeControlSpec
{
    public required string Id { get; init; }

    /// <summary>Set by the user to leave a contradicted control out of the age model (it stays listed).</summary>
    public bool Exclude { get; init; }

    /// <summary>
    /// Prior probability that the control is an outlier (its age does not date its depth), 0..1; default
    /// <see cref="DefaultOutlierPrior"/>.
    /// </summary>
    public double OutlierPrior { get; init; } = DefaultOutlierPrior;

    /// <summary>5 %: the prior outlier probability commonly given to single dates in published Bayesian age models (common practice; Bronk Ramsey 2009, Radiocarbon 51:1023-1045, from memory).</summary>
    public const double DefaultOutlierPrior = 0.05;

    /// <summary>Trade word for the kind, as written in the project file.</summary>
    public abstract string KindName { get; }
}

/// <summary>
/// A known calendar age (tephra, historical event, coring year), either at a depth in one core or at a
/// marker layer (then it applies in every core holding the marker).
/// </summary>
public sealed record CalendarAgeControl : AgeControlSpec
{
    public string? Core { get; init; }
    public CoreDepth? Depth { get; init; }
    public string? Marker { get; init; }
    public required CalendarAge Age { get; init; }

    /// <summary>1 sigma, years.</summary>
    public double Error { get; init; }

    public override string KindName => "calendar";
}

/// <summary>A conventional radiocarbon age, calibrated against a user-supplied curve file.</summary>
public sealed record RadiocarbonAgeControl : AgeControlSpec
{
    public required string Core { get; init; }
    public required CoreDepth Depth { get; init; }
    public required RadiocarbonAge C14Age { get; init; }

    /// <summary>1 sigma, 14C years.</summary>
    public required double C14Error { get; init; }

    /// <summary>Path to the calibration curve, relative to the project file.</summary>
    public required string Curve { get; init; }

    /// <summary>Regional marine reservoir offset Delta-R and its 1 sigma, 14C years.</summary>
    public double ReservoirOffset { get; init; }
    public double ReservoirError { get; init; }

    /// <summary>Fraction of marine carbon (0..1) when mixing a marine and an atmospheric curve; null = the curve as given.</summary>
    public double? MarineFraction { get; init; }

    /// <summary>The atmospheric curve used for the (1 - f) part when <see cref="MarineFraction"/> is set.</summary>
    public string? AtmosphericCurve { get; init; }

    public override string KindName => "radiocarbon";
}

/// <summary>A varve count: one row per varve in a table, anchored at a depth with a known age (or floating on one).</summary>
public sealed record VarveCountControl : AgeControlSpec
{
    public required string Core { get; init; }

    /// <summary>Path to the varve table (columns depth_top, depth_bottom), relative to the project file.</summary>
    public required string Table { get; init; }

    public required CoreDepth AnchorDepth { get; init; }
    public required CalendarAge AnchorAge { get; init; }

    /// <summary>1 sigma of the anchor age, years (0 for a coring year known exactly).</summary>
    public double AnchorError { get; init; }

    /// <summary>Systematic relative counting error (0.02 = 2 %), 1 sigma, one factor for the whole count; 0 = none.</summary>
    public double CountError { get; init; }

    /// <summary>
    /// Share of varves miscounted (missed or split, each off by one year), 0 &lt; r &lt; 1; the errors accumulate
    /// along the count as a random walk. Default <see cref="DefaultMiscountRate"/>.
    /// </summary>
    public double MiscountRate { get; init; } = DefaultMiscountRate;

    /// <summary>2 %: common practice for well-laminated sediment.</summary>
    public const double DefaultMiscountRate = 0.02;

    /// <summary>Intervals (core depth) counted with less confidence, each with its own miscount rate.</summary>
    public ImmutableList<UncertainCount> Uncertain { get; init; } = [];

    /// <summary>Miscount rate at a core depth in the project unit: its uncertain interval's, else the count's own.</summary>
    public double MiscountRateAt(double depth) =>
        Uncertain.FirstOrDefault(u => u.Interval.ContainsValue(depth)) is { } u ? u.MiscountRate : MiscountRate;

    public override string KindName => "varve-count";
}

/// <summary>An interval of a varve count with its own miscount rate (faint or disturbed laminae).</summary>
public sealed record UncertainCount(DepthInterval Interval, double MiscountRate);
