using System.Collections.Immutable;
using StratLink.AgeModelling.Calibration;

namespace StratLink.AgeModelling;

/// <summary>
/// What the age model says about one age control: where it sits, its input age (calibrated for
/// radiocarbon), its modelled age after stratigraphic ordering, and how often the other controls contradict it.
/// </summary>
public sealed record AgeControlSummary
{
    public required string Id { get; init; }

    /// <summary><c>calendar</c>, <c>radiocarbon</c> or <c>varve-count</c>.</summary>
    public required string Kind { get; init; }

    /// <summary>Cores the control applies in (several for a marker age).</summary>
    public required ImmutableArray<string> Cores { get; init; }

    /// <summary>Median over iterations of the shallowest and deepest composite depth of its points (equal for a single point); NaN when not used.</summary>
    public double CompositeTop { get; init; } = double.NaN;
    public double CompositeBottom { get; init; } = double.NaN;

    /// <summary>The input age distribution on whole years (calibrated, or the normal calendar age); null for varve sequences and unusable dates.</summary>
    public CalibratedDensity? InputDensity { get; init; }

    /// <summary>The calibration outcome for radiocarbon controls (status and message included).</summary>
    public CalibrationResult? Calibration { get; init; }

    public double InputMedianBP => InputDensity?.Median ?? double.NaN;
    public ImmutableArray<HpdRange> InputHpd68 => InputDensity?.Hpd(CalibratedDensity.OneSigmaLevel) ?? [];
    public ImmutableArray<HpdRange> InputHpd95 => InputDensity?.Hpd(CalibratedDensity.TwoSigmaLevel) ?? [];

    /// <summary>Modelled age at the control's shallowest point after ordering: median and 95 % range, cal BP (NaN when not used).</summary>
    public double ModelledMedianBP { get; init; } = double.NaN;
    public double ModelledLoBP { get; init; } = double.NaN;
    public double ModelledHiBP { get; init; } = double.NaN;

    /// <summary>
    /// Share of iterations (0..1) in which the control's unconstrained draw is out of stratigraphic order with at
    /// least one other control in use. NaN when it could not be drawn.
    /// </summary>
    public double ContradictionShare { get; init; } = double.NaN;

    /// <summary>
    /// Leave-one-out z-score: the mean over the standard deviation of (control's drawn age - age the other
    /// controls give at its depth); positive when the control is older than the others suggest. Of two
    /// controls that contradict each other, the one with the larger |z| is the one the rest disagree with more.
    /// </summary>
    public double LeaveOneOutZ { get; init; } = double.NaN;

    /// <summary>Out of order in at least half of the iterations and |<see cref="LeaveOneOutZ"/>| of 2 or more: check it, or set <c>exclude: true</c>.</summary>
    public bool Flagged { get; init; }

    /// <summary>Prior probability of being an outlier (from the project file).</summary>
    public double OutlierPrior { get; init; } = double.NaN;

    /// <summary>
    /// Posterior outlier share (0..1): the ensemble's weighted mean of the control's outlier probability. NaN for the
    /// varve count that carries the chronology and for controls not used.
    /// </summary>
    public double OutlierShare { get; init; } = double.NaN;

    /// <summary>Left out by the project file (<c>exclude: true</c>); still summarised.</summary>
    public bool Excluded { get; init; }

    /// <summary>True when the control entered the age model.</summary>
    public bool Used { get; init; }

    /// <summary>Why the control could not be used (unknown core, uncalibratable date, bad varve table); null otherwise.</summary>
    public string? Problem { get; init; }
}
