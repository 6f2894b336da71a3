namespace StratLink.Analysis;

/// <summary>The record (oldest first) with its Gaussian low-pass and the band-passes around the periods asked for.</summary>
public sealed record FilteredRecord(double[] AgesBP, double[] Values, GaussianFilterBand LowPass, IReadOnlyList<GaussianFilterBand> BandPasses);
