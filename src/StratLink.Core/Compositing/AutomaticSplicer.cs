using StratLink.Checks;
using StratLink.Quantities;

namespace StratLink.Compositing;

/// <summary>
/// Chooses the splice by dynamic programming over the composite grid: at each row one core (or none
/// where no core has usable data). A core may only be taken where its median mapping lands inside its
/// recovered interval and outside its gaps and disturbed intervals. The cost prefers the reference
/// core, few switches, and switches where both cores have usable data on both sides of the tie and
/// their alignment ensembles are narrow (tight mappings), following the practice of placing splice
/// tie points where holes correlate best (methods.md section 5, IODP CCSF-D).
/// </summary>
internal static class AutomaticSplicer
{
    /// <summary>Cost of one switch between cores (the unit of cost).</summary>
    private const double SwitchCost = 1.0;

    /// <summary>A stretch of this many rows on the reference pays for switching back to it (our choice).</summary>
    private const double ReturnRows = 20;

    /// <summary>Cost per row spent off the reference core.</summary>
    private const double OffReferenceCost = SwitchCost / ReturnRows;

    /// <summary>Cost per grid step of summed ensemble band width at a tie: a tie whose bands add to ten steps costs a second switch.</summary>
    private const double BandCostPerStep = 0.1;

    /// <summary>A join where the two cores do not overlap (one ends where the other starts) is allowed only when nothing else is.</summary>
    private const double UnsupportedJoinCost = 1000.0;

    /// <param name="cores">The cores, reference first.</param>
    public static Splice Choose(CompositeGrid grid, IReadOnlyList<CompositeCore> cores, IReadOnlyList<CoreMappingTable> mappings, FindingList findings, CancellationToken ct)
    {
        int rows = grid.Count, nc = cores.Count, none = nc, states = nc + 1;
        var good = new bool[nc][];
        var band = new double[nc][];
        var coreDepth = new double[nc][];
        for (int c = 0; c < nc; c++)
        {
            coreDepth[c] = new double[rows];
            MappingTables.CoreDepthsAscending(cores[c].Ensemble.Median, grid.Values, coreDepth[c]);
            good[c] = new bool[rows];
            var cursor = cores[c].Unusable.Start();
            for (int r = 0; r < rows; r++)
            {
                double d = coreDepth[c][r];
                bool inside = d >= cores[c].RecoveredTop && d <= cores[c].RecoveredBottom;
                good[c][r] = !cursor.IsUnusable(d) && inside;
            }
            band[c] = new double[rows];
            MappingTables.BandWidthAscending(mappings[c], coreDepth[c], band[c]);
        }
        ct.ThrowIfCancellationRequested();

        var cost = new double[states];
        var next = new double[states];
        var back = new short[rows * states];
        for (int s = 0; s < states; s++) cost[s] = RowCost(s, 0, good, none);
        for (int r = 1; r < rows; r++)
        {
            for (int b = 0; b < states; b++)
            {
                double rowCost = RowCost(b, r, good, none);
                double best = double.PositiveInfinity;
                int arg = b;
                for (int a = 0; a < states; a++)
                {
                    if (double.IsPositiveInfinity(cost[a])) continue;
                    double t = cost[a] + Transition(a, b, r, good, band, grid.Step, none);
                    // Strictly smaller: ties keep the lowest index, i.e. the reference first.
                    if (t < best) { best = t; arg = a; }
                }
                next[b] = best + rowCost;
                back[r * states + b] = (short)arg;
            }
            (cost, next) = (next, cost);
        }

        int state = 0;
        for (int s = 1; s < states; s++) if (cost[s] < cost[state]) state = s;
        var path = new int[rows];
        for (int r = rows - 1; r >= 0; r--)
        {
            path[r] = state;
            state = back[r * states + state];
        }
        return Pieces(grid, cores, path, good, coreDepth, findings);
    }

    private static double RowCost(int s, int r, bool[][] good, int none)
    {
        if (s == none)
        {
            for (int c = 0; c < good.Length; c++) if (good[c][r]) return double.PositiveInfinity;
            return 0;
        }
        if (!good[s][r]) return double.PositiveInfinity;
        return s == 0 ? 0 : OffReferenceCost;
    }

    private static double Transition(int a, int b, int r, bool[][] good, double[][] band, double step, int none)
    {
        if (a == b || a == none || b == none) return 0;
        double tightness = BandCostPerStep * (band[a][r] + band[b][r]) / step;
        if (double.IsNaN(tightness)) tightness = 0;
        bool overlap = good[a][r - 1] && good[a][r] && good[b][r - 1] && good[b][r];
        return SwitchCost + tightness + (overlap ? 0 : UnsupportedJoinCost);
    }

    private static Splice Pieces(CompositeGrid grid, IReadOnlyList<CompositeCore> cores, int[] path, bool[][] good, double[][] coreDepth, FindingList findings)
    {
        int rows = grid.Count, none = cores.Count;
        var unit = grid.Unit;
        var pieces = new List<SplicePiece>();
        var source = new string?[rows];
        int start = 0;
        for (int r = 1; r <= rows; r++)
        {
            if (r < rows && path[r] == path[start]) continue;
            int s = path[start];
            int end = r - 1;
            // Rows above or below every core's usable data are the composite's ends, not holes.
            if (s == none && start > 0 && r < rows)
            {
                findings.Add(new Finding
                {
                    Severity = Severity.Warning,
                    Code = "splice.hole",
                    Message = $"No core has usable data from {Fmt(grid.ValueAt(start))} to {Fmt(grid.ValueAt(end))} {unit.Symbol()} composite depth (gaps, disturbed intervals or beyond every core): the splice has a hole there.",
                    Depth = grid.ValueAt(start),
                });
            }
            else if (s != none)
            {
                // The piece runs to the tie where the next core takes over when this core still has data there.
                int to = r < rows && good[s][r] ? r : end;
                var core = cores[s];
                pieces.Add(new SplicePiece(core.Id, grid.DepthAt(start), grid.DepthAt(to),
                    CoreDepth.From(coreDepth[s][start], unit), CoreDepth.From(coreDepth[s][to], unit)));
                for (int k = start; k <= end; k++) source[k] = core.Id;
            }
            start = r;
        }
        return new Splice(automatic: true, pieces, source);
    }

    private static string Fmt(double v) => v.ToString("0.###", System.Globalization.CultureInfo.InvariantCulture);
}
