using StratLink.Quantities;

namespace StratLink.Alignment;

/// <summary>
/// The composite scale past one end of the reference (above its top or below its base), where no
/// record of the reference fixes it: there it is the continuation of the core reaching furthest
/// past that end (the carrier), aligned to what the reference holds and continued with a band
/// widening with distance (<see cref="EndExtension"/>'s members, plus the cores' scatter about the
/// consensus) about the consensus of the cores
/// there, each continued at its long-run rate ratio (<see cref="Consensus"/>): the reference's
/// unrecovered column keeps rate wiggles no core shows, so over hundreds of cm the mean ratio over
/// the whole shared stretch forecasts it better than the ratio next to the reference's end, and
/// the mean over several cores better than any one. The other cores there are
/// matched to the carrier's median, so their own members carry only their matching uncertainty;
/// this adds the scale's: member e of every core is moved as member e of the carrier departs from
/// the carrier's median (y to carrier_e(carrier^-1(y)), less that member's departure at the
/// reference's end, which is matching jitter and not the scale's), one perturbation of the scale
/// per member index shared by all cores, so member e stays consistent across cores. Where the
/// bands past the end fall short of what a straight continuation is measured to err over the
/// overlap (<see cref="ExtrapolationError"/>), one more such perturbation widens them
/// (<see cref="WidenToMeasuredError"/>). A common
/// reference for the shared perturbation is how stacks carry one age model's uncertainty into every
/// record tuned to it (Lisiecki and Raymo 2005, from memory).
/// </summary>
internal sealed class ScaleContinuation
{
    private readonly DepthMapping _carrier;
    private readonly IReadOnlyList<DepthMapping> _members;
    private readonly double _end, _carrierAtEnd;
    private readonly bool _below;

    private ScaleContinuation(MappingEnsemble carrier, double end, bool below)
    {
        (_carrier, _members, _end, _below) = (carrier.Median, carrier.Members, end, below);
        _carrierAtEnd = _carrier.ToCoreValue(end);
    }

