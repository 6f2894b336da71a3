using StratLink.Alignment;
using StratLink.Quantities;

namespace StratLink.Demo;

/// <summary>
/// The hidden truth of one demo core: for each sample its true composite depth (the reference core's
/// depth of the same age; inside an event layer, the same fraction of that layer) and its true age.
/// The functions give the same at any depth of the core.
/// </summary>
public sealed class CoreTruth
{
    private readonly CoreStratigraphy _own;
    private readonly CoreStratigraphy _reference;

    internal CoreTruth(string coreId, double length, double[] depths, CoreStratigraphy own, CoreStratigraphy reference)
    {
        CoreId = coreId;
        Length = length;
        _own = own;
        _reference = reference;
        Depths = depths;
        CompositeDepths = depths.Select(CompositeDepthAt).ToArray();
        AgesBP = depths.Select(AgeAt).ToArray();
    }

    public string CoreId { get; }

    /// <summary>Recovered length of the core (its bottom depth) in the project unit.</summary>
    public double Length { get; }

    /// <summary>Sample depths, as in the core table.</summary>
    public double[] Depths { get; }

    /// <summary>True composite depth of each sample.</summary>
    public double[] CompositeDepths { get; }

    /// <summary>True calendar age of each sample, cal BP.</summary>
    public double[] AgesBP { get; }

    /// <summary>True age at the core top: the coring year for a complete top, older for a core that lost its top.</summary>
    public double TopAgeBP => AgeAt(0);

    /// <summary>True calendar age (cal BP) at a core depth; constant through an event layer.</summary>
    public double AgeAt(double depth) => _own.AgeAt(depth);

    /// <summary>True composite depth at a core depth.</summary>
    public double CompositeDepthAt(double depth)
    {
        var (age, ev, fraction) = _own.Locate(depth);
        if (ev >= 0 && _reference.LayerOf(ev) is { } layer) return layer.Top + fraction * (layer.Base - layer.Top);
        return _reference.CoreDepthAtAge(age);
    }

    /// <summary>The true mapping as knots every <paramref name="step"/> from the core top to its bottom.</summary>
    public DepthMapping ToDepthMapping(DepthUnit unit, double step)
    {
        if (!(step > 0)) throw new ArgumentOutOfRangeException(nameof(step), step, "The knot step must be positive.");
        int n = (int)Math.Ceiling(Length / step) + 1;
        var core = new double[n];
        var composite = new double[n];
        for (int i = 0; i < n; i++)
        {
            core[i] = Math.Min(i * step, Length);
            composite[i] = CompositeDepthAt(core[i]);
        }
        return new DepthMapping(CoreId, unit, core, composite);
    }
}
