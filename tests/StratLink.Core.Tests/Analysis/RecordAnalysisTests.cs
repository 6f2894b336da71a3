using System.Xml.Linq;
using StratLink.Analysis;
using StratLink.Quantities;
using Xunit.Abstractions;

namespace StratLink.Tests.Analysis;

public class RecordAnalysisTests(ITestOutputHelper output)
{
    /// <summary>
    /// Invented varved-lake-like record: 600 samples at 1 cm composite depth steps, uneven median ages over
    /// 1500-0 cal BP, cosines of 11 and 88 yr (amplitude 0.7) in AR(1) noise (tau 8 yr), mean shifts of +2 at
    /// 1000 BP and -2 at 400 BP. Members: median ages plus a random walk in age (step sd 0.4 yr per sample,
    /// so about 10 yr of spread at the base), as an age model's errors accumulate with depth.
    /// </summary>
    private static (AnalysisInput Input, double[] MedianAges) Record(int members, int seed, double walkStep = 0.4)
    {
        var rng = new Random(seed);
        int n = 600;
        var ages = SyntheticRecords.UnevenAges(rng, n, 1500);
        var y = SyntheticRecords.CyclesPlusRedNoise(rng, ages, 8, (0.7, 11), (0.7, 88));
        for (int i = 0; i < n; i++) y[i] += ages[i] <= 1000 && ages[i] > 400 ? 2 : 0;
        // Depth increases with age: sample i (oldest first) sits at depth n - 1 - i.
        var depths = Enumerable.Range(0, n).Select(i => (double)(n - 1 - i)).Reverse().ToArray();
        var medianByDepth = ages.Reverse().ToArray();
        var memberAges = new List<double[]>();
        for (int m = 0; m < members; m++)
        {
            var a = new double[n];
            double walk = 0;
            for (int i = 0; i < n; i++)
            {
                walk += walkStep * MathNet.Numerics.Distributions.Normal.Sample(rng, 0, 1);
                a[i] = medianByDepth[i] + walk;
            }
            memberAges.Add(a);
        }
        var scale = new MemberAgeTable(DepthUnit.Centimetre, depths, memberAges, medianByDepth);
        var compositeDepths = depths.Select(d => CompositeDepth.From(d, DepthUnit.Centimetre)).ToArray();
        return (AnalysisInput.FromComposite("varve thickness", "mm", compositeDepths, y.Reverse().ToArray(), scale), ages);
    }

    private static readonly AnalysisOptions Options = new()
    {
        Seed = 5,
        PeriodsYears = [11, 88],
        Spectrum = new SpectrumOptions { Surrogates = 300 },
        Regimes = new RegimeShiftOptions { CutoffLength = 30, Probability = 0.01 },
        MaxMembers = 40,
    };

    [Fact]
    public void AgeEnsemble_SharesAndShiftRangesMakeSense()
    {
        // Random-walk age errors of 1.5 yr per sample: member spread (sd) 1.5 sqrt(i) yr at i samples below the top,
        // about 37 yr at the base - several 11-yr cycles, less than half an 88-yr one.
        var (input, _) = Record(members: 60, seed: 31, walkStep: 1.5);
        var r = RecordAnalysis.Run(input, Options);
        foreach (var p in r.Periods)
            output.WriteLine($"{p.PeriodYears} yr: power / 95 % level {p.PowerOverLevel95:F2}, members above 95 %: {p.ShareOfMembersAbove95:P0}");
        foreach (var s in r.Ensemble!.Shifts)
            output.WriteLine($"shift at {s.Shift.AgeBP:F0} BP: members {s.AgeLoBP:F0}-{s.AgeHiBP:F0} BP, matched {s.ShareMatched:P0}");

        // Both cycles stand above the 95 % level on the median ages (as in RedNoiseSpectrumTests).
        Assert.All(r.Periods, p => Assert.True(p.Above95, $"{p.PeriodYears} yr: ratio {p.PowerOverLevel95:F2}"));
        // Age errors dephase a short cycle within a segment far more than a long one, so fewer members keep the
        // 11-yr cycle than the 88-yr one, and most keep the 88-yr one.
        var p11 = r.Periods.Single(p => p.PeriodYears == 11);
        var p88 = r.Periods.Single(p => p.PeriodYears == 88);
        Assert.True(p11.ShareOfMembersAbove95 < p88.ShareOfMembersAbove95, $"11 yr {p11.ShareOfMembersAbove95} vs 88 yr {p88.ShareOfMembersAbove95}");
        Assert.True(p88.ShareOfMembersAbove95 >= 0.5, $"88 yr share {p88.ShareOfMembersAbove95}");

        // A seeded sample of 40 of the 60 members.
        var e = r.Ensemble!;
        Assert.Equal(40, e.Members.Length);
        Assert.Equal(e.Members.Order().ToArray(), e.Members);

        // The two true shifts (+-2 in mean) are found on the median ages within 3 samples; their 95 % member ranges
        // contain the true age and are no wider than the members' own 95 % age range there (2 x 1.96 sd) plus
        // 3 samples either side for the test's own placement scatter.
        foreach (double trueAge in new[] { 1000.0, 400.0 })
        {
            int index = Array.FindIndex(r.Series.AgesBP, a => a <= trueAge);
            var spread = e.Shifts.Single(s => Math.Abs(s.Shift.Index - index) <= 3);
            double sd = 1.5 * Math.Sqrt(r.Series.Count - 1 - index);
            Assert.InRange(trueAge, spread.AgeLoBP, spread.AgeHiBP);
            Assert.True(spread.AgeHiBP - spread.AgeLoBP <= 2 * 1.96 * sd + 6 * r.Series.MeanSpacingYears, $"range {spread.AgeLoBP:F0}-{spread.AgeHiBP:F0}, sd {sd:F0}");
            Assert.True(spread.ShareMatched >= 0.9, $"matched {spread.ShareMatched}");
        }
    }

