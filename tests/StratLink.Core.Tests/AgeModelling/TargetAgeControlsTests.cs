using System.Globalization;
using StratLink.AgeModelling;
using StratLink.Checks;
using StratLink.Model;
using StratLink.Quantities;
using StratLink.Workflows;

namespace StratLink.Tests.AgeModelling;

/// <summary>
/// Transferred age controls on a generated core whose true age-depth curve is known: the target is a record of
/// three cycles against age, the core the same record sampled through a curved age-depth relation (rate varying
/// by a factor 3.6), so every transferred age can be checked against the generator's truth.
/// </summary>
public sealed class TargetAgeControlsTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("stratlink-target-controls-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static double Signal(double ageBP) => Math.Sin(2 * Math.PI * ageBP / 41000) + 0.6 * Math.Sin(2 * Math.PI * ageBP / 23000) + 0.3 * Math.Sin(2 * Math.PI * ageBP / 9000);

    /// <summary>The generator's age at a core depth (cm), years BP: 0 at the top, 100 kyr at 500 cm.</summary>
    private static double TrueAge(double depth) => 200 * depth + 20000 * Math.Sin(Math.PI * depth / 500) * 0.9;

    private LoadedProject Load(string targetKeys)
    {
        static string N(double v) => v.ToString("R", CultureInfo.InvariantCulture);
        File.WriteAllText(Path.Combine(_dir, "a.csv"), "depth,s\n" + string.Concat(Enumerable.Range(0, 501).Select(z => $"{z},{N(Signal(TrueAge(z)))}\n")));
        File.WriteAllText(Path.Combine(_dir, "stack.csv"), "age,s\n" + string.Concat(Enumerable.Range(0, 1001).Select(k => $"{N(k * 0.1)},{N(Signal(k * 100))}\n")));
        string file = Path.Combine(_dir, "p.stratlink.yaml");
        // The true curve departs from the straight line between the ends by up to 18 % of the span: the band (window) must be wider.
        File.WriteAllText(file, "format: stratlink-project/1\ndepth_unit: cm\ncores:\n  - id: A\n    table: a.csv\nalignment:\n  window: 0.3\n  ensemble: 20\n  seed: 3\n"
            + "target:\n  table: stack.csv\n  age_unit: ka\n  signal: s\n" + targetKeys);
        var loaded = ProjectLoader.Load(file);
        Assert.False(loaded.Problems.HasErrors, string.Join("\n", loaded.Problems.Select(f => f.Message)));
        return loaded;
    }

    [Fact]
    public void Controls_every_spacing_follow_the_true_curve_within_their_sigma()
    {
        var findings = new FindingList();
        var controls = TargetAgeControls.For(Load("  spacing: 50\n  age_error: 1500\n"), findings, CancellationToken.None).Cast<CalendarAgeControl>().ToList();
        Assert.Equal(Enumerable.Range(0, 11).Select(k => $"target:A:{k * 50}"), controls.Select(c => c.Id));
        Assert.Contains(findings, f => f.Code == AgeModelCodes.TargetAges && f.Core == "A");
        foreach (var c in controls)
        {
            double depth = c.Depth!.Value.In(DepthUnit.Centimetre), truth = TrueAge(depth);
            // Every sigma holds the target's own error; the ends are matched exactly, the interior within
            // 2 sigma of the truth (noise-free signals: the alignment should find the true path up to its step).
            Assert.True(c.Error >= 1500, $"{c.Id}: sigma {c.Error:0} below the target's age error");
            Assert.True(Math.Abs(c.Age.YearsBP - truth) <= 2 * c.Error, $"{c.Id}: {c.Age.YearsBP:0} against true {truth:0} (sigma {c.Error:0})");
        }
    }

    [Fact]
    public void Without_a_spacing_a_core_gets_fifty_intervals_and_without_an_error_column_the_sigma_is_the_alignment_spread()
    {
        var controls = TargetAgeControls.For(Load(""), new FindingList(), CancellationToken.None).Cast<CalendarAgeControl>().ToList();
        Assert.Equal(DatedTargetSpec.DefaultControlsPerCore + 1, controls.Count);
        Assert.Equal("target:A:10", controls[1].Id);
        Assert.True(controls.Min(c => c.Error) < 1500, "with no target age error the sigma should be the alignment spread alone");
    }
}
