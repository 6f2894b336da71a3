namespace StratLink.Demo;

/// <summary>One counted varve of the freeze core: its top and bottom depth in the project unit.</summary>
public sealed record VarveLayer(double Top, double Bottom);
