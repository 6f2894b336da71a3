namespace StratLink.Demo;

/// <summary>An abrupt change of the climate signal's mean: younger than <paramref name="AgeBP"/> the mean is higher by <paramref name="Step"/>.</summary>
public sealed record RegimeShift(double AgeBP, double Step);
