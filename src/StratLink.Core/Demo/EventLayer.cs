using StratLink.Model;

namespace StratLink.Demo;

/// <summary>
/// An instantaneous deposit of the invented site (turbidite, flood bed, tephra): it has one age and a
/// thickness in each core's complete sediment column (0 where it was not deposited). Only marker
/// events are listed in the project; the others are left for the alignment to cope with.
/// </summary>
public sealed record EventLayer(string Id, MarkerKind Kind, double AgeBP, bool IsMarker, IReadOnlyDictionary<string, double> ThicknessByCore)
{
    public double ThicknessIn(string coreId) => ThicknessByCore.TryGetValue(coreId, out double h) ? h : 0;
}
