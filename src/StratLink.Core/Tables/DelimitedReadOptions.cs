namespace StratLink.Tables;

/// <summary>What a delimited table must hold and how to find its header.</summary>
public sealed record DelimitedReadOptions
{
    /// <summary>The column that identifies the header line (the depth column) and that every row is keyed on.</summary>
    public required string KeyColumn { get; init; }

    /// <summary>1-based header line; null = the first non-comment line holding <see cref="KeyColumn"/>.</summary>
    public int? HeaderLine { get; init; }

    /// <summary>Cell texts meaning "no value" besides empty, NA and NaN (any case), e.g. <c>-999</c>.</summary>
    public IReadOnlyList<string> MissingValues { get; init; } = [];

    /// <summary>Columns read as text (ids such as <c>section</c>) rather than numbers.</summary>
    public IReadOnlyList<string> TextColumns { get; init; } = [];

    /// <summary>Lines searched for the header when <see cref="HeaderLine"/> is not given (free-text preambles can be long).</summary>
    public int MaxHeaderSearchLines { get; init; } = 10_000;

    /// <summary>A longer line is not a table row: reading stops with a message instead of holding it in memory.</summary>
    public int MaxLineBytes { get; init; } = 1024 * 1024;
}