    /// <summary>
    /// <paramref name="carrier"/> past the reference's end (<paramref name="refBottom"/> when
    /// <paramref name="below"/>, else <paramref name="refTop"/>) recentred on the consensus of every
    /// core reaching past it (<paramref name="cores"/>: prepared signals and current median, the
    /// carrier among them). Each core's line is its long-run rate ratio (<see cref="Line"/>); at each
    /// sample of the carrier the consensus is the carrier's line plus the mean, weighted by the length
    /// each core shares with the reference, of where the other cores' lines put the level their
    /// medians match to it, less the carrier's line (held at its last value past a core's end, so the
    /// consensus stays continuous). Each core's own rate wiggles against the reference then average
    /// out over the cores, leaving the reference's unrecovered ones. Each member keeps its departure
    /// from the median and adds one normal draw (seeded from <paramref name="seed"/>, the carrier and
    /// the member's index) times the cores' scatter at each sample (<see cref="Spread"/>).
    /// </summary>
    public static MappingEnsemble Consensus(MappingEnsemble carrier, PreparedSignals carrierCore, IReadOnlyList<(PreparedSignals Core, DepthMapping Median)> cores,
        double refTop, double refBottom, bool below, DepthUnit unit, int seed = 0)
    {
        double sign = below ? 1 : -1;
        var lines = new List<(DepthMapping Median, Line Line, double XFar)>();
        Line? own = null;
        double ownFar = 0;
        foreach (var (core, median) in cores)
        {
            if (Line.Of(core, median, refTop, refBottom, below) is not { } line) continue;
            double xFar = below ? core.DepthAt(core.Count - 1) : core.DepthAt(0);
            if (ReferenceEquals(core, carrierCore)) (own, ownFar) = (line, xFar);
            else lines.Add((median, line, xFar));
        }
        if (own is not { } c) return carrier;
        var m0 = carrier.Median;
        double step = carrierCore.Step;
        int count = Math.Max(1, (int)Math.Ceiling(Math.Abs(ownFar - c.XEnd) / step));
        var xs = new double[count + 1];
        var ys = new double[count + 1];
        var spread = new double[count + 1];
        var held = new double[lines.Count];
        for (int q = 0; q <= count; q++)
        {
            double x = c.XEnd + sign * Math.Min(q * step, Math.Abs(ownFar - c.XEnd));
            double line = c.At(x), y = m0.ToCompositeValue(x);
            double sum = 0, weight = c.Weight;
            for (int k = 0; k < lines.Count; k++)
            {
                var l = lines[k];
                double reached = l.Median.ToCompositeValue(l.XFar);
                if (sign * (y - reached) <= 0)
                {
                    double xk = l.Median.ToCoreValue(y);
                    held[k] = l.Line.At(xk) - line;
                }
                sum += l.Line.Weight * held[k];
                weight += l.Line.Weight;
            }
            xs[q] = x;
            ys[q] = line + sum / weight;
            spread[q] = Spread(held, sum / weight, lines.Count + 1);
            if (q > 0) ys[q] = below ? Math.Max(ys[q], ys[q - 1]) : Math.Min(ys[q], ys[q - 1]);
        }
        var consensus = new DepthMapping(m0.CoreId, unit, below ? xs : [.. xs.Reverse()], below ? ys : [.. ys.Reverse()]);
        double SpreadAt(double x)
        {
            double r = Math.Abs(x - c.XEnd) / step;
            int i = (int)Math.Floor(r);
            return i >= count ? spread[count] : spread[i] + (r - i) * (spread[i + 1] - spread[i]);
        }
        bool Past(double x) => sign * (x - c.XEnd) > 0;
        double top0 = carrierCore.DepthAt(0), bottom0 = carrierCore.DepthAt(carrierCore.Count - 1);
        DepthMapping Recentred(DepthMapping m, double draw)
        {
            var kx = m.CoreKnots.Concat(m0.CoreKnots).Concat(xs).Where(x => x >= top0 && x <= bottom0).Distinct().Order().ToArray();
            var ky = new double[kx.Length];
            var past = new bool[kx.Length];
            for (int k = 0; k < kx.Length; k++)
            {
                past[k] = Past(kx[k]);
                ky[k] = past[k] ? m.ToCompositeValue(kx[k]) - m0.ToCompositeValue(kx[k]) + consensus.ToCompositeValue(kx[k]) + draw * SpreadAt(kx[k]) : m.ToCompositeValue(kx[k]);
            }
            RestoreOrder(kx, ky, past, below, m);
            return new DepthMapping(m.CoreId, m.Unit, kx, ky);
        }
        if (carrier.Members.Count == 0) return new MappingEnsemble(Recentred(m0, 0), []);
        var members = carrier.Members.Select((m, e) => Recentred(m, Normal(new Random(Seeds.Derive(seed, carrierCore.CoreId + (below ? "/scale-below" : "/scale-above"), e))))).ToArray();
        return new MappingEnsemble(DtwCoreAligner.PointwiseMedian(carrierCore, unit, members, double.NegativeInfinity, double.PositiveInfinity), members);
    }

