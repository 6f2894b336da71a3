using StratLink.AgeModelling;
using StratLink.Quantities;

namespace StratLink.Analysis;

/// <summary>
/// One record to analyse: values at composite depths with the age scale that dates them (its median and its
/// ensemble members), or values already on ages with no ensemble.
/// </summary>
public sealed class AnalysisInput
{
    private readonly CompositeDepth[]? _depths;
    private readonly ICompositeAgeScale? _scale;
    private readonly double[]? _ages;

    private AnalysisInput(string signal, string? unit, double[] values, CompositeDepth[]? depths, ICompositeAgeScale? scale, double[]? ages)
    {
        SignalName = signal;
        ValueUnit = unit;
        Values = values;
        _depths = depths;
        _scale = scale;
        _ages = ages;
    }

    public string SignalName { get; }

    /// <summary>Unit of the values for labels (e.g. "permil"), or null.</summary>
    public string? ValueUnit { get; }

    /// <summary>NaN = missing.</summary>
    public double[] Values { get; }

    public int MemberCount => _scale?.MemberCount ?? 0;

    public static AnalysisInput FromComposite(string signal, string? valueUnit, IReadOnlyList<CompositeDepth> depths, double[] values, ICompositeAgeScale ages)
    {
        if (depths.Count != values.Length) throw new ArgumentException($"{depths.Count} depths for {values.Length} values of {signal}.", nameof(values));
        return new AnalysisInput(signal, valueUnit, values, depths.ToArray(), ages, null);
    }

    public static AnalysisInput FromAges(string signal, string? valueUnit, double[] agesBP, double[] values)
    {
        if (agesBP.Length != values.Length) throw new ArgumentException($"{agesBP.Length} ages for {values.Length} values of {signal}.", nameof(values));
        return new AnalysisInput(signal, valueUnit, values, null, null, agesBP);
    }

    /// <summary>Median ages of the samples, years cal BP.</summary>
    public double[] MedianAges()
    {
        if (_ages is not null) return _ages;
        var a = new double[_depths!.Length];
        for (int i = 0; i < a.Length; i++) a[i] = _scale!.AgeAt(_depths[i]).MedianBP;
        return a;
    }

    /// <summary>Ages of the samples in age-model member <paramref name="member"/>, years cal BP.</summary>
    public double[] MemberAges(int member)
    {
        if (_scale is null) throw new InvalidOperationException($"{SignalName} has no age ensemble.");
        var a = new double[_depths!.Length];
        for (int i = 0; i < a.Length; i++) a[i] = _scale.MemberAgeAt(member, _depths[i]);
        return a;
    }
}
