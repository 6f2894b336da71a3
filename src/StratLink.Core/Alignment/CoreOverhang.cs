using StratLink.Quantities;

namespace StratLink.Alignment;

/// <summary>
/// A core that runs past the reference (starts above its top or ends below its base, as its ties
/// place it). The reference grid is padded with missing cells there, so the path may leave the
/// reference where the records stop matching instead of squeezing the surplus onto its end; missing
/// cells cost the neutral level, so the padding neither attracts nor repels the path.
/// </summary>
/// <param name="TopSlack">Cells of padding above where the core's top is expected, where a placement decided the padding (the band half-width; 0 otherwise).</param>
/// <param name="BottomSlack">The same below the core's base.</param>
internal readonly record struct CoreOverhang(int Top, int Bottom, double TieRatio = 1, int TopSlack = 0, int BottomSlack = 0)
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
    /// <para>
    /// Against a stack of the other cores (site rounds) the core also has a <paramref name="placement"/>,
    /// its mapping from the previous round (its straight-line-ties mapping in the first where it
    /// started from that), which errs at its ends by far less than the line extrapolated past the
    /// outer ties. An end the line leaves within the band half-width is then padded where the
    /// placement and the line (with ties) both put it outside the stack by more than the open ends'
    /// margin (1 % of the stack, at least 2 cells): a core running a hundred cm past another's base, well inside the
    /// half-width of a long record, is otherwise squeezed onto the stack's end. A core mostly outside
    /// the stack (the one carrying the composite scale past the reference, matched to the part the
    /// reference holds) is padded too: squeezed, it would carry the scale nowhere. The placement decides an
    /// end only where <paramref name="placedEnds"/> says other cores reach past the reference there
    /// or the core carries the scale there.
    /// </para>
    /// </summary>
    public static CoreOverhang Of(PreparedSignals core, PreparedSignals reference, IReadOnlyList<TiePoint> ties, double window, DepthUnit unit,
        DepthMapping? placement = null, (bool Top, bool Bottom)? placedEnds = null)
    {
        int n = core.Count, m = reference.Count;
        int w = Math.Max(1, (int)Math.Ceiling(window * Math.Max(n, m)));
        var byLine = ties.Count == 0 ? default : FromLine(core, reference, ties, w, unit);
        if (placement is null || (byLine.Top > 0 && byLine.Bottom > 0)) return byLine;
        var (above, below) = Outside(core, reference, placement);
        double margin = Math.Max(2, 0.01 * m);
        // With ties, their line must agree that the end lies outside: a placement continued past the
        // stack in one round would otherwise keep itself there in the next.
        var (lineAbove, lineBelow) = ties.Count == 0 ? (above, below)
            : Outside(core, reference, TieNetwork.StraightLines("grid", unit, [.. ties.OrderBy(t => t.CoreDepth)], core.DepthAt(0), core.DepthAt(n - 1)));
        // Only where other cores already reach past the reference (or the core carries the scale
        // there) is the placement evidence of its own: elsewhere it was extrapolated like the line
        // (a porous top through the reference's disturbed top) and the line's rule stands.
        bool topByPlacement = placedEnds?.Top ?? true, bottomByPlacement = placedEnds?.Bottom ?? true;
        int top = byLine.Top > 0 ? byLine.Top : topByPlacement && Math.Min(above, lineAbove) > margin ? (int)Math.Ceiling(Math.Max(above, lineAbove)) + w : 0;
        int bottom = byLine.Bottom > 0 ? byLine.Bottom : bottomByPlacement && Math.Min(below, lineBelow) > margin ? (int)Math.Ceiling(Math.Max(below, lineBelow)) + w : 0;
        if (top == byLine.Top && bottom == byLine.Bottom) return byLine;
        double ratio = byLine.Any ? byLine.TieRatio : (placement.ToCompositeValue(core.DepthAt(n - 1)) - placement.ToCompositeValue(core.DepthAt(0))) / Math.Max(1e-12, core.DepthAt(n - 1) - core.DepthAt(0));
        // The ties' line misses an end by up to a band half-width, so only a placement's end is expected to be where it says.
        return new CoreOverhang(top, bottom, ratio > 0 ? ratio : 1, top != byLine.Top ? w : 0, bottom != byLine.Bottom ? w : 0);
    }

    private static CoreOverhang FromLine(PreparedSignals core, PreparedSignals reference, IReadOnlyList<TiePoint> ties, int w, DepthUnit unit)
    {
        var line = TieNetwork.StraightLines("grid", unit, [.. ties.OrderBy(t => t.CoreDepth)], core.DepthAt(0), core.DepthAt(core.Count - 1));
        int n = core.Count;
        var (above, below) = Outside(core, reference, line);
        // Less than a band half-width (the ties' own error at the ends, a porous top the mean tie rate
        // underrates) is left to the band, as between cores that end together.
        // A core mostly outside the reference shares too little record to fit a rate ratio on; it is
        // left to the band as before. Only what lies outside beyond the line's own error counts.
        if (Math.Max(0, above - w) + Math.Max(0, below - w) > 0.5 * n) return default;
        double ratio = (line.ToCompositeValue(core.DepthAt(n - 1)) - line.ToCompositeValue(core.DepthAt(0))) / Math.Max(1e-12, core.DepthAt(n - 1) - core.DepthAt(0));
        return new CoreOverhang(above > w ? (int)Math.Ceiling(above) + w : 0, below > w ? (int)Math.Ceiling(below) + w : 0, ratio > 0 ? ratio : 1);
    }

    /// <summary>Cells by which <paramref name="map"/> places the core's top above and its base below the reference.</summary>
    private static (double Above, double Below) Outside(PreparedSignals core, PreparedSignals reference, DepthMapping map) =>
        ((reference.Top - map.ToCompositeValue(core.DepthAt(0))) / reference.Step,
         (map.ToCompositeValue(core.DepthAt(core.Count - 1)) - reference.DepthAt(reference.Count - 1)) / reference.Step);

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
