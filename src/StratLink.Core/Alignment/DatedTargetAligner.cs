using StratLink.Checks;
using StratLink.Model;
using StratLink.Tables;

namespace StratLink.Alignment;

/// <summary>
/// Transfers ages to a core by aligning its signal to a dated target record (a stack, or a dated
/// master core given as signal against age). The target's age axis is laid out as a depth axis at
/// the mean accumulation rate the two spans imply (core length over the target's age span), so the
/// core-to-reference dtw with its path ensemble applies unchanged; each ensemble member's mapping,
/// read back as age, is one draw of the transferred age model. The target's span is the expected
/// age span of the core (the ends are matched to its ends).
/// </summary>
public static class DatedTargetAligner
{
    /// <param name="core">The core's samples (depth in its unit).</param>
    /// <param name="signal">Signal column shared by core and target.</param>
    /// <param name="targetAges">Target ages, ascending, in any age unit (results come back in it).</param>
    /// <param name="targetValues">Target signal at those ages.</param>
    public static TransferredAges Align(CoreTable core, string signal, double[] targetAges, double[] targetValues,
        AlignmentSettings settings, int seed, FindingList findings, CancellationToken ct = default)
    {
        if (targetAges.Length != targetValues.Length || targetAges.Length < 2) throw new ArgumentException("The target needs at least two ages with one value each.");
        double span = targetAges[^1] - targetAges[0];
        if (!(span > 0)) throw new ArgumentException("Target ages must ascend.");
        double rate = (core.Depths[^1] - core.Depths[0]) / span;
        double origin = core.Depths[0] - rate * targetAges[0];
        var pseudo = targetAges.Select(a => origin + rate * a).ToArray();
        var target = new CoreTable("target", core.Unit, pseudo, new Dictionary<string, double[]> { [signal] = targetValues });
        double step = settings.Step ?? SignalPreparation.MedianSpacing(core.Depths);
        var a = SignalPreparation.Prepare(core, [], [signal], step, settings);
        var b = SignalPreparation.Prepare(target, [], [signal], step, settings);
        var (mapping, _) = DtwCoreAligner.Align(a, b, [1.0], [], DtwCoreOptions.From(settings, seed) with { OpenBegin = false, OpenEnd = false }, core.Unit, findings, ct);
        return new TransferredAges(mapping, origin, rate);
    }
}

/// <summary>Ages transferred by alignment: each mapping member read as age (target age = (mapped depth - origin) / rate).</summary>
public sealed class TransferredAges(MappingEnsemble mapping, double origin, double rate)
{
    public MappingEnsemble Mapping { get; } = mapping;

    /// <summary>Median transferred age at a core depth, in the target's age unit.</summary>
    public double AgeAt(double coreDepth) => ToAge(Mapping.Median.ToCompositeValue(coreDepth));

    /// <summary>2.5 and 97.5 percentiles of the transferred age over the ensemble.</summary>
    public (double Lo, double Hi) AgeRange(double coreDepth)
    {
        var (lo, hi) = Mapping.CompositeRange(coreDepth);
        return (ToAge(lo), ToAge(hi));
    }

    /// <summary>Age of ensemble member <paramref name="member"/> at a core depth.</summary>
    public double MemberAgeAt(int member, double coreDepth) => ToAge(Mapping.Member(member).ToCompositeValue(coreDepth));

    /// <summary>
    /// Transferred ages as age controls at the given core depths: a normal whose 1 sigma combines
    /// the ensemble's spread (the 95% range / 3.92) and the target's own age error at that age
    /// (<paramref name="targetAgeError"/>, same unit), in quadrature. This is the form in which they
    /// join a core's other age controls.
    /// </summary>
    public IReadOnlyList<TransferredAge> Controls(IReadOnlyList<double> coreDepths, Func<double, double> targetAgeError)
    {
        var controls = new List<TransferredAge>(coreDepths.Count);
        foreach (double z in coreDepths)
        {
            double age = AgeAt(z);
            var (lo, hi) = AgeRange(z);
            double spread = (hi - lo) / 3.92, error = targetAgeError(age);
            controls.Add(new TransferredAge(z, age, Math.Sqrt(spread * spread + error * error)));
        }
        return controls;
    }

    private double ToAge(double mapped) => (mapped - origin) / rate;
}

/// <summary>An age transferred to a core depth: mean and 1 sigma in the target's age unit.</summary>
public readonly record struct TransferredAge(double CoreDepth, double Age, double Sigma);
