using System.Collections.Immutable;
using StratLink.Quantities;

namespace StratLink.Model;

/// <summary>
/// Everything said about the cores of one site (project file format <c>stratlink-project/1</c>).
/// Immutable: an edit makes a new project, which keeps undo simple and lets background runs work
/// on a snapshot while the user goes on editing.
/// </summary>
public sealed record Project
{
    public const string FormatName = "stratlink-project/1";

    public string Format { get; init; } = FormatName;
    public SiteInfo Site { get; init; } = new();
    public DepthUnit DepthUnit { get; init; } = DepthUnit.Centimetre;
    public ImmutableList<CoreSpec> Cores { get; init; } = [];
    public ImmutableList<MarkerSpec> Markers { get; init; } = [];
    public ImmutableList<AgeControlSpec> Ages { get; init; } = [];
    public AlignmentSettings Alignment { get; init; } = new();
    public CompositeSettings Composite { get; init; } = new();
    public AgeModelSettings AgeModel { get; init; } = new();
    public CheckSettings Checks { get; init; } = new();

    /// <summary>A dated record some cores are aligned to for ages; null when the project has none.</summary>
    public DatedTargetSpec? Target { get; init; }

    public CoreSpec? FindCore(string id) => Cores.FirstOrDefault(c => c.Id == id);
    public MarkerSpec? FindMarker(string id) => Markers.FirstOrDefault(m => m.Id == id);

    /// <summary>The reference core: the one named in the alignment settings, else the first core.</summary>
    public string ReferenceCoreId => Alignment.Reference ?? Cores.FirstOrDefault()?.Id ?? "";

    /// <summary>The cores the target dates: those it names, else the reference core; none without a target.</summary>
    public IReadOnlyList<string> TargetCoreIds => Target is not { } t ? [] : t.Cores.Count > 0 ? t.Cores : [ReferenceCoreId];

    public CoreDepth Depth(double value) => CoreDepth.From(value, DepthUnit);
    public CompositeDepth CompositeDepthOf(double value) => CompositeDepth.From(value, DepthUnit);
}
