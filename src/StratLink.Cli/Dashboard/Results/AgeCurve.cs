using StratLink.AgeModelling;

namespace StratLink.Cli.Dashboard.Results;

/// <summary>
/// The age model along composite depth, with the composite depth range it covers (project unit); the composite grid's
/// ages with the accumulation rate, and the composite scale's event layers, when the run has them.
/// </summary>
public sealed record AgeCurve(ICompositeAgeScale Scale, double TopCompositeDepth, double BottomCompositeDepth,
    AgeSeries? Series = null, EventFreeScale? Events = null);
