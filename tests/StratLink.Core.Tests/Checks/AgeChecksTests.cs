using StratLink.AgeModelling;
using StratLink.Alignment;
using StratLink.Checks;
using StratLink.Model;
using StratLink.Quantities;
using StratLink.Tests.TestSupport;
using static StratLink.Tests.Checks.CheckFixtures;

namespace StratLink.Tests.Checks;

public sealed class AgeChecksTests : IDisposable
{
    private readonly List<string> _written = [];

    public void Dispose()
    {
        foreach (string f in _written) File.Delete(f);
    }

    private static string IntCal20 => Path.Combine(RepoPaths.SharedData, "calibration-curves", "intcal20.14c");

    [Fact]
    public void ReversedControlsInOneCoreAreAnError()
    {
        // 1000 +- 20 above 800 +- 20: 200 yr older above, twice the combined sigma is 57 yr.
        var p = Project(["A"], ages: [Calendar("top", "A", 10, 1000, 20), Calendar("low", "A", 20, 800, 20)]);
        var f = Assert.Single(Run(Load(p)), f => f.Code == CheckCodes.AgeReversal);
        Assert.Equal(("A", "top/low", 10.0, Severity.Error), (f.Core, f.Item, f.Depth, f.Severity));
    }

    [Fact]
    public void ReversalWithinTheErrorsIsAccepted()
    {
        // 100 yr apart with sigma 100 each: 2 x 141 = 283 yr allowed.
        var p = Project(["A"], ages: [Calendar("top", "A", 10, 1000, 100), Calendar("low", "A", 20, 900, 100)]);
        Assert.DoesNotContain(Run(Load(p)), f => f.Code == CheckCodes.AgeReversal);
    }

    [Fact]
    public void ExcludedControlsAreLeftOut()
    {
        var p = Project(["A"], ages: [Calendar("top", "A", 10, 1000, 20), Calendar("low", "A", 20, 800, 20) with { Exclude = true }]);
        Assert.DoesNotContain(Run(Load(p)), f => f.Code == CheckCodes.AgeReversal);
    }

    [Fact]
    public void UncalibratedRadiocarbonAgesCompareOnlyOnTheSameCurve()
    {
        var p = Project(["A"], ages: [
            Radiocarbon("r1", "A", 10, 3000, 30, "curves/lake.14c"),
            Radiocarbon("r2", "A", 20, 2500, 30, "curves/lake.14c"),
            Radiocarbon("r3", "A", 30, 1000, 30, "curves/marine.14c"),
        ]);
        var reversals = Run(Load(p)).Where(f => f.Code == CheckCodes.AgeReversal).ToList();
        Assert.Equal(["r1/r2"], reversals.Select(f => f.Item));
    }

    [Fact]
    public void CalibratedRadiocarbonAgesCompareWithCalendarAges()
    {
        // 3000 +- 30 14C yr BP on IntCal20 is about 3200 cal BP, far older than the 1500 +- 10 cal BP ash below it.
        var p = Project(["A"], ages: [Radiocarbon("r1", "A", 10, 3000, 30, IntCal20), Calendar("ash", "A", 20, 1500, 10)]);
        Assert.Contains(Run(Load(p)), f => f.Code == CheckCodes.AgeReversal && f.Item == "r1/ash");
        var ordered = Project(["A"], ages: [Radiocarbon("r1", "A", 10, 3000, 30, IntCal20), Calendar("ash", "A", 20, 3500, 10)]);
        Assert.DoesNotContain(Run(Load(ordered)), f => f.Code == CheckCodes.AgeReversal);
    }

