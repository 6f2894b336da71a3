using StratLink.Checks;
using StratLink.Quantities;

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

    /// <summary>One line for the run metadata (<c>run.json</c> methods): how the splice and the bands were made and what the values are.</summary>
    public string MethodSummary =>
        $"composite depth = {ReferenceCore} depth scale extended through the mappings, step {Grid.Step.ToString(System.Globalization.CultureInfo.InvariantCulture)} {Grid.Unit.Symbol()}; "
        + $"splice {(Splice.Automatic ? "automatic" : "from the project file")}; "
        + "stack: mean of cores (each core the mean of its alignment members), band 2.5-97.5 percentiles (Hyndman-Fan type 7) pooled over cores and members, n = cores with a value; "
        + ScaleNote;

    /// <summary>Problems and notes: splice checks, cores left out.</summary>
    public FindingList Findings { get; }

    public StackedRecord? Record(string signal) => Records.FirstOrDefault(r => r.Signal == signal);
}
