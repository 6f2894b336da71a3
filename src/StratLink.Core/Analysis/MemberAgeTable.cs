using StratLink.AgeModelling;
using StratLink.Quantities;

namespace StratLink.Analysis;

/// <summary>
/// An age scale given as a table: ages of each age-model member at a set of composite depths, linear between
/// them and extended linearly beyond the ends. Lets an ensemble from any source (or a test) feed the analysis.
/// </summary>
public sealed class MemberAgeTable : ICompositeAgeScale
{
    private readonly double[] _depths;
    private readonly double[][] _members;
    private readonly double[]? _median;

    /// <param name="unit">Unit of <paramref name="depths"/>.</param>
    /// <param name="depths">Composite depths, strictly increasing (at least two).</param>
    /// <param name="memberAges">Each member's ages (years cal BP) at <paramref name="depths"/>.</param>
    /// <param name="medianAges">The age model's own median; when null the members' median is used.</param>
    public MemberAgeTable(DepthUnit unit, double[] depths, IReadOnlyList<double[]> memberAges, double[]? medianAges = null)
    {
        if (depths.Length < 2) throw new ArgumentException("An age table needs at least two depths.", nameof(depths));
        for (int i = 1; i < depths.Length; i++)
            if (!(depths[i] > depths[i - 1])) throw new ArgumentException($"Depths must increase (row {i}).", nameof(depths));
        if (memberAges.Count == 0 && medianAges is null) throw new ArgumentException("Give members or a median age model.", nameof(memberAges));
        foreach (var m in memberAges)
            if (m.Length != depths.Length) throw new ArgumentException($"A member has {m.Length} ages for {depths.Length} depths.", nameof(memberAges));
        if (medianAges is not null && medianAges.Length != depths.Length)
            throw new ArgumentException($"{medianAges.Length} median ages for {depths.Length} depths.", nameof(medianAges));
        Unit = unit;
        _depths = depths;
        _members = memberAges.ToArray();
        _median = medianAges;
    }

    public DepthUnit Unit { get; }
    public int MemberCount => _members.Length;

    public double MemberAgeAt(int member, CompositeDepth depth) => Interpolate(_members[member], depth.In(Unit));

    public (double MedianBP, double LoBP, double HiBP) AgeAt(CompositeDepth depth)
    {
        double d = depth.In(Unit);
        if (_members.Length == 0)
        {
            double a = Interpolate(_median!, d);
            return (a, a, a);
        }
        var ages = new double[_members.Length];
        for (int m = 0; m < ages.Length; m++) ages[m] = Interpolate(_members[m], d);
        Array.Sort(ages);
        double median = _median is null ? Statistics.PercentileSorted(ages, 50) : Interpolate(_median, d);
        return (median, Statistics.PercentileSorted(ages, 2.5), Statistics.PercentileSorted(ages, 97.5));
    }

    private double Interpolate(double[] ages, double d)
    {
        int hi = Array.BinarySearch(_depths, d);
        if (hi >= 0) return ages[hi];
        hi = Math.Clamp(~hi, 1, _depths.Length - 1);
        int lo = hi - 1;
        double f = (d - _depths[lo]) / (_depths[hi] - _depths[lo]);
        return ages[lo] + f * (ages[hi] - ages[lo]);
    }
}
