namespace StratLink.Alignment;

/// <summary>
/// A marker tie between a core and the reference: the marker's depth in the core and the
/// composite depth it must map to (its depth in the reference, or carried there through another
/// core), with the marker's depth uncertainty. Raw values in the project unit.
/// </summary>
public readonly record struct TiePoint(string Marker, double CoreDepth, double CompositeDepth, double Uncertainty, string Via);
