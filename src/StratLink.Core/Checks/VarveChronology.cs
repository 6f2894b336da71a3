using StratLink.AgeModelling;
using StratLink.Model;
using StratLink.Workflows;

namespace StratLink.Checks;

/// <summary>
/// The ages a varve count gives along its core, from the age model's own varve reading
/// (<see cref="VarveLayerLoader"/>, <see cref="VarveSequence"/>): anchor age + varves counted from the
/// anchor, with the age model's error model: sigma^2 = anchor error^2 + the random-walk miscount variance
/// accumulated from the anchor (r per varve, each interval at its own rate) + (e n)^2 for the optional systematic
/// counting error e (Zolitschka et al. 2015, QSR 117:1-41, from memory).
/// </summary>
internal sealed class VarveChronology
{
    private readonly Dictionary<string, VarveSequence> _sequences = new(StringComparer.Ordinal);
    private readonly Dictionary<string, string> _problems = new(StringComparer.Ordinal);

    public VarveChronology(LoadedProject loaded, CancellationToken ct)
    {
        var unit = loaded.Project.DepthUnit;
        foreach (var v in loaded.Project.Ages.OfType<VarveCountControl>().Where(v => !v.Exclude))
        {
            if (!File.Exists(loaded.Document.Resolve(v.Table))) continue; // the loader's missing-file error
            var problems = new FindingList();
            var single = loaded.WithProject(loaded.Project with { Ages = [v] });
            if (VarveLayerLoader.Load(single, problems, ct).TryGetValue(v.Id, out var layers)
                && VarveSequence.Build(v.Id, layers.Tops, layers.Bottoms, v.AnchorDepth.In(unit), v.MiscountRateAt, problems) is { } sequence)
                _sequences[v.Id] = sequence;
            else
                _problems[v.Id] = problems.FirstOrDefault()?.ToString() ?? "the varve table has no varves";
        }
    }

    /// <summary>Why a control's varves could not be read, if they could not.</summary>
    public string? Problem(VarveCountControl v) => _problems.GetValueOrDefault(v.Id);

    /// <summary>The counted age at a depth (project unit), or null outside the counted interval or without a readable count.</summary>
    public AgeEstimate? AgeAt(VarveCountControl v, double depth)
    {
        if (!_sequences.TryGetValue(v.Id, out var s) || depth < s.Depths[0] || depth > s.Depths[^1]) return null;
        int i = Array.BinarySearch(s.Depths, depth);
        double count, walkVariance;
        if (i >= 0) (count, walkVariance) = (s.Counts[i], s.Variances[i]);
        else
        {
            i = ~i; // s.Depths[i - 1] < depth < s.Depths[i]
            double f = (depth - s.Depths[i - 1]) / (s.Depths[i] - s.Depths[i - 1]);
            count = s.Counts[i - 1] + f * (s.Counts[i] - s.Counts[i - 1]);
            walkVariance = s.Variances[i - 1] + f * (s.Variances[i] - s.Variances[i - 1]);
        }
        double systematic = v.CountError * Math.Abs(count);
        return new AgeEstimate(v.AnchorAge.YearsBP + count, Math.Sqrt(v.AnchorError * v.AnchorError + walkVariance + systematic * systematic));
    }
}