    /// <summary>
    /// The ensembles of <paramref name="cores"/> (prepared signals and ensemble, in that order back)
    /// with one more perturbation of the scale past the reference's end (<paramref name="refBottom"/>
    /// when <paramref name="below"/>, else <paramref name="refTop"/>) where any core's band is
    /// narrower there than a straight continuation is measured to err: the continuation's error at
    /// composite distance d is that of every core's median mapping over the overlap continued d from
    /// any of its samples at its long-run ratio (<see cref="ExtrapolationError"/>, pooled over the
    /// cores reaching past the end: the reference's column past its end is one more record of that
    /// kind, and the pooled departure of one core's line carries both records' wiggles, at most
    /// what the consensus of several lines errs by). At each distance the perturbation's standard
    /// deviation is what that error exceeds, in quadrature, the narrowest band there (half its 95 %
    /// width over 1.96), held from there outwards; member e of every core takes one normal draw
    /// (seeded from <paramref name="seed"/>, the end and e) times it as a shift of composite depth, so
    /// member e stays consistent across cores. The medians are kept: the draws are about zero, and
    /// their sampled median would move a median by noise.
    /// </summary>
    public static IReadOnlyList<MappingEnsemble> WidenToMeasuredError(IReadOnlyList<(PreparedSignals Core, MappingEnsemble Mapping)> cores,
        double refTop, double refBottom, bool below, double step, int seed)
    {
        double end = below ? refBottom : refTop, sign = below ? 1 : -1;
        var past = cores.Where(c => Reaches(c.Core, c.Mapping.Median, end, below)).ToList();
        var records = past.Select(c => Inside(c.Core, c.Mapping.Median, refTop, refBottom));
        var unchanged = cores.Select(c => c.Mapping).ToList();
        if (ExtrapolationError.Measure(records, step) is not { } error) return unchanged;
        double far = past.Max(c => sign * (c.Mapping.Median.ToCompositeValue(below ? c.Core.DepthAt(c.Core.Count - 1) : c.Core.DepthAt(0)) - end));
        int count = (int)Math.Ceiling(far / step) + 1;
        var narrowest = Enumerable.Repeat(double.PositiveInfinity, count).ToArray();
        foreach (var (core, mapping) in past)
        {
            if (mapping.Members.Count == 0) continue;
            var values = new double[mapping.Members.Count];
            for (int j = 0; j < count; j++)
            {
                double x = mapping.Median.ToCoreValue(end + sign * j * step);
                if (x < core.DepthAt(0) || x > core.DepthAt(core.Count - 1)) continue;
                for (int e = 0; e < values.Length; e++) values[e] = mapping.Members[e].ToCompositeValue(x);
                Array.Sort(values);
                double sd = Statistics.SigmaOfRange95(Statistics.PercentileSorted(values, 2.5), Statistics.PercentileSorted(values, 97.5));
                narrowest[j] = Math.Min(narrowest[j], sd);
            }
        }
        var extra = new double[count];
        for (int j = 1; j < count; j++)
        {
            double measured = error.At(j * step), band = double.IsPositiveInfinity(narrowest[j]) ? measured : narrowest[j];
            extra[j] = Math.Max(extra[j - 1], Math.Sqrt(Math.Max(0, measured * measured - band * band)));
        }
        if (extra[^1] <= 0) return unchanged;
        double ExtraAt(double distance)
        {
            double r = Math.Min(distance / step, count - 1);
            int i = Math.Min((int)Math.Floor(r), count - 2);
            return extra[i] + (r - i) * (extra[i + 1] - extra[i]);
        }
        string name = below ? "/scale-error-below" : "/scale-error-above";
        var draws = new double[cores.Max(c => c.Mapping.Members.Count)];
        for (int e = 0; e < draws.Length; e++) draws[e] = Normal(new Random(Seeds.Derive(seed, name, e)));
        bool Past(double y) => sign * (y - end) > 0;
        return [.. cores.Select(c => c.Mapping.Members.Count == 0 || !Reaches(c.Core, c.Mapping.Median, end, below) ? c.Mapping
            : new MappingEnsemble(c.Mapping.Median, [.. c.Mapping.Members.Select((m, e) => Shifted(c.Core, m, draws[e]))]))];

        DepthMapping Shifted(PreparedSignals core, DepthMapping m, double draw)
        {
            var kx = m.CoreKnots.Concat(Enumerable.Range(0, core.Count).Select(core.DepthAt).Where(x => Past(m.ToCompositeValue(x)))).Distinct().Order().ToList();
            var cx = new List<double>(kx.Count + 1);
            var cy = new List<double>(kx.Count + 1);
            var past = new List<bool>(kx.Count + 1);
            foreach (double x in kx)
            {
                double y = m.ToCompositeValue(x);
                // A knot where the member crosses the end keeps the part inside the reference as it was.
                if (cx.Count > 0 && Past(y) != Past(m.ToCompositeValue(cx[^1])))
                {
                    double at = m.ToCoreValue(end);
                    if (at > cx[^1] && at < x) { cx.Add(at); cy.Add(end); past.Add(false); }
                }
                cx.Add(x);
                cy.Add(Past(y) ? y + sign * draw * ExtraAt(sign * (y - end)) : y);
                past.Add(Past(y));
            }
            double[] sx = [.. cx], sy = [.. cy];
            RestoreOrder(sx, sy, [.. past], below, m);
            return new DepthMapping(m.CoreId, m.Unit, sx, sy);
        }
    }

    private static bool Reaches(PreparedSignals core, DepthMapping median, double end, bool below) =>
        below ? median.ToCompositeValue(core.DepthAt(core.Count - 1)) > end : median.ToCompositeValue(core.DepthAt(0)) < end;

