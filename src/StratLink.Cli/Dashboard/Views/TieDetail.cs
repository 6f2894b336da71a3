using System.Globalization;
using StratLink.Model;
using StratLink.Quantities;

namespace StratLink.Cli.Dashboard.Views;

/// <summary>
/// What the detail line says about a tie: its depths, its uncertainty and its leave-one-out misfit,
/// the distance between its depth in a core and where the project's other ties put it by straight
/// lines between them (the tie-line mapping without this tie). Needs no run, so it follows every edit.
/// </summary>
public static class TieDetail
{
    /// <summary>
    /// Depth in <paramref name="toCore"/> that the other ties shared by both cores give for
    /// <paramref name="depth"/> in <paramref name="fromCore"/>: linear between the two ties around it
    /// (beyond the outermost, the line through the nearest two), a constant offset when only one other
    /// tie is shared; null when none is.
    /// </summary>
    public static double? LeaveOneOut(Project project, string markerId, string fromCore, double depth, string toCore)
    {
        var u = project.DepthUnit;
        var pairs = project.Markers
            .Where(m => m.Id != markerId)
            .Select(m => (From: m.DepthIn(fromCore), To: m.DepthIn(toCore)))
            .Where(p => p.From is not null && p.To is not null)
            .Select(p => (From: p.From!.Value.In(u), To: p.To!.Value.In(u)))
            .OrderBy(p => p.From)
            .ToList();
        if (pairs.Count == 0) return null;
        if (pairs.Count == 1) return depth + pairs[0].To - pairs[0].From;
        int hi = pairs.FindIndex(p => p.From >= depth);
        if (hi <= 0) hi = hi < 0 ? pairs.Count - 1 : 1;
        var (a, b) = (pairs[hi - 1], pairs[hi]);
        double dx = b.From - a.From;
        return dx > 0 ? a.To + (depth - a.From) * (b.To - a.To) / dx : a.To + depth - a.From;
    }

    /// <summary>
    /// "ash-1 tephra ±0.3 cm: A 73.4, B 80.6 | left out: B +1.2 cm (4.0 ±) from A": the misfit is given for
    /// <paramref name="focusCore"/> (the partner log) when it holds the tie, else for the core where it is largest.
    /// Shorter forms, for a line a narrow terminal would cut before the misfit (<paramref name="shortening"/> 1 and 2):
    /// "ash-1 tephra ±0.3 cm: A 73.4, B 80.6 (+1) | left out +1.2 cm (4.0 ±)", the anchor's and that core's depths and how
    /// many others the tie has; then "ash-1 ±0.3 cm: B 80.6 (+2) | left out +1.2 cm (4.0 ±)".
    /// </summary>
    public static string Line(Project project, MarkerSpec marker, string? anchorCore, string? focusCore, int shortening = 0)
    {
        var u = project.DepthUnit;
        string unit = u.Symbol();
        string Depths(IReadOnlyCollection<MarkerDepth> listed) => string.Join(", ", listed.Select(d => $"{d.CoreId} {N(d.Depth.In(u))}"))
            + (listed.Count < marker.Depths.Count ? $"{(listed.Count > 0 ? " " : "")}(+{marker.Depths.Count - listed.Count})" : "");
        string full = $"{marker.Id} {marker.Kind.Name()} ±{N(marker.Uncertainty)} {unit}: {Depths(marker.Depths)}";
        var anchor = marker.Depths.FirstOrDefault(d => d.CoreId == anchorCore) ?? marker.Depths.FirstOrDefault();
        if (anchor is null || marker.Depths.Count < 2) return full;
        var misfits = marker.Depths.Where(d => d.CoreId != anchor.CoreId)
            .Select(d => (d.CoreId, Misfit: LeaveOneOut(project, marker.Id, anchor.CoreId, anchor.Depth.In(u), d.CoreId) is double p ? d.Depth.In(u) - p : (double?)null))
            .Where(x => x.Misfit is not null)
            .ToList();
        if (misfits.Count == 0) return full + " | left out: no other shared tie";
        var pick = misfits.FirstOrDefault(x => x.CoreId == focusCore);
        if (pick.CoreId is null) pick = misfits.MaxBy(x => Math.Abs(x.Misfit!.Value));
        double mis = pick.Misfit!.Value;
        string sigmas = marker.Uncertainty > 0 ? $" ({N(Math.Abs(mis) / marker.Uncertainty)}×±)" : "";
        string shift = $"{(mis >= 0 ? "+" : "")}{N(mis)} {unit}{sigmas}";
        return shortening switch
        {
            0 => full + $" | left out: {pick.CoreId} {shift} from {anchor.CoreId}",
            1 => $"{marker.Id} {marker.Kind.Name()} ±{N(marker.Uncertainty)} {unit}: {Depths([anchor, .. marker.Depths.Where(d => d.CoreId == pick.CoreId)])} | left out {shift}",
            _ => $"{marker.Id} ±{N(marker.Uncertainty)} {unit}: {Depths([.. marker.Depths.Where(d => d.CoreId == pick.CoreId)])} | left out {shift}",
        };
    }

    private static string N(double v) => v.ToString("0.##", CultureInfo.InvariantCulture);
}