    [Fact]
    public void ReversalAcrossCoresOnTheCompositeScaleIsAWarning()
    {
        // B maps onto A's scale by +20 cm: B at 40 cm is composite 60 cm, below A's level at 10 cm.
        var alignment = new AlignmentResult("A", "test", new Dictionary<string, MappingEnsemble>
        {
            ["A"] = new(DepthMapping.Identity("A", Unit, 0, 100), []),
            ["B"] = new(new DepthMapping("B", Unit, [0, 100], [20, 120]), []),
        });
        var reversed = Project(["A", "B"], ages: [Calendar("a-ash", "A", 10, 500, 10), Calendar("b-ash", "B", 40, 300, 10)]);
        var f = Assert.Single(Run(Load(reversed), alignment: alignment), f => f.Code == CheckCodes.AgeReversalAcrossCores);
        Assert.Equal(("A", "a-ash/b-ash", 10.0, Severity.Warning), (f.Core, f.Item, f.Depth, f.Severity));
        Assert.Contains("composite depth 10 cm", f.Message);

        var ordered = Project(["A", "B"], ages: [Calendar("a-ash", "A", 10, 500, 10), Calendar("b-ash", "B", 40, 600, 10)]);
        Assert.DoesNotContain(Run(Load(ordered), alignment: alignment), f => f.Code == CheckCodes.AgeReversalAcrossCores);
        // Without an alignment the cores cannot be compared.
        Assert.DoesNotContain(Run(Load(reversed)), f => f.Code == CheckCodes.AgeReversalAcrossCores);
    }

    [Fact]
    public void OrderInDoubtOnTheCompositeScaleIsNotReported()
    {
        // The ensemble spreads B's composite depths by +-15 cm, so B at 40 cm (composite 45-75) may lie above A's 50 cm level.
        var p = Project(["A", "B"], ages: [Calendar("a", "A", 50, 2000, 10), Calendar("b", "B", 40, 300, 10)]);
        var members = new[] { -15.0, 0, 15 }.Select(s => new DepthMapping("B", Unit, [0, 100], [20 + s, 120 + s])).ToList();
        var alignment = new AlignmentResult("A", "test", new Dictionary<string, MappingEnsemble>
        {
            ["A"] = new(DepthMapping.Identity("A", Unit, 0, 100), []),
            ["B"] = new(new DepthMapping("B", Unit, [0, 100], [20, 120]), members),
        });
        Assert.DoesNotContain(Run(Load(p), alignment: alignment), f => f.Code == CheckCodes.AgeReversalAcrossCores);
    }

    [Fact]
    public void RadiocarbonAgeOutsideItsCurveIsAnError()
    {
        // IntCal20 (Reimer et al. 2020) spans 95 to about 50,100 14C yr BP: 60,000 +- 2000 is beyond it, and a
        // post-bomb age (negative 14C age) before it; 2450 lies inside.
        var p = Project(["A"], ages: [
            Radiocarbon("old", "A", 90, 60000, 2000, IntCal20),
            Radiocarbon("modern", "A", 1, -500, 20, IntCal20),
            Radiocarbon("fine", "A", 50, 2450, 30, IntCal20),
        ]);
        var outside = Run(Load(p)).Where(f => f.Code == CheckCodes.RadiocarbonOutsideCurve).ToList();
        Assert.Equal(["modern", "old"], outside.Select(f => f.Item).Order());
        Assert.All(outside, f => Assert.Equal(Severity.Error, f.Severity));
    }

    [Fact]
    public void ReservoirOffsetIsTakenOffBeforeTheRangeCheck()
    {
        // 300 14C yr less a 300 yr offset is 0, younger than any IntCal20 age (the youngest is 95, at 49 cal BP).
        var p = Project(["A"], ages: [Radiocarbon("r", "A", 5, 300, 20, IntCal20) with { ReservoirOffset = 300 }]);
        Assert.Contains(Run(Load(p)), f => f.Code == CheckCodes.RadiocarbonOutsideCurve && f.Message.Contains("after the reservoir offset"));
        Assert.DoesNotContain(Run(Load(Project(["A"], ages: [Radiocarbon("r", "A", 5, 300, 20, IntCal20)]))), f => f.Code == CheckCodes.RadiocarbonOutsideCurve);
    }

    [Fact]
    public void AgeAtTheEndOfTheCurveIsAWarning()
    {
        // 50,000 +- 1000 against IntCal20's oldest 50,100 14C yr (55,000 cal BP): the distribution is cut there.
        var p = Project(["A"], ages: [Radiocarbon("r", "A", 5, 50000, 1000, IntCal20)]);
        var f = Assert.Single(Run(Load(p)), f => f.Code == CheckCodes.RadiocarbonAtCurveEnd);
        Assert.Equal(Severity.Warning, f.Severity);
    }

