using System.Collections.Immutable;
using StratLink.Quantities;

namespace StratLink.Model;

/// <summary>One core of the site: where its table is, how to read it, and which intervals are not usable.</summary>
public sealed record CoreSpec
{
    public required string Id { get; init; }

    /// <summary>Path of the core table, relative to the project file (or absolute).</summary>
    public required string Table { get; init; }

    public string DepthColumn { get; init; } = "depth";

    /// <summary>Signals to use; empty means every numeric column but the depth (and section) columns.</summary>
    public ImmutableList<string> Signals { get; init; } = [];

    /// <summary>No recovery or section breaks: nothing is known there.</summary>
    public ImmutableList<DepthInterval> Gaps { get; init; } = [];

    /// <summary>Recovered but disturbed (e.g. a soupy top): excluded from alignment and the splice.</summary>
    public ImmutableList<DepthInterval> Disturbed { get; init; } = [];

    /// <summary>
    /// Event layers (turbidites, flood beds, thick tephras): instantaneous deposits, sorted and disjoint. The age
    /// model cuts them out (each takes the age of its base); stacks and analysis leave them out unless
    /// <see cref="CompositeSettings.KeepEvents"/>; the alignment keeps them in the signal.
    /// </summary>
    public ImmutableList<DepthInterval> Events { get; init; } = [];

    /// <summary>Section tops, used when the table gives section-relative depths in a <c>section</c> column.</summary>
    public ImmutableList<SectionSpec> Sections { get; init; } = [];

    /// <summary>Extra cell texts that mean "no value" (besides empty, NA and NaN), e.g. <c>-999</c>.</summary>
    public ImmutableList<string> MissingValues { get; init; } = [];

    /// <summary>1-based line of the header row; null = the first line holding the depth column name.</summary>
    public int? HeaderLine { get; init; }

    /// <summary>Sort rows by depth instead of refusing a table whose depths do not increase.</summary>
    public bool Sort { get; init; }

    /// <summary>Free text: piston, gravity, freeze, ... (optional).</summary>
    public string? Type { get; init; }

    /// <summary>What to do with rows that repeat a depth (replicates): refuse them, or combine them into one sample.</summary>
    public RepeatedDepths RepeatedDepths { get; init; } = RepeatedDepths.Error;

    /// <summary>Table column name to the project's signal name, for tables that name a signal differently.</summary>
    public ImmutableDictionary<string, string> Columns { get; init; } = ImmutableDictionary<string, string>.Empty;

    /// <summary>Where the data were published (from an archive file's metadata, or written by the user).</summary>
    public string? Citation { get; init; }

    /// <summary>Coring position, decimal degrees (north and east positive).</summary>
    public double? Latitude { get; init; }

    public double? Longitude { get; init; }

    /// <summary>
    /// Year the core was taken (CE). Nothing in it is younger: the age model keeps the core's ages, and the
    /// composite's at the youngest coring year of the site, at or older than it (<c>1950 - year</c> cal BP).
    /// </summary>
    public int? CoringYear { get; init; }

    /// <summary>Signal name to its unit as free text (e.g. <c>d18O: permil VPDB</c>), for outputs that carry units.</summary>
    public ImmutableDictionary<string, string> Units { get; init; } = ImmutableDictionary<string, string>.Empty;

    /// <summary>The table column that holds <paramref name="signal"/> (the signal name itself unless <see cref="Columns"/> renames one).</summary>
    public string ColumnOf(string signal)
    {
        foreach (var (column, name) in Columns)
            if (name == signal) return column;
        return signal;
    }

    /// <summary>True when <paramref name="depthInProjectUnit"/> lies in a gap or a disturbed interval.</summary>
    public bool IsUnusable(double depthInProjectUnit) =>
        Gaps.Any(g => g.ContainsValue(depthInProjectUnit)) || Disturbed.Any(d => d.ContainsValue(depthInProjectUnit));

    public bool IsInGap(double depthInProjectUnit) => Gaps.Any(g => g.ContainsValue(depthInProjectUnit));
}

public sealed record SectionSpec(string Id, CoreDepth Top);
