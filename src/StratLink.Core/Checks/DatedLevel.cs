using StratLink.Model;

namespace StratLink.Checks;

/// <summary>
/// One age control placed at one depth of one core, with its age on a scale that can be compared:
/// calendar years BP, or (for a radiocarbon age whose curve cannot be read) reservoir-corrected 14C years
/// against one curve, comparable only with ages on the same curve.
/// </summary>
internal sealed record DatedLevel(AgeControlSpec Control, string Core, double Depth, string Scale, double Age, double Sigma)
{
    public const string CalendarScale = "cal BP";

    public bool IsCalendar => Scale == CalendarScale;

    /// <summary>"4310 ± 25 cal BP" / "2450 ± 30 14C yr BP (curves/marine.14c)".</summary>
    public string Describe() => IsCalendar
        ? $"{CheckReporter.Number(Age, "0")} ± {CheckReporter.Number(Sigma, "0")} cal BP"
        : $"{CheckReporter.Number(Age, "0")} ± {CheckReporter.Number(Sigma, "0")} 14C yr BP on {Scale[4..]}";

    /// <summary>
    /// Every dated level of the project, excluded controls left out. A calendar age on a marker gives a
    /// level in each core holding the marker; a varve count gives its anchor.
    /// </summary>
    public static List<DatedLevel> Collect(Project p, RadiocarbonDates radiocarbon)
    {
        var levels = new List<DatedLevel>();
        var unit = p.DepthUnit;
        var cores = p.Cores.Select(c => c.Id).ToHashSet(StringComparer.Ordinal);
        foreach (var a in p.Ages.Where(a => !a.Exclude))
        {
            switch (a)
            {
                case CalendarAgeControl { Marker: string mk } c:
                    if (p.FindMarker(mk) is { } marker)
                        foreach (var md in marker.Depths.Where(d => cores.Contains(d.CoreId)))
                            levels.Add(new DatedLevel(c, md.CoreId, md.Depth.In(unit), CalendarScale, c.Age.YearsBP, c.Error));
                    break;
                case CalendarAgeControl { Core: string core, Depth: { } depth } c when cores.Contains(core):
                    levels.Add(new DatedLevel(c, core, depth.In(unit), CalendarScale, c.Age.YearsBP, c.Error));
                    break;
                case RadiocarbonAgeControl rc when cores.Contains(rc.Core):
                    if (radiocarbon.Estimate(rc) is { } cal)
                        levels.Add(new DatedLevel(rc, rc.Core, rc.Depth.In(unit), CalendarScale, cal.YearsBP, cal.Sigma));
                    else
                        levels.Add(new DatedLevel(rc, rc.Core, rc.Depth.In(unit), RadiocarbonScale(rc),
                            rc.C14Age.Years - rc.ReservoirOffset, Math.Sqrt(rc.C14Error * rc.C14Error + rc.ReservoirError * rc.ReservoirError)));
                    break;
                case VarveCountControl v when cores.Contains(v.Core):
                    levels.Add(new DatedLevel(v, v.Core, v.AnchorDepth.In(unit), CalendarScale, v.AnchorAge.YearsBP, v.AnchorError));
                    break;
            }
        }
        return levels;
    }

    /// <summary>Radiocarbon ages compare directly only on the same curve with the same mixing.</summary>
    private static string RadiocarbonScale(RadiocarbonAgeControl rc) =>
        "14C:" + rc.Curve + (rc.MarineFraction is double f ? $" mixed {CheckReporter.Number(f)} with {rc.AtmosphericCurve}" : "");

    /// <summary>True when this level, lying above <paramref name="below"/>, is older than it by more than twice their combined 1 sigma (about 95 %).</summary>
    public bool ReversedAbove(DatedLevel below) =>
        Scale == below.Scale && Age - below.Age > 2 * Math.Sqrt(Sigma * Sigma + below.Sigma * below.Sigma);
}
