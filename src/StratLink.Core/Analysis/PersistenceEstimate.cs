namespace StratLink.Analysis;

/// <summary>AR(1) persistence of a record: time scale tau and the matching lag-one autocorrelation at the mean spacing.</summary>
public sealed record PersistenceEstimate(double TauYears, double Rho, double MeanSpacingYears, bool Clamped);
