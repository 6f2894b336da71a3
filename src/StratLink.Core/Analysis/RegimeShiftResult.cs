namespace StratLink.Analysis;

/// <summary>Shifts found by <see cref="RegimeShiftDetector"/>, the regime mean at each sample (oldest first) and the test's thresholds.</summary>
public sealed record RegimeShiftResult(
    IReadOnlyList<RegimeShift> Shifts,
    double[] RegimeMeans,
    double CriticalDifference,
    double SigmaL,
    RegimeShiftOptions Options);
