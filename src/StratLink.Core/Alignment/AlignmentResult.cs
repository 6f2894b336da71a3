using StratLink.Checks;

namespace StratLink.Alignment;

/// <summary>Every core's mapping to the reference core's depth scale (the composite depth scale).</summary>
public sealed class AlignmentResult
{
    public AlignmentResult(string referenceCore, string method, IReadOnlyDictionary<string, MappingEnsemble> mappings,
        IReadOnlyList<Finding>? findings = null, IReadOnlyDictionary<string, CoreAlignmentDiagnostics>? diagnostics = null, int? seed = null)
    {
        ReferenceCore = referenceCore;
        Method = method;
        Mappings = mappings;
        Findings = findings ?? [];
        Diagnostics = diagnostics ?? new Dictionary<string, CoreAlignmentDiagnostics>();
        Seed = seed;
    }

    public string ReferenceCore { get; }

    /// <summary>The method that made the mappings (<c>ties</c>, <c>dtw</c>).</summary>
    public string Method { get; }

    /// <summary>Core id to its mapping ensemble; the reference core maps by identity.</summary>
    public IReadOnlyDictionary<string, MappingEnsemble> Mappings { get; }

    /// <summary>Warnings of the run (ties left out, cores aligned by a fallback), for checks.csv.</summary>
    public IReadOnlyList<Finding> Findings { get; }

    /// <summary>Per core: method used, distance, posterior temperature, segments (for run.json).</summary>
    public IReadOnlyDictionary<string, CoreAlignmentDiagnostics> Diagnostics { get; }

    /// <summary>Seed of the alignment ensemble (record it in run.json); null when nothing was drawn.</summary>
    public int? Seed { get; }
}
