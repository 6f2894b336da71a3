namespace StratLink.Alignment;

/// <summary>
/// How finely a sampled lattice path places a match, and each ensemble member read accordingly. The
/// path puts a core row in one reference cell, and a cell stands for the grid step around its
/// centre; where a record was measured more coarsely than the grid, the grid only interpolates
/// between its samples, so the match is placed no more finely than their spacing. Within that
/// resolution r the position is not resolved: it carries a quantisation error uniform on +/- r / 2
/// (variance r^2 / 12; Sheppard 1898; Widrow and Kollar 2008, Quantization Noise, from memory).
/// Each member is shifted by its own draw u r (u uniform on +/- 1/2, one u per member, r where each
/// knot lies), so a band the paths agree on to one cell is still one resolution wide. A tie fixes
/// its own match: the shift fades to none over one resolution either side of each tie's core depth,
/// so every member still passes through an exact tie and stays in an uncertain tie's box.
/// </summary>
internal sealed class MatchResolution
{
    private readonly PreparedSignals _core;
    private readonly PreparedSignals _reference;
    private readonly double[] _ties;
    private readonly double[]? _coreSpacing;
    private readonly double[]? _referenceSpacing;
    private readonly double[] _coreChanges;
    private readonly double[] _referenceChanges;

    /// <param name="core">The core's prepared signals.</param>
    /// <param name="reference">The reference's, before any padding beyond its ends (its sample spacing).</param>
    /// <param name="tieCoreDepths">Core depths of the ties the path was held to.</param>
    public MatchResolution(PreparedSignals core, PreparedSignals reference, IEnumerable<double> tieCoreDepths)
    {
        _core = core;
        _reference = reference;
        _ties = [.. tieCoreDepths.Order()];
        _coreSpacing = Widened(core);
        _referenceSpacing = Widened(reference);
        _coreChanges = Changes(core, _coreSpacing);
        _referenceChanges = Changes(reference, _referenceSpacing);
    }

    /// <summary>
    /// The record's sample spacing per row, raised near coarser rows so it falls by at most one step
    /// a row: a shift of at most half of it then changes by at most half a step a row, which keeps
    /// every member monotone.
    /// </summary>
    private static double[]? Widened(PreparedSignals p)
    {
        if (p.SampleSpacing is null) return null;
        var s = (double[])p.SampleSpacing.Clone();
        for (int r = 1; r < s.Length; r++) s[r] = Math.Max(s[r], s[r - 1] - p.Step);
        for (int r = s.Length - 2; r >= 0; r--) s[r] = Math.Max(s[r], s[r + 1] - p.Step);
        return s;
    }

    /// <summary>Depths of the rows where the spacing changes (none on a regularly sampled record).</summary>
    private static double[] Changes(PreparedSignals p, double[]? spacing)
    {
        var changes = new List<double>();
        if (spacing is not null)
            for (int r = 1; r < spacing.Length; r++)
                if (spacing[r] != spacing[r - 1]) changes.AddRange([p.DepthAt(r - 1), p.DepthAt(r)]);
        return [.. changes.Distinct()];
    }

    /// <summary>Resolution in composite depth at a core depth mapped to a composite depth at a rate ratio.</summary>
    public double At(double coreDepth, double compositeDepth, double rateRatio) =>
        Math.Max(_reference.Step, Math.Max(Spacing(_core, _coreSpacing, coreDepth) * rateRatio, Spacing(_reference, _referenceSpacing, compositeDepth)));

    private static double Spacing(PreparedSignals p, double[]? spacing, double depth)
    {
        int row = p.RowNearest(depth);
        return spacing is not null && row >= 0 && row < p.Count ? spacing[row] : p.Step;
    }

    /// <summary>The member shifted by its draw within the resolution (kept monotone where the resolution changes fast).</summary>
    public DepthMapping Spread(DepthMapping member, Random rng)
    {
        double u = rng.NextDouble() - 0.5;
        var kx = member.CoreKnots;
        var ky = member.CompositeKnots;
        // Knots where the resolution changes, and where the fade around a tie starts, ends and
        // bottoms out, so the shift is exact there (a member's own knots are only where its rate changes).
        var extra = new List<double>(_coreChanges);
        double top = ky[0], bottom = ky[^1];
        foreach (double c in _referenceChanges)
            if (c > top && c < bottom) extra.Add(member.ToCoreValue(c));
        foreach (double t in _ties)
        {
            double ratio = Math.Max(1e-9, member.RateRatioAt(t));
            double reach = At(t, member.ToCompositeValue(t), ratio) / ratio;
            extra.AddRange([t - reach, t, t + reach]);
        }
        extra.Sort();
        // Without extra knots the member's own core knots are kept (a mapping's knots are never changed).
        bool own = extra.Count == 0 && kx is double[];
        var x = own ? (double[])kx : new double[kx.Count + extra.Count];
        var y = new double[x.Length];
        int count = 0, e = 0, tie = 0;
        for (int k = 0; k < kx.Count; k++)
        {
            // The segment from knot k to k + 1 (the last knot takes the one before it) gives the rate ratio.
            int s = k < kx.Count - 1 ? k : Math.Max(0, k - 1);
            double dx = s + 1 < kx.Count ? kx[s + 1] - kx[s] : 0, ratio = dx > 0 ? (ky[s + 1] - ky[s]) / dx : 1;
            Add(kx[k], ky[k], ratio);
            if (k == kx.Count - 1) break;
            while (e < extra.Count && extra[e] <= kx[k]) e++;
            for (; e < extra.Count && extra[e] < kx[k + 1]; e++)
                if (extra[e] > x[count - 1]) Add(extra[e], ky[k] + ratio * (extra[e] - kx[k]), ratio);
        }
        if (count < x.Length)
        {
            Array.Resize(ref x, count);
            Array.Resize(ref y, count);
        }
        return new DepthMapping(member.CoreId, member.Unit, x, y);

        void Add(double z, double c, double ratio)
        {
            double r = At(z, c, ratio), fade = 1;
            if (_ties.Length > 0)
            {
                while (tie + 1 < _ties.Length && Math.Abs(_ties[tie + 1] - z) <= Math.Abs(_ties[tie] - z)) tie++;
                fade = Math.Min(1, Math.Abs(z - _ties[tie]) * ratio / r);
            }
            double v = c + u * r * fade;
            if (count > 0 && v < y[count - 1]) v = y[count - 1];
            x[count] = z;
            y[count++] = v;
        }
    }
}
