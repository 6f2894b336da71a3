namespace StratLink.Analysis;

/// <summary>
/// One shift in the mean: <see cref="Index"/> and <see cref="AgeBP"/> are those of the first sample of the new
/// (younger) regime; the means are the Huber-weighted means of the older and the younger regime.
/// <see cref="Tentative"/> marks a shift with fewer than l samples after it, tested on what the record has.
/// </summary>
public sealed record RegimeShift(int Index, double AgeBP, double MeanBefore, double MeanAfter, double Rsi, bool Tentative);
