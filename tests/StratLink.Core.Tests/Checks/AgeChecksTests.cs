using StratLink.AgeModelling;
using StratLink.Alignment;
using StratLink.Checks;
using StratLink.Model;
using StratLink.Quantities;
using StratLink.Tests.TestSupport;
using static StratLink.Tests.Checks.CheckFixtures;

namespace StratLink.Tests.Checks;

public sealed class AgeChecksTests
{
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
        var p = Project(["A"], ages: [Radiocarbon("r1", "A", 10, 3000, 30, "curves/lake.14c"), Calendar("ash", "A", 20, 1500, 10)]);
        var ctx = new CheckContext { Calibrate = rc => new AgeEstimate(3200, 40) };
        Assert.Contains(Run(Load(p), ctx), f => f.Code == CheckCodes.AgeReversal && f.Item == "r1/ash");
        Assert.DoesNotContain(Run(Load(p)), f => f.Code == CheckCodes.AgeReversal);
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
        // IntCal20 (Reimer et al. 2020) spans 95 to about 50,100 14C yr BP: 60,000 is beyond it, and a
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
        // 300 14C yr less a 250 yr offset is 50, younger than any IntCal20 age (the youngest is 95, at 49 cal BP).
        var p = Project(["A"], ages: [Radiocarbon("r", "A", 5, 300, 20, IntCal20) with { ReservoirOffset = 250 }]);
        Assert.Contains(Run(Load(p)), f => f.Code == CheckCodes.RadiocarbonOutsideCurve && f.Message.Contains("after the reservoir offset"));
        Assert.DoesNotContain(Run(Load(Project(["A"], ages: [Radiocarbon("r", "A", 5, 300, 20, IntCal20)]))), f => f.Code == CheckCodes.RadiocarbonOutsideCurve);
    }

    [Fact]
    public void CurveRangeIsReadFromThePublishedCurve()
    {
        var range = CurveRangeReader.Read(IntCal20);
        Assert.NotNull(range);
        // IntCal20 (Reimer et al. 2020) as distributed: the first row (55,000 cal BP) is 50,100 14C yr, the
        // youngest 14C age is 95 (at 49 cal BP).
        Assert.True(range.Value.Oldest >= 50100, $"oldest {range.Value.Oldest}");
        Assert.Equal(95, range.Value.Youngest);
    }

    [Fact]
    public void UnreadableCurveIsAWarning()
    {
        string dir = Directory.CreateTempSubdirectory("stratlink-curve-").FullName;
        try
        {
            string curve = Path.Combine(dir, "broken.14c");
            File.WriteAllText(curve, "# only a header\nCAL BP, 14C age\n");
            var p = Project(["A"], ages: [Radiocarbon("r", "A", 5, 3000, 20, curve)]);
            Assert.Contains(Run(Load(p)), f => f.Code == CheckCodes.CurveUnreadable && f.Severity == Severity.Warning);
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }

    [Fact]
    public void VarveCountDisagreeingWithAnIndependentAgeIsReported()
    {
        var varves = new VarveCountControl
        {
            Id = "count", Core = "A", Table = "cores/A-varves.csv", AnchorDepth = D(0), AnchorAge = CalendarAge.FromYearsBP(-68), CountError = 0.02,
        };
        // Stand-in chronology: 10 varves per cm, 2 % systematic counting error (sigma = 0.02 n; common practice).
        AgeEstimate? Chronology(VarveCountControl v, CoreDepth d)
        {
            double n = 10 * d.In(Unit);
            return d.In(Unit) > 80 ? null : new AgeEstimate(v.AnchorAge.YearsBP + n, v.CountError * n);
        }
        var ctx = new CheckContext { VarveAge = Chronology };
        // At 50 cm the count says 432 +- 10; an ash dated 600 +- 20 is 168 yr off (limit 2 x 22 = 45).
        var p = Project(["A"], ages: [varves, Calendar("ash", "A", 50, 600, 20), Calendar("deep", "A", 90, 5000, 20)]);
        var f = Assert.Single(Run(Load(p), ctx), f => f.Code == CheckCodes.VarveDisagrees);
        Assert.Equal(("A", "count/ash", 50.0, Severity.Warning), (f.Core, f.Item, f.Depth, f.Severity));

        var agreeing = Project(["A"], ages: [varves, Calendar("ash", "A", 50, 440, 20)]);
        Assert.DoesNotContain(Run(Load(agreeing), ctx), f => f.Code == CheckCodes.VarveDisagrees);
        Assert.Contains(Run(Load(agreeing)), f => f.Code == CheckCodes.CheckNotRun);
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
    public void ControlOutsideTheAgeModelIsReported()
    {
        var p = Project(["A"], ages: [Calendar("ok", "A", 10, 100, 10), Calendar("odd", "A", 50, 2000, 10)]);
        var alignment = new AlignmentResult("A", "test", new Dictionary<string, MappingEnsemble> { ["A"] = new(DepthMapping.Identity("A", Unit, 0, 100), []) });
        var f = Assert.Single(Run(Load(p), new CheckContext { AgeScale = new TenYearsPerCm() }, alignment), f => f.Code == CheckCodes.AgeOffModel);
        Assert.Equal(("odd", Severity.Warning), (f.Item, f.Severity));
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
