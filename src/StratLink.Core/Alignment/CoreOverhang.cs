using StratLink.Quantities;

namespace StratLink.Alignment;

/// <summary>
/// A core that runs past the reference (starts above its top or ends below its base, as its ties
/// place it). The reference grid is padded with missing cells there, so the path may leave the
/// reference where the records stop matching instead of squeezing the surplus onto its end; missing
/// cells cost the neutral level, so the padding neither attracts nor repels the path.
/// </summary>
internal readonly record struct CoreOverhang(int Top, int Bottom, double TieRatio = 1)
{
    public bool Any => Top > 0 || Bottom > 0;

    /// <summary>Mean rate ratio of the straight-line-ties mapping over the core (1 with a single tie).</summary>
    public double MeanTieRatio => TieRatio;

    /// <summary>
    /// Cells by which the straight-line-ties mapping places the core's ends outside the reference,
    /// plus the band half-width so the band is not clipped there; none without ties, where the overhang
    /// is within the band half-width, or where more than half the core lies outside by more than that.
    /// A single tie gives no rate ratio, so the line runs at ratio 1 from it (as between cores of one
    /// basin with similar rates): a short core tied once to a longer one it runs past (a freeze core
    /// above a gravity core's lost top) would otherwise be squeezed onto the reference's end, though
    /// padded it leaves the reference where the records stop matching.
    /// </summary>
    public static CoreOverhang Of(PreparedSignals core, PreparedSignals reference, IReadOnlyList<TiePoint> ties, double window, DepthUnit unit)
    {
        if (ties.Count == 0) return default;
        var line = TieNetwork.StraightLines("grid", unit, [.. ties.OrderBy(t => t.CoreDepth)], core.DepthAt(0), core.DepthAt(core.Count - 1));
        int n = core.Count, m = reference.Count;
        double above = (reference.Top - line.ToCompositeValue(core.DepthAt(0))) / reference.Step;
        double below = (line.ToCompositeValue(core.DepthAt(n - 1)) - reference.DepthAt(m - 1)) / reference.Step;
        // Less than a band half-width (the ties' own error at the ends, a porous top the mean tie rate
        // underrates) is left to the band, as between cores that end together.
        int w = Math.Max(1, (int)Math.Ceiling(window * Math.Max(n, m)));
        // A core mostly outside the reference shares too little record to fit a rate ratio on; it is
        // left to the band as before. Only what lies outside beyond the line's own error counts.
        if (Math.Max(0, above - w) + Math.Max(0, below - w) > 0.5 * n) return default;
        double ratio = (line.ToCompositeValue(core.DepthAt(n - 1)) - line.ToCompositeValue(core.DepthAt(0))) / Math.Max(1e-12, core.DepthAt(n - 1) - core.DepthAt(0));
        return new CoreOverhang(above > w ? (int)Math.Ceiling(above) + w : 0, below > w ? (int)Math.Ceiling(below) + w : 0, ratio > 0 ? ratio : 1);
    }

    /// <summary>The reference with <see cref="Top"/> missing rows above and <see cref="Bottom"/> below.</summary>
    public PreparedSignals Pad(PreparedSignals reference)
    {
        int dims = reference.Signals.Length, count = reference.Count + Top + Bottom;
        var values = new double[count * dims];
        Array.Fill(values, double.NaN);
        Array.Copy(reference.Values, 0, values, Top * dims, reference.Values.Length);
        return new PreparedSignals(reference.CoreId, reference.Top - Top * reference.Step, reference.Step, count, reference.Signals, values);
    }
}