    /// <summary>A core's samples its median maps inside the reference and the composite depths it gives them.</summary>
    private static (double[] CoreDepths, double[] CompositeDepths) Inside(PreparedSignals core, DepthMapping median, double refTop, double refBottom)
    {
        var x = new List<double>();
        var y = new List<double>();
        for (int i = 0; i < core.Count; i++)
        {
            double v = median.ToCompositeValue(core.DepthAt(i));
            if (v < refTop || v > refBottom) continue;
            x.Add(core.DepthAt(i));
            y.Add(v);
        }
        return ([.. x], [.. y]);
    }

    /// <summary>The scale past <paramref name="end"/> (the reference's base when <paramref name="below"/>, else its top) as <paramref name="carrier"/>'s members place it; null without members.</summary>
    public static ScaleContinuation? Of(MappingEnsemble carrier, double end, bool below) =>
        carrier.Members.Count == 0 ? null : new ScaleContinuation(carrier, end, below);

    private bool Past(double y) => _below ? y > _end : y < _end;

    /// <summary>Member <paramref name="e"/>'s composite depth for composite depth <paramref name="y"/> of the carrier's median.</summary>
    private double Perturbed(double y, int e)
    {
        if (!Past(y)) return y;
        var m = _members[e % _members.Count];
        // Past the carrier's own end its departure there is held: a member's last segment is no
        // rate to extrapolate the scale's error at.
        double far = _below ? _carrier.CompositeKnots[^1] : _carrier.CompositeKnots[0];
        double at = _below ? Math.Min(y, far) : Math.Max(y, far);
        double x = _carrier.ToCoreValue(at);
        return y + m.ToCompositeValue(x) - at - (m.ToCompositeValue(_carrierAtEnd) - _end);
    }

    /// <summary><paramref name="member"/> (member <paramref name="e"/> of another core) with its part past the end moved as the carrier's member <paramref name="e"/> moves the scale.</summary>
    public DepthMapping Apply(DepthMapping member, int e)
    {
        var x = member.CoreKnots;
        var y = member.CompositeKnots;
        if (!Past(y[0]) && !Past(y[^1])) return member;
        var cx = new List<double>(x.Count + 1);
        var cy = new List<double>(x.Count + 1);
        var past = new List<bool>(x.Count + 1);
        for (int k = 0; k < x.Count; k++)
        {
            // A knot where the member crosses the end keeps the part inside the reference as it was.
            if (k > 0 && Past(y[k]) != Past(y[k - 1]) && y[k] != y[k - 1])
            {
                double at = x[k - 1] + (x[k] - x[k - 1]) * (_end - y[k - 1]) / (y[k] - y[k - 1]);
                if (at > x[k - 1] && at < x[k]) { cx.Add(at); cy.Add(_end); past.Add(false); }
            }
            cx.Add(x[k]);
            cy.Add(Perturbed(y[k], e));
            past.Add(Past(y[k]));
        }
        double[] sx = [.. cx], sy = [.. cy];
        RestoreOrder(sx, sy, [.. past], _below, member);
        return new DepthMapping(member.CoreId, member.Unit, sx, sy);
    }

    /// <summary>
    /// How far the reference's own column may lie from the consensus: the cores' lines scatter about
    /// it by their sample standard deviation (<paramref name="offsets"/> of the others from the
    /// carrier's line, the carrier's own 0, about their mean <paramref name="mean"/>), and the
    /// reference's column is one more record of the same kind, off the mean of <paramref name="cores"/>
    /// by that standard deviation times sqrt(1 + 1 / cores) (a prediction interval for a new
    /// observation, from memory).
    /// </summary>
    private static double Spread(double[] offsets, double mean, int cores)
    {
        if (cores < 2) return 0;
        double sum = mean * mean;
        foreach (double d in offsets) sum += (d - mean) * (d - mean);
        return Math.Sqrt(sum / (cores - 1) * (1 + 1.0 / cores));
    }