    [Fact]
    public void UnreadableCurveIsAWarning()
    {
        string curve = WriteBesideProject("broken.14c", "# only a header\nCAL BP, 14C age\n");
        var p = Project(["A"], ages: [Radiocarbon("r", "A", 5, 3000, 20, curve)]);
        Assert.Contains(Run(Load(p)), f => f.Code == CheckCodes.CurveUnreadable && f.Severity == Severity.Warning);
    }

    [Fact]
    public void VarveCountDisagreeingWithAnIndependentAgeIsReported()
    {
        // 800 varves of 1 mm from 0 to 80 cm, anchored at the top at -68 cal BP with a 2 % counting error:
        // at 50 cm the count gives 432 cal BP, sigma = 0.02 x 500 = 10 yr (systematic error, common practice).
        string table = WriteBesideProject("A-varves.csv", "depth_top,depth_bottom\n"
            + string.Concat(Enumerable.Range(0, 800).Select(k => $"{k * 0.1:0.0},{(k + 1) * 0.1:0.0}\n")));
        var varves = new VarveCountControl
        {
            Id = "count", Core = "A", Table = table, AnchorDepth = D(0), AnchorAge = CalendarAge.FromYearsBP(-68), CountError = 0.02,
        };
        // An ash dated 600 +- 20 is 168 yr off (limit 2 x 22 = 45); one at 90 cm lies below the count.
        var p = Project(["A"], ages: [varves, Calendar("ash", "A", 50, 600, 20), Calendar("deep", "A", 90, 5000, 20)]);
        var f = Assert.Single(Run(Load(p)), f => f.Code == CheckCodes.VarveDisagrees);
        Assert.Equal(("A", "count/ash", 50.0, Severity.Warning), (f.Core, f.Item, f.Depth, f.Severity));
        Assert.Contains("432 ± 10 cal BP", f.Message);

        var agreeing = Project(["A"], ages: [varves, Calendar("ash", "A", 50, 440, 20)]);
        Assert.DoesNotContain(Run(Load(agreeing)), f => f.Code == CheckCodes.VarveDisagrees);
    }

    [Fact]
    public void UnreadableVarveTableIsNotedAsACheckNotRun()
    {
        string table = WriteBesideProject("bad-varves.csv", "depth_top,depth_bottom\n1,0.5\n");
        var varves = new VarveCountControl { Id = "count", Core = "A", Table = table, AnchorDepth = D(0), AnchorAge = CalendarAge.FromYearsBP(-68) };
        var f = Assert.Single(Run(Load(Project(["A"], ages: [varves, Calendar("ash", "A", 50, 600, 20)]))), f => f.Code == CheckCodes.CheckNotRun);
        Assert.Equal(("count", Severity.Note), (f.Item, f.Severity));
    }

    [Fact]
    public void CalendarAgeOnAMarkerNoCoreHoldsIsAnError()
    {
        var p = Project(["A", "B"], [Marker("ash", 0)], [new CalendarAgeControl { Id = "ash-age", Marker = "ash", Age = CalendarAge.FromYearsBP(4310), Error = 25 }]);
        var f = Assert.Single(Run(Load(p)), f => f.Code == CheckCodes.AgeMarkerUnplaced);
        Assert.Equal(("ash-age", Severity.Error), (f.Item, f.Severity));
    }

    [Fact]
    public void DatedCoreWithoutAMarkerThatCarriesAnAgeIsNoted()
    {
        // ash is in A and B; C has its own radiocarbon date but no ash depth; D has no ages at all.
        var p = Project(["A", "B", "C", "D"], [Marker("ash", 0.5, ("A", 40), ("B", 35))], [
            new CalendarAgeControl { Id = "ash-age", Marker = "ash", Age = CalendarAge.FromYearsBP(4310), Error = 25 },
            Radiocarbon("c-date", "C", 30, 3000, 30, "curves/lake.14c"),
        ]);
        var f = Assert.Single(Run(Load(p)), f => f.Code == CheckCodes.AgeMarkerAbsent);
        Assert.Equal(("C", "ash-age", Severity.Note), (f.Core, f.Item, f.Severity));
    }