    [Fact]
    public void AgeEnsembleWithoutAgeErrors_KeepsEveryPeakAndShift()
    {
        // Members equal to the median: every member sees the median-age record, so both cycles are above the
        // level in every member (their chi-square levels sit close to the median run's Monte Carlo ones here) and
        // every shift range collapses onto the median run's shift age.
        var (input, _) = Record(members: 5, seed: 31, walkStep: 0);
        var r = RecordAnalysis.Run(input, Options);
        Assert.All(r.Periods, p => Assert.Equal(1.0, p.ShareOfMembersAbove95));
        Assert.All(r.Ensemble!.Shifts, s =>
        {
            Assert.Equal(s.Shift.AgeBP, s.AgeLoBP);
            Assert.Equal(s.Shift.AgeBP, s.AgeHiBP);
            Assert.Equal(1.0, s.ShareMatched);
        });
    }

    [Fact]
    public void SameSeed_SameOutputs_BitForBit()
    {
        var (input, _) = Record(members: 12, seed: 32);
        var options = Options with { MaxMembers = 8, Spectrum = new SpectrumOptions { Surrogates = 100 } };
        var a = RecordAnalysis.Run(input, options);
        var b = RecordAnalysis.Run(input, options);
        Assert.Equal(AnalysisOutputs.SpectrumTable(a), AnalysisOutputs.SpectrumTable(b));
        Assert.Equal(AnalysisOutputs.ShiftsTable(a), AnalysisOutputs.ShiftsTable(b));
        Assert.Equal(a.Ensemble!.Members, b.Ensemble!.Members);
    }

    [Fact]
    public void Outputs_AreWrittenWithTheAgreedColumns_AndFiguresAreWellFormedSvg()
    {
        var (input, _) = Record(members: 40, seed: 33);
        var r = RecordAnalysis.Run(input, Options with { Spectrum = new SpectrumOptions { Surrogates = 200 } });
        string dir = Path.Combine(AppContext.BaseDirectory, "figures", "analysis-synthetic");
        if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        {
            var files = AnalysisOutputs.Write(r, dir);
            Assert.Equal(["spectrum.csv", "shifts.csv", "filtered.csv", "summary.csv", "spectrum.svg", "shifts.svg", "filtered.svg"], files);
            Assert.Equal("frequency_per_yr,period_yr,power,raw_power,background,chi2_80,chi2_90,chi2_95,chi2_99,mc_80,mc_90,mc_95,mc_99,members_above_chi2_95_share",
                File.ReadLines(Path.Combine(dir, "spectrum.csv")).First());
            Assert.Equal("index,age_bp,mean_before,mean_after,rsi,tentative,members_age_lo_bp,members_age_hi_bp,members_matched_share",
                File.ReadLines(Path.Combine(dir, "shifts.csv")).First());
            Assert.Equal("age_bp,value,lowpass,bandpass_11yr,bandpass_88yr", File.ReadLines(Path.Combine(dir, "filtered.csv")).First());
            Assert.Contains("seed,5", File.ReadAllLines(Path.Combine(dir, "summary.csv")));
            Assert.Equal(r.Spectrum.Frequencies.Length + 1, File.ReadAllLines(Path.Combine(dir, "spectrum.csv")).Length);
            foreach (string svg in files.Where(f => f.EndsWith(".svg")))
            {
                var doc = XDocument.Load(Path.Combine(dir, svg));
                Assert.Equal("svg", doc.Root!.Name.LocalName);
            }
        }
        foreach (var p in r.Periods)
            output.WriteLine($"{p.PeriodYears} yr: power / 95 % level {p.PowerOverLevel95:F2}, members above 95 %: {p.ShareOfMembersAbove95:P0}");
        foreach (var s in r.Ensemble!.Shifts)
            output.WriteLine($"shift at {s.Shift.AgeBP:F0} BP: members {s.AgeLoBP:F0}-{s.AgeHiBP:F0} BP, matched {s.ShareMatched:P0}");
        output.WriteLine("Figures and tables in " + dir);
    }
}
