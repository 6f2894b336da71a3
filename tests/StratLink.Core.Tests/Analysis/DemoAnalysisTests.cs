using System.Globalization;
using StratLink.Analysis;
using StratLink.Demo;
using StratLink.Tests.TestSupport;
using StratLink.Workflows;
using Xunit.Abstractions;

namespace StratLink.Tests.Analysis;

/// <summary>
/// Builds the committed demo project once (it equals the seed-1 site, see CommittedDemoTests) and analyses the
/// stacked Ca/Ti record on every age-model member with the command line's long-record settings.
/// </summary>
public sealed class DemoAnalysisFixture
{
    public DemoAnalysisFixture()
    {
        Site = DemoSiteGenerator.Generate(1);
        var loaded = ProjectLoader.Load(Path.Combine(RepoPaths.DemoDirectory, Site.ProjectFileName));
        Build = BuildWorkflow.Run(loaded, null, CancellationToken.None);
        Members = AnalysisWorkflow.Run(Build, DemoAnalysisTests.Signal, useSplice: false, DemoAnalysisTests.Options(), null, CancellationToken.None);
    }

    public DemoSite Site { get; }
    public BuildResult Build { get; }
    public AnalysisResult Members { get; }
}

/// <summary>
/// The demo generator's hidden truth is the outside reference: its climate signal holds cycles of 11 and 88 yr
/// and regime shifts at 1480 (+0.9) and 2710 cal BP (-0.8). Ca/Ti is the proxy checked: in the generator it
/// falls as the climate signal rises (and moves with a slow productivity term), and event layers disturb it
/// least of the three logs. Methods: Lomb-Scargle (Lomb 1976; Scargle 1982) with the AR(1) red-noise levels
/// of Schulz and Mudelsee (2002); regime shifts by the sequential t-test of Rodionov (2004, GRL 31:L09204).
/// </summary>
public sealed class DemoAnalysisTests(DemoAnalysisFixture fixture, ITestOutputHelper output) : IClassFixture<DemoAnalysisFixture>
{
    public const string Signal = "ca_ti";

    /// <summary>The settings of <c>stratlink analyse --periods 11,88</c> with its defaults.</summary>
    public static AnalysisOptions Options() => new()
    {
        Seed = 42,
        PeriodsYears = [11, 88],
        ShiftCutoffYears = RegimeShiftOptions.LongRecordCutoffYears,
        Regimes = new RegimeShiftOptions { Probability = RegimeShiftOptions.LongRecordProbability, HuberParameter = RegimeShiftOptions.LongRecordHuber },
    };

    [Fact]
    public void AnalysisLeavesTheEventLayersOutUnlessTheyAreKept()
    {
        // Stated rule: the stacks and analyses leave the cores' event layers out (composite.keep_events keeps them).
        // The same build with the events kept must analyse more samples, and every composite row it adds must lie
        // within one grid step of an event layer of some core (through that core's median mapping).
        var build = fixture.Build;
        var project = build.Project.Project;
        var keptProject = project with { Composite = project.Composite with { KeepEvents = true } };
        var keptBuild = BuildWorkflow.Run(build.Project.WithProject(keptProject), null, CancellationToken.None);
        var kept = AnalysisWorkflow.Run(keptBuild, Signal, useSplice: false, Options() with { MaxMembers = 10 }, null, CancellationToken.None);
        var left = build.Composite.Record(Signal)!.Mean;
        var all = keptBuild.Composite.Record(Signal)!.Mean;
        var grid = build.Composite.Grid;
        double step = project.Composite.Step;
        var added = Enumerable.Range(0, grid.Count).Where(r => double.IsNaN(left[r]) && !double.IsNaN(all[r])).ToList();
        output.WriteLine($"{fixture.Members.Series.Count} samples analysed with the events left out, {kept.Series.Count} with them kept ({added.Count} rows)");
        Assert.NotEmpty(added);
        Assert.Equal(kept.Series.Count - added.Count, fixture.Members.Series.Count);
        foreach (int r in added)
        {
            double z = grid.ValueAt(r);
            bool near = project.Cores.Any(c => c.Events.Any(e =>
                build.Alignment.Mappings[c.Id].Median.ToCompositeValue(e.Top.In(project.DepthUnit)) - step <= z
                && z <= build.Alignment.Mappings[c.Id].Median.ToCompositeValue(e.Bottom.In(project.DepthUnit)) + step));
            Assert.True(near, $"row {z} cm was left out but lies in no event layer");
        }
    }