    [Fact]
    public void A_marker_below_a_short_cores_base_is_not_missing_from_it()
    {
        // C is 0-20 cm on the composite scale; the ash lies at 40 cm, below C's base: nothing to note.
        var p = Project(["A", "B", "C"], [Marker("ash", 0.5, ("A", 40), ("B", 40))], [
            new CalendarAgeControl { Id = "ash-age", Marker = "ash", Age = CalendarAge.FromYearsBP(4310), Error = 25 },
            Calendar("top", "C", 0, -60, 1),
        ]);
        var identity = new Dictionary<string, MappingEnsemble>();
        foreach (string core in new[] { "A", "B", "C" }) identity[core] = new(DepthMapping.Identity(core, Unit, 0, 100), []);
        var alignment = new AlignmentResult("A", "test", identity);
        var lp = Load(p, Table("C", 0, 20));
        Assert.DoesNotContain(Run(lp, alignment: alignment), f => f.Code == CheckCodes.AgeMarkerAbsent);
        // Without an alignment the position is unknown, so the note stays.
        Assert.Contains(Run(lp), f => f.Code == CheckCodes.AgeMarkerAbsent && f.Core == "C");
    }

    [Fact]
    public void ControlOutsideTheAgeModelIsReported()
    {
        var p = Project(["A"], ages: [Calendar("ok", "A", 10, 100, 10), Calendar("odd", "A", 50, 2000, 10)]);
        var alignment = new AlignmentResult("A", "test", new Dictionary<string, MappingEnsemble> { ["A"] = new(DepthMapping.Identity("A", Unit, 0, 100), []) });
        var f = Assert.Single(Run(Load(p), new CheckContext { AgeScale = new TenYearsPerCm() }, alignment), f => f.Code == CheckCodes.AgeOffModel);
        Assert.Equal(("odd", Severity.Warning), (f.Item, f.Severity));
    }

    [Fact]
    public void A_control_is_compared_over_its_alignment_band_on_the_composite_scale()
    {
        // B at 50 cm maps to composite 50 cm, its band 45-55 cm: the model's 95 % range there is
        // 430-570 yr (10 yr/cm, +-20 yr). 550 +- 1 yr misses the range at the median alone (480-520)
        // but not over the band; 700 +- 1 yr misses both.
        var p = Project(["B"], ages: [Calendar("near", "B", 50, 550, 1), Calendar("far", "B", 60, 700, 1)]);
        DepthMapping Shifted(double by) => new("B", Unit, [0, 100], [by, 100 + by]);
        var members = Enumerable.Range(0, 41).Select(k => Shifted(-5 + 0.25 * k)).ToList();
        var alignment = new AlignmentResult("B", "test", new Dictionary<string, MappingEnsemble> { ["B"] = new(Shifted(0), members) });
        var found = Run(Load(p), new CheckContext { AgeScale = new TenYearsPerCm() }, alignment).Where(f => f.Code == CheckCodes.AgeOffModel).ToList();
        Assert.Equal(["far"], found.Select(f => f.Item));
    }

    /// <summary>Writes a file in the folder of the test project file and returns its absolute path.</summary>
    private string WriteBesideProject(string name, string text)
    {
        string dir = Path.GetDirectoryName(ProjectPath)!;
        Directory.CreateDirectory(dir);
        string path = Path.Combine(dir, Guid.NewGuid().ToString("N") + "-" + name);
        File.WriteAllText(path, text);
        _written.Add(path);
        return path;
    }

    /// <summary>A model of 10 yr per cm with a 95 % range of +-20 yr.</summary>
    private sealed class TenYearsPerCm : ICompositeAgeScale
    {
        public (double MedianBP, double LoBP, double HiBP) AgeAt(CompositeDepth depth)
        {
            double a = 10 * depth.In(Unit);
            return (a, a - 20, a + 20);
        }

        public int MemberCount => 0;
        public double MemberAgeAt(int member, CompositeDepth depth) => AgeAt(depth).MedianBP;
    }
}
