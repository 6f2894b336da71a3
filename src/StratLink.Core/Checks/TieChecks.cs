using StratLink.Model;

namespace StratLink.Checks;

/// <summary>Checks of the marker ties that need only the project.</summary>
internal static class TieChecks
{
    public static void Run(CheckReporter r)
    {
        var known = r.Project.Cores.Select(c => c.Id).ToHashSet(StringComparer.Ordinal);
        Placement(r);
        Crossings(r, known);
        SameDepth(r);
        RateJumps(r);
    }

    /// <summary>
    /// Marker depths inside a gap or a disturbed interval (interiors only: a layer at a section break is
    /// fine). Depths outside a core's samples are the project loader's finding (project.depth-outside-core).
    /// </summary>
    private static void Placement(CheckReporter r)
    {
        foreach (var m in r.Project.Markers)
        {
            foreach (var md in m.Depths)
            {
                var core = r.Project.FindCore(md.CoreId);
                if (core is null) continue;
                double d = md.Depth.In(r.Unit);
                string src = CheckReporter.MarkerSource(m.Id, core.Id);
                foreach (var g in core.Gaps.Where(g => Interior(g, d, r)))
                    r.Add(Severity.Error, CheckCodes.TieInGap,
                        $"Marker {m.Id} is given at {r.Depth(d)} in core {core.Id}, inside the gap {g} where nothing was recovered; check the depth.",
                        core.Id, m.Id, d, src);
                foreach (var x in core.Disturbed.Where(x => Interior(x, d, r)))
                    r.Add(Severity.Warning, CheckCodes.TieInDisturbed,
                        $"Marker {m.Id} is given at {r.Depth(d)} in core {core.Id}, inside the disturbed interval {x}; a layer seen in disturbed sediment may have moved.",
                        core.Id, m.Id, d, src);
            }
        }
    }

    private static bool Interior(Quantities.DepthInterval iv, double d, CheckReporter r) => d > iv.Top.In(r.Unit) && d < iv.Bottom.In(r.Unit);

    /// <summary>
    /// Marker pairs whose order differs between cores, each order decided only where the depths differ
    /// by more than the two uncertainties. The order most cores show is taken as right (on a draw, the
    /// reference core's, else the first core's); each core showing the other order is reported.
    /// </summary>
    private static void Crossings(CheckReporter r, HashSet<string> known)
    {
        var markers = r.Project.Markers;
        string reference = r.Project.ReferenceCoreId;
        for (int i = 0; i < markers.Count; i++)
        {
            for (int j = i + 1; j < markers.Count; j++)
            {
                var x = markers[i];
                var y = markers[j];
                double tol = x.Uncertainty + y.Uncertainty;
                var order = new List<(string Core, int Sign, double Dx, double Dy)>();
                foreach (var dx in x.Depths)
                {
                    if (!known.Contains(dx.CoreId) || y.DepthIn(dx.CoreId) is not { } dyDepth) continue;
                    double a = dx.Depth.In(r.Unit), b = dyDepth.In(r.Unit);
                    if (Math.Abs(b - a) > tol) order.Add((dx.CoreId, Math.Sign(b - a), a, b));
                }
                int above = order.Count(o => o.Sign > 0), below = order.Count - above;
                if (above == 0 || below == 0) continue;
                int right = above != below ? (above > below ? 1 : -1)
                    : order.FirstOrDefault(o => o.Core == reference) is { Core: not null } refOrder ? refOrder.Sign : order[0].Sign;
                string agreeing = string.Join(", ", order.Where(o => o.Sign == right).Select(o => o.Core));
                foreach (var o in order.Where(o => o.Sign != right))
                {
                    string here = o.Sign > 0 ? "above" : "below";
                    string there = o.Sign > 0 ? "below" : "above";
                    r.Add(Severity.Error, CheckCodes.TieCrossing,
                        $"Marker {x.Id} ({r.Depth(o.Dx)}) lies {here} marker {y.Id} ({r.Depth(o.Dy)}) in core {o.Core} but {there} it in {agreeing}: ties cannot cross, since a layer cannot be older than another in one core and younger in the next. Check the depths or the identification of {x.Id} or {y.Id}.",
                        o.Core, $"{x.Id}/{y.Id}", o.Dx, CheckReporter.MarkerSource(x.Id, o.Core));
                }
            }
        }
    }

