namespace StratLink.Checks;

/// <summary>An age with a 1 sigma error, years cal BP: the form in which the age checks compare ages.</summary>
internal readonly record struct AgeEstimate(double YearsBP, double Sigma);
