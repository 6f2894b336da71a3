using System.Collections.Immutable;
using StratLink.Quantities;

namespace StratLink.Model;

/// <summary>How the composite depth scale, the splice and the stacked records are built.</summary>
public sealed record CompositeSettings
{
    /// <summary>Composite depth resolution in the project unit.</summary>
    public double Step { get; init; } = 0.5;

    /// <summary>Null = automatic splice; otherwise the user's intervals in composite depth.</summary>
    public ImmutableList<SpliceInterval>? Splice { get; init; }

    /// <summary>Stack z-scores instead of the signals' own units.</summary>
    public bool Standardise { get; init; }

    /// <summary>Keep the cores' event layers in the stacked records (default: left out, they are not the background signal).</summary>
    public bool KeepEvents { get; init; }
}

public sealed record SpliceInterval(string Core, CompositeDepth From, CompositeDepth To);
