using System.Diagnostics.CodeAnalysis;

namespace StratLink.AgeModelling.Calibration;

/// <summary>
/// The outcome of calibrating one radiocarbon date: a density when usable (<see cref="CalibrationStatus.Ok"/>
/// or <see cref="CalibrationStatus.Truncated"/>), otherwise only a message saying why there is no calendar age.
/// </summary>
public sealed record CalibrationResult
{
    public required CalibrationStatus Status { get; init; }

    /// <summary>Null when <see cref="Status"/> is Ok; otherwise a sentence for the user.</summary>
    public string? Message { get; init; }

    public CalibratedDensity? Density { get; init; }

    /// <summary>The 14C age and 1 sigma actually compared with the curve (after the reservoir offset).</summary>
    public required double EffectiveC14Age { get; init; }
    public required double EffectiveC14Error { get; init; }

    public string CurveName { get; init; } = "";

    [MemberNotNullWhen(true, nameof(Density))]
    public bool IsUsable => Density is not null;
}
