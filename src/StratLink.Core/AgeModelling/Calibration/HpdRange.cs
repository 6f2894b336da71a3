namespace StratLink.AgeModelling.Calibration;

/// <summary>One contiguous run of a highest-posterior-density set: whole years from <see cref="YoungBP"/> to <see cref="OldBP"/> inclusive, and the probability inside it.</summary>
public sealed record HpdRange(int YoungBP, int OldBP, double Probability);
