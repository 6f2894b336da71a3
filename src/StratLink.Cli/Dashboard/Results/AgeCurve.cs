using StratLink.AgeModelling;

namespace StratLink.Cli.Dashboard.Results;

/// <summary>The age model along composite depth, with the composite depth range it covers (project unit).</summary>
public sealed record AgeCurve(ICompositeAgeScale Scale, double TopCompositeDepth, double BottomCompositeDepth);
