using System.Collections.Immutable;
using StratLink.Quantities;

namespace StratLink.Model;

public enum MarkerKind
{
    Tephra,
    Turbidite,
    Flood,
    Event,
    Other,
}

/// <summary>A marker layer seen in two or more cores: a hard tie between their depth scales.</summary>
public sealed record MarkerSpec
{
    public required string Id { get; init; }
    public MarkerKind Kind { get; init; } = MarkerKind.Other;

    /// <summary>Depth of the marker in each core holding it, in the order written in the file.</summary>
    public ImmutableList<MarkerDepth> Depths { get; init; } = [];

    /// <summary>Depth uncertainty in the project unit (same for every core).</summary>
    public double Uncertainty { get; init; }

    public CoreDepth? DepthIn(string coreId) =>
        Depths.FirstOrDefault(d => d.CoreId == coreId) is { } md ? md.Depth : null;
}

public sealed record MarkerDepth(string CoreId, CoreDepth Depth);

public static class MarkerKinds
{
    public static string Name(this MarkerKind kind) => kind.ToString().ToLowerInvariant();

    public static bool TryParse(string? text, out MarkerKind kind) =>
        Enum.TryParse(text, ignoreCase: true, out kind) && Enum.IsDefined(kind) && !int.TryParse(text, out _);
}
