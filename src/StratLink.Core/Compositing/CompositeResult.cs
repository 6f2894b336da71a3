using StratLink.Checks;

namespace StratLink.Compositing;

/// <summary>The composite depth scale with its splice, stacked records, ages and the per-core mapping tables.</summary>
public sealed class CompositeResult
{
    public CompositeResult(string referenceCore, CompositeGrid grid, Splice splice, IReadOnlyList<StackedRecord> records,
        CompositeAges? ages, IReadOnlyList<CoreMappingTable> mappings, bool standardised, FindingList findings)
    {
        ReferenceCore = referenceCore;
        Grid = grid;
        Splice = splice;
        Records = records;
        Ages = ages;
        Mappings = mappings;
        Standardised = standardised;
        Findings = findings;
    }

    public string ReferenceCore { get; }
    public CompositeGrid Grid { get; }
    public Splice Splice { get; }

    /// <summary>One stacked record per signal, in the order the cores first list them (reference first).</summary>
    public IReadOnlyList<StackedRecord> Records { get; }

    /// <summary>Null when no age model was available.</summary>
    public CompositeAges? Ages { get; }

    /// <summary>Composite depth of every sample, one table per core (reference first).</summary>
    public IReadOnlyList<CoreMappingTable> Mappings { get; }

    /// <summary>True when signals were stacked as per-core z-scores rather than in their own units.</summary>
    public bool Standardised { get; }

    /// <summary>What the stacked values are, for run metadata and figure labels.</summary>
    public string ScaleNote => Standardised
        ? "z-scores: each core's signal centred on its mean and divided by its standard deviation over its usable samples"
        : "each signal in its own units";

    /// <summary>Problems and notes: splice checks, cores left out.</summary>
    public FindingList Findings { get; }

    public StackedRecord? Record(string signal) => Records.FirstOrDefault(r => r.Signal == signal);
}