    /// <summary>
    /// The knots <paramref name="past"/> the end (after the part inside when <paramref name="below"/>, else before it;
    /// the part inside is kept) made to rise from the last knot inside by at least a quarter of
    /// <paramref name="member"/>'s overall rate ratio, the least-squares such fit (pool-adjacent-violators,
    /// Ayer et al. 1955, on y less the floor's line). A perturbation that falls faster than the mapping rises
    /// would otherwise be cut flat, centimetres of core laid on one composite depth, deposited in no time; a
    /// quarter is the largest rate jump the checks accept by default (<c>checks.rate_jump_factor</c>).
    /// </summary>
    private static void RestoreOrder(double[] kx, double[] ky, bool[] past, bool below, DepthMapping member)
    {
        int first = Array.IndexOf(past, true), last = Array.LastIndexOf(past, true);
        if (first < 0) return;
        var cx = member.CoreKnots;
        var cy = member.CompositeKnots;
        double floor = cx[^1] > cx[0] ? (cy[^1] - cy[0]) / (cx[^1] - cx[0]) / Model.CheckSettings.DefaultRateJumpFactor : 0;
        int anchor = below ? first - 1 : last + 1;
        int from = below ? Math.Max(anchor, 0) : first, to = below ? last : Math.Min(anchor, kx.Length - 1);
        int n = to - from + 1;
        var v = new double[n];
        var w = new double[n];
        for (int k = 0; k < n; k++)
        {
            v[k] = ky[from + k] - floor * kx[from + k];
            w[k] = 1;
        }
        bool anchored = anchor >= 0 && anchor < kx.Length;
        int a = anchor - from;
        if (anchored) w[a] = 1e12;
        AgeModelling.StratigraphicOrder.Pool([.. Enumerable.Range(0, n)], v, w);
        for (int k = 0; k < n; k++)
            if (!anchored || k != a) ky[from + k] = v[k] + floor * kx[from + k];
        // Adding the floor's line back may round a knot below its neighbour.
        if (below) for (int k = Math.Max(from, 1); k <= to; k++) ky[k] = Math.Max(ky[k], ky[k - 1]);
        else for (int k = Math.Min(to, kx.Length - 2); k >= from; k--) ky[k] = Math.Min(ky[k], ky[k + 1]);
    }

    private static double Normal(Random rng)
    {
        double u1 = 1 - rng.NextDouble(), u2 = rng.NextDouble();
        return Math.Sqrt(-2 * Math.Log(u1)) * Math.Cos(2 * Math.PI * u2);
    }

    /// <summary>
    /// A core's long-run continuation past the reference's end: the least-squares line of its median
    /// over the samples it maps inside the reference (an end point alone would carry the few cm a
    /// path errs by where it leaves the reference into a ratio error times hundreds of cm), joined to
    /// the median at the end (<see cref="XEnd"/>, <see cref="YEnd"/>) by an offset decaying over a
    /// tenth of the shared length, so the continuation starts where the match ends.
    /// </summary>
    private sealed record Line(double XEnd, double YEnd, double Intercept, double Ratio, double Decay, double Weight)
    {
        public double At(double x) => Intercept + Ratio * x + (YEnd - Intercept - Ratio * XEnd) * Math.Exp(-Math.Abs(x - XEnd) / Decay);

        /// <summary>The line of a core whose median reaches past the end and maps at least 10 samples inside the reference; null otherwise.</summary>
        public static Line? Of(PreparedSignals core, DepthMapping median, double refTop, double refBottom, bool below)
        {
            double top = core.DepthAt(0), bottom = core.DepthAt(core.Count - 1);
            double end = below ? refBottom : refTop;
            if (!(below ? median.ToCompositeValue(bottom) > end : median.ToCompositeValue(top) < end)) return null;
            double sx = 0, sy = 0, sxx = 0, sxy = 0;
            int n = 0;
            double x0 = double.PositiveInfinity, x1 = double.NegativeInfinity;
            for (int i = 0; i < core.Count; i++)
            {
                double x = core.DepthAt(i), y = median.ToCompositeValue(x);
                if (y < refTop || y > refBottom) continue;
                (sx, sy, sxx, sxy, n) = (sx + x, sy + y, sxx + x * x, sxy + x * y, n + 1);
                (x0, x1) = (Math.Min(x0, x), Math.Max(x1, x));
            }
            if (n < 10) return null;
            double ratio = (n * sxy - sx * sy) / (n * sxx - sx * sx);
            if (!(ratio > 0)) return null;
            double xEnd = Math.Clamp(median.ToCoreValue(end), top, bottom);
            double shared = Math.Abs(median.ToCompositeValue(x1) - median.ToCompositeValue(x0));
            return new Line(xEnd, median.ToCompositeValue(xEnd), (sy - ratio * sx) / n, ratio, Math.Max(core.Step, 0.1 * (x1 - x0)), shared);
        }
    }
}