    [Fact]
    public void OnTheTrueAgesBothCyclesAndBothShiftsAreFound()
    {
        // The reference core's own Ca/Ti on the generator's true sample ages: the analysis itself must find what
        // the site was made with. Shift ages are those of the first sample of the new regime; a shift is taken as
        // found within half the cut-off length (75 yr) of the true age, with the sign Ca/Ti takes in the generator.
        var site = fixture.Site;
        var truth = site.Truth[site.ReferenceCoreId];
        var input = AnalysisInput.FromAges(Signal, null, truth.AgesBP, site.Tables[site.ReferenceCoreId].Signals[Signal]);
        var r = RecordAnalysis.Run(input, Options());
        Print("true ages", r);
        foreach (var p in r.Periods) Assert.True(p.Above95, $"{p.PeriodYears} yr: {p.PowerOverLevel95:0.00} x the 95 % level");
        foreach (var shift in site.History.RegimeShifts)
        {
            var near = r.Regimes.Shifts.Where(s => Math.Abs(s.AgeBP - shift.AgeBP) <= 0.5 * RegimeShiftOptions.LongRecordCutoffYears
                && Math.Sign(s.MeanAfter - s.MeanBefore) == -Math.Sign(shift.Step)).ToList();
            Assert.True(near.Count > 0, $"no shift near {shift.AgeBP} cal BP");
        }
    }

    [Fact]
    public void AcrossTheAgeModelMembersBothCyclesAreAboveTheNinetyFiveLevelInMostMembers()
    {
        var r = fixture.Members;
        Print("stacked mean, members", r);
        Assert.NotNull(r.Ensemble);
        Assert.Equal(200, r.Ensemble!.Members.Length);
        // The cut-off in years becomes samples with the record's mean spacing.
        Assert.Equal((int)Math.Round(RegimeShiftOptions.LongRecordCutoffYears / r.Series.MeanSpacingYears), r.Options.Regimes.CutoffLength);
        foreach (var p in r.Periods)
        {
            Assert.True(p.Above95, $"{p.PeriodYears} yr on the median ages: {p.PowerOverLevel95:0.00} x the 95 % level");
            Assert.True(p.ShareOfMembersAbove95 > 0.5, $"{p.PeriodYears} yr: above the 95 % level in {p.ShareOfMembersAbove95:P0} of members");
        }
    }

    [Fact]
    public void BothTrueShiftsLieNearTheMemberAgeRangesOfShiftsFound()
    {
        // The 95 % range of a shift's age across the members (2.5-97.5 percentiles of the matched member shifts), for
        // a shift of the right sign found in more than half of the members, must reach within half the regime test's
        // cut-off (75 yr) of the true age. The members' range measures the chronology's uncertainty only; with the
        // demo dated by its varve counts and every other control (95 % ranges of about 20 yr) it is narrower than the
        // precision of the shift's place in the noisy record, which the cut-off sets (Rodionov 2004, GRL 31:L09204).
        double reach = 0.5 * RegimeShiftOptions.LongRecordCutoffYears;
        var r = fixture.Members;
        foreach (var shift in fixture.Site.History.RegimeShifts)
        {
            var holding = r.Ensemble!.Shifts.Where(s => s.AgeLoBP - reach <= shift.AgeBP && shift.AgeBP <= s.AgeHiBP + reach && s.ShareMatched > 0.5
                && Math.Sign(s.Shift.MeanAfter - s.Shift.MeanBefore) == -Math.Sign(shift.Step)).ToList();
            output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"true shift {shift.AgeBP} cal BP ({shift.Step:+0.0;-0.0}): held by {string.Join(", ", holding.Select(s => $"{s.Shift.AgeBP:0} [{s.AgeLoBP:0}-{s.AgeHiBP:0}]"))}"));
            Assert.True(holding.Count > 0, $"no shift's member range holds {shift.AgeBP} cal BP");
        }
    }

    private void Print(string label, AnalysisResult r)
    {
        var inv = CultureInfo.InvariantCulture;
        output.WriteLine(string.Create(inv, $"{label}: {r.Series.Count} samples, mean spacing {r.Series.MeanSpacingYears:0.00} yr, l = {r.Options.Regimes.CutoffLength} samples"));
        foreach (var p in r.Periods)
            output.WriteLine(string.Create(inv, $"  {p.PeriodYears} yr: peak {p.PeakPeriodYears:0.0} yr, {p.PowerOverLevel95:0.00} x the 95 % level, members above: {p.ShareOfMembersAbove95:0.00}"));
        foreach (var s in r.Regimes.Shifts)
        {
            var spread = r.Ensemble?.Shifts.FirstOrDefault(x => x.Shift == s);
            string range = spread is null ? "" : string.Create(inv, $", members {spread.AgeLoBP:0}-{spread.AgeHiBP:0}, matched {spread.ShareMatched:0.00}");
            output.WriteLine(string.Create(inv, $"  shift {s.AgeBP:0} cal BP {s.MeanBefore:0.000} -> {s.MeanAfter:0.000}{range}"));
        }
    }
}