    /// <summary>Two markers of one core closer than the sum of their uncertainties (at the same depth, when both are exact).</summary>
    private static void SameDepth(CheckReporter r)
    {
        foreach (string core in r.Project.Cores.Select(c => c.Id))
        {
            var here = r.Project.Markers
                .Select(m => (Marker: m, Depth: m.DepthIn(core)))
                .Where(t => t.Depth is not null)
                .Select(t => (t.Marker, Depth: t.Depth!.Value.In(r.Unit)))
                .OrderBy(t => t.Depth).ToList();
            for (int i = 0; i < here.Count; i++)
            {
                for (int j = i + 1; j < here.Count; j++)
                {
                    var (a, da) = here[i];
                    var (b, db) = here[j];
                    double tol = a.Uncertainty + b.Uncertainty;
                    if (db - da > tol) continue;
                    r.Add(Severity.Warning, CheckCodes.TieSameDepth,
                        $"Markers {a.Id} ({r.Depth(da)}) and {b.Id} ({r.Depth(db)}) of core {core} are at the same depth within their uncertainties (±{CheckReporter.Number(a.Uncertainty)} and ±{CheckReporter.Number(b.Uncertainty)}); two layers cannot share one depth: one of them may be misidentified, or they are the same layer.",
                        core, $"{a.Id}/{b.Id}", da, CheckReporter.MarkerSource(b.Id, core));
                }
            }
        }
    }

    /// <summary>
    /// Each core against the reference core: the ratio of tie spacings (reference over core) is the
    /// accumulation-rate ratio the ties imply; a jump between consecutive segments by more than
    /// <see cref="CheckSettings.RateJumpFactor"/> points at a misplaced middle tie. Segments shorter than
    /// the two ties' uncertainties in either core give no usable ratio and break the chain.
    /// </summary>
    private static void RateJumps(CheckReporter r)
    {
        string reference = r.Project.ReferenceCoreId;
        double factor = r.Project.Checks.RateJumpFactor;
        foreach (string core in r.Project.Cores.Select(c => c.Id).Where(c => c != reference))
        {
            var ties = r.Project.Markers
                .Where(m => m.DepthIn(core) is not null && m.DepthIn(reference) is not null)
                .Select(m => (Marker: m, Core: m.DepthIn(core)!.Value.In(r.Unit), Ref: m.DepthIn(reference)!.Value.In(r.Unit)))
                .OrderBy(t => t.Core).ToList();
            double? previous = null;
            for (int k = 0; k + 1 < ties.Count; k++)
            {
                var (a, b) = (ties[k], ties[k + 1]);
                double tol = a.Marker.Uncertainty + b.Marker.Uncertainty;
                double dCore = b.Core - a.Core, dRef = b.Ref - a.Ref;
                if (dCore <= tol || dRef <= tol || dCore <= 0 || dRef <= 0)
                {
                    previous = null;
                    continue;
                }
                double ratio = dRef / dCore;
                if (previous is double prev)
                {
                    double jump = Math.Max(ratio / prev, prev / ratio);
                    if (jump > factor)
                    {
                        var before = ties[k - 1];
                        r.Add(Severity.Warning, CheckCodes.TieRateJump,
                            $"Between markers {before.Marker.Id}, {a.Marker.Id} and {b.Marker.Id} the accumulation rate of {reference} relative to {core} changes from {CheckReporter.Number(prev, "0.###")} to {CheckReporter.Number(ratio, "0.###")}, a factor of {CheckReporter.Number(jump, "0.#")}, more than the {CheckReporter.Number(factor)} set by checks.rate_jump_factor (4 is common practice). Check the depth of {a.Marker.Id} in {core} and {reference}.",
                            core, a.Marker.Id, a.Core, CheckReporter.MarkerSource(a.Marker.Id, core));
                    }
                }
                previous = ratio;
            }
        }
    }
}
