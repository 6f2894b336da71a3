using System.Collections.Immutable;

namespace StratLink.Tables;

/// <summary>
/// What a data archive says about a table in its preamble: the site, its position, the citation, each
/// column's unit and the cell text that means "no value". Every field is optional.
/// </summary>
public sealed record ArchiveMetadata
{
    /// <summary>The preamble's layout: <see cref="DescriptionBlock"/>, <see cref="NoaaText"/> or null for none recognised.</summary>
    public string? Layout { get; init; }

    public string? Site { get; init; }
    public double? Latitude { get; init; }
    public double? Longitude { get; init; }
    public string? Citation { get; init; }

    /// <summary>Column name (as in the header) to its unit.</summary>
    public ImmutableDictionary<string, string> Units { get; init; } = ImmutableDictionary<string, string>.Empty;

    /// <summary>A cell text meaning "no value" (e.g. -999), when the preamble names one.</summary>
    public string? MissingValue { get; init; }

    /// <summary>Tab-separated text after a <c>/* DATA DESCRIPTION: ... */</c> block.</summary>
    public const string DescriptionBlock = "description-block";

    /// <summary>The NOAA paleoclimate text template: <c>#</c> metadata lines, then tab- or blank-separated data.</summary>
    public const string NoaaText = "noaa-text";

    public bool IsEmpty => Layout is null;
}
