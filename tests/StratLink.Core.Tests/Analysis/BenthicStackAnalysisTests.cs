using System.Globalization;
using StratLink.Analysis;
using StratLink.Tests.TestSupport;
using Xunit.Abstractions;

namespace StratLink.Tests.Analysis;

/// <summary>
/// End-to-end analysis of a real open record: the LR04 benthic d18O stack (Lisiecki and Raymo 2005,
/// Paleoceanography 20, PA1003; ../shared/data/benthic-stack/LR04stack.txt), 0-2 Ma, on its own ages
/// (ka -> years), sampled every 1 kyr to 600 ka, 2 kyr to 1500 ka and 2.5 kyr beyond: unevenly spaced.
/// </summary>
public class BenthicStackAnalysisTests(ITestOutputHelper output)
{
    /// <summary>Rows "age_ka TAB d18O TAB se" after 5 free-text header lines; CRLF line ends.</summary>
    private static (double[] AgesBP, double[] D18O) ReadLr04(double maxAgeKa)
    {
        string path = RepoPaths.Data("benthic-stack", "LR04stack.txt");
        var ages = new List<double>();
        var values = new List<double>();
        int line = 0;
        foreach (string raw in File.ReadLines(path))
        {
            line++;
            if (line <= 5) continue;
            var f = raw.Trim().Split('\t');
            if (f.Length < 2) continue;
            if (!double.TryParse(f[0], NumberStyles.Float, CultureInfo.InvariantCulture, out double ka) ||
                !double.TryParse(f[1], NumberStyles.Float, CultureInfo.InvariantCulture, out double d))
                throw new FormatException($"{path}:{line}: cannot read age and d18O from '{raw}'.");
            if (ka > maxAgeKa) break;
            ages.Add(ka * 1000);
            values.Add(d);
        }
        if (ages.Count < 100) throw new InvalidDataException($"{path}: only {ages.Count} rows read.");
        return (ages.ToArray(), values.ToArray());
    }

    [Fact]
    public void Lr04_Last2Myr_ObliquityAnd100kyrCyclesStandAboveRedNoise_TerminationsAreRegimeShifts()
    {
        // Lisiecki and Raymo 2005 (and Imbrie et al. 1992 before them): over the last 1-2 Myr the benthic d18O
        // spectrum has its strongest power at the ~100-kyr and the 41-kyr (obliquity) periods. Checked here as:
        // each stands above the 95 % Monte Carlo AR(1) level within half the 6-dB bandwidth of 1/41 kyr and
        // 1/100 kyr (about +-1 kyr and +-6 kyr in period with 3 Welch segments of ~1.3 Myr). The bounds are
        // the resolution of the method, not tuned; the power ratios are printed.
        var (ages, d18O) = ReadLr04(2000);
        var input = AnalysisInput.FromAges("benthic d18O", "permil", ages, d18O);
        var options = new AnalysisOptions
        {
            Seed = 2005,
            PeriodsYears = [41000, 100000],
            Regimes = new RegimeShiftOptions { CutoffLength = 60, Probability = 0.05 },
        };
        var r = RecordAnalysis.Run(input, options);

        string dir = Path.Combine(AppContext.BaseDirectory, "figures", "analysis-lr04");
        var files = AnalysisOutputs.Write(r, dir);
        output.WriteLine($"LR04 0-2 Ma: {r.Series.Count} samples, tau {r.Spectrum.Persistence.TauYears:F0} yr, " +
                         $"dof {r.Spectrum.DegreesOfFreedom:F1}, 6-dB bandwidth {r.Spectrum.SixDecibelBandwidth:E2} /yr");
        foreach (var p in r.Periods)
            output.WriteLine($"  {p.PeriodYears / 1000:F0} kyr: peak at {p.PeakPeriodYears / 1000:F1} kyr, power / 95 % level = {p.PowerOverLevel95:F2}");
        foreach (var s in r.Regimes.Shifts)
            output.WriteLine($"  shift at {s.AgeBP / 1000:F0} ka: {s.MeanBefore:F2} -> {s.MeanAfter:F2} permil (RSI {s.Rsi:F2})");
        output.WriteLine("Figures and tables: " + string.Join(", ", files.Select(f => Path.Combine(dir, f))));

        Assert.All(r.Periods, p => Assert.True(p.Above95, $"{p.PeriodYears / 1000} kyr: power / 95 % level {p.PowerOverLevel95:F2}"));
        Assert.InRange(r.Periods[0].PeakPeriodYears, 39000, 43000);
        Assert.InRange(r.Periods[1].PeakPeriodYears, 90000, 112000);

        // Glacial terminations of Lisiecki and Raymo 2005 (Table 3, midpoints; values from memory): TI 14, TII 130,
        // TIII 243, TIV 337, TV 424, TVI 533, TVII 621 ka. With l = 60 samples the regime test should open a lighter
        // (interglacial) regime at each. Tolerance +-6 kyr: a termination takes several kyr and the shift lands on
        // the first sample of the new regime, 1-2 kyr apart here.
        var downward = r.Regimes.Shifts.Where(s => s.MeanAfter < s.MeanBefore).Select(s => s.AgeBP / 1000).ToList();
        foreach (double t in new[] { 14.0, 130, 243, 337, 424, 533, 621 })
            Assert.True(downward.Any(a => Math.Abs(a - t) <= 6), $"no lighter-regime shift within 6 kyr of the termination at {t} ka; found {string.Join(", ", downward.Select(a => a.ToString("F0")))}");
    }
}
