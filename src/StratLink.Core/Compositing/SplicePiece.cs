using StratLink.Quantities;

namespace StratLink.Compositing;

/// <summary>One interval of the splice: a stretch of composite depth taken from one core, with the core depths it spans (median mapping).</summary>
public sealed record SplicePiece(string Core, CompositeDepth From, CompositeDepth To, CoreDepth CoreFrom, CoreDepth CoreTo);
