namespace StratLink.Alignment;

/// <summary>Every core's mapping to the reference core's depth scale (the composite depth scale).</summary>
public sealed class AlignmentResult
{
    public AlignmentResult(string referenceCore, string method, IReadOnlyDictionary<string, MappingEnsemble> mappings)
    {
        ReferenceCore = referenceCore;
        Method = method;
        Mappings = mappings;
    }

    public string ReferenceCore { get; }

    /// <summary>The method that made the mappings (<c>ties</c>, <c>dtw</c>).</summary>
    public string Method { get; }

    /// <summary>Core id to its mapping ensemble; the reference core maps by identity.</summary>
    public IReadOnlyDictionary<string, MappingEnsemble> Mappings { get; }
}
