using System.Text.RegularExpressions;
using StratLink.Analysis;
using StratLink.Cli.Dashboard;
using StratLink.Cli.Dashboard.Results;
using StratLink.Cli.Dashboard.Views;
using Terminal.Gui.Input;
using Terminal.Gui.Testing;
using Xunit.Abstractions;

namespace StratLink.Tests.Dashboard;

/// <summary>
/// The dashboard driving the real library: a build of the small test project in the background, then
/// the ages and composite screens read back cell by cell. Slow (seconds), so few.
/// </summary>
[Collection("TerminalGui")]
public sealed class LibraryRunTests(ITestOutputHelper output)
{
    private static readonly TimeSpan Watchdog = TimeSpan.FromSeconds(90);

    /// <summary>Presses <paramref name="key"/> and runs until the background work has ended (or the watchdog fires).</summary>
    private static bool PressAndWait(DashboardHarness h, char key)
    {
        bool sent = false;
        return h.RunUntil(_ =>
        {
            if (!sent) { h.App.InjectKey(new Key(key)); sent = true; return false; }
            return !h.Window.RunInProgress;
        }, Watchdog);
    }

    [Fact]
    public void A_real_run_fills_the_ages_and_composite_screens()
    {
        using var project = new TestProject();
        // The analysis settings are cut down (fewer surrogates and members) only to keep the test short.
        var workflows = new LibraryWorkflows(p => new AnalysisOptions
        {
            Seed = p.AgeModel.Seed,
            PeriodsYears = LibraryWorkflows.DefaultPeriodsYears,
            Spectrum = new SpectrumOptions { Surrogates = 50 },
            MaxMembers = 20,
        });
        using var h = new DashboardHarness(project, 100, 32, begin: false, workflows: workflows);

        Assert.True(PressAndWait(h, 'r'), "the run did not finish in time");
        output.WriteLine(h.Window.Message);
        Assert.Equal(ResultsState.Current, h.State.ResultsState);
        var results = h.State.Results!;
        Assert.NotNull(results.Build);
        Assert.Contains("Run finished", h.Window.Message);

        var session = h.Session();
        h.Type("2");
        output.WriteLine(h.ScreenText);
        string ages = h.ScreenText;
        Assert.Contains("Age model", h.Row(2));
        Assert.Contains("▒", ages);
        Assert.Contains("●", ages);
        Assert.Contains(ages, ch => ch is >= '\u2801' and <= '\u28FF');
        // ash-1-age is a calendar age of 1200 +- 20 yr (1 sigma): its 95 % range is 1200 -+ 1.96 x 20 = 1161-1239
        // (normal quantile, any statistics table); whole-year HPD bounds may differ by a year or two.
        var range = Regex.Match(ages, @"ash-1-age .*? (\d+)\.\.(\d+) ");
        Assert.True(range.Success, "no 95 % range for ash-1-age on the ages screen");
        Assert.InRange(int.Parse(range.Groups[1].Value), 1158, 1164);
        Assert.InRange(int.Parse(range.Groups[2].Value), 1236, 1242);

        // e asks for a folder and writes the build's outputs there, run.json among them.
        string outputs = Path.Combine(project.Folder, "outputs");
        h.Prompts.Texts.Enqueue(outputs);
        h.Type("e");
        output.WriteLine(h.Window.Message);
        Assert.StartsWith("Exported ", h.Window.Message);
        Assert.True(File.Exists(Path.Combine(outputs, "run.json")), "no run.json in the export folder");
        Assert.True(File.Exists(Path.Combine(outputs, "checks.csv")), "no checks.csv in the export folder");

        h.Type("3");
        output.WriteLine(h.ScreenText);
        string composite = h.ScreenText;
        Assert.Contains("Composite ms (mean and 95% band) against composite depth (cm)", h.Row(2));
        Assert.Contains("splice: A=T-", composite);
        Assert.Contains("▒", composite);
        Assert.Contains(composite, ch => ch is >= '\u2801' and <= '\u28FF');
        // The plot's value range is robust: the 2nd to 98th percentile of the library's mean, by linear
        // interpolation between order statistics (Hyndman and Fan 1996, type 7, numpy's default).
        var ms = results.Build!.Composite.Record("ms")!;
        var sorted = ms.Mean.Where(double.IsFinite).Order().ToArray();
        double Percentile(double p)
        {
            double at = (sorted.Length - 1) * p / 100;
            int i = (int)Math.Floor(at);
            return sorted[i] + (at - i) * (sorted[Math.Min(i + 1, sorted.Length - 1)] - sorted[i]);
        }
        Assert.Contains($"ms {Number(Percentile(2))}..{Number(Percentile(98))} (2-98 %, ", composite);

        h.Type("a");
        Assert.Contains("against age (cal BP)", h.Row(2));

        // Findings: the run's checks follow the file's problems; Enter on one with a place shows it in the logs.
        h.Type("4");
        output.WriteLine(h.ScreenText);
        Assert.Contains($"{results.Checks!.Count} from the checks", h.Row(2));
        int placed = results.Checks.ToList().FindIndex(f => f.Core is not null && f.Depth is not null);
        Assert.True(placed >= 0, "no check with a core and depth to jump to");
        var target = results.Checks[placed];
        for (int i = 0; i < project.Loaded.Problems.Count + placed; i++) h.Press(Key.CursorDown);
        h.Press(Key.Enter);
        Assert.Equal(Screen.Logs, h.Window.Current);
        Assert.StartsWith($"{target.Core} at {target.Depth!.Value.ToString("0.##", System.Globalization.CultureInfo.InvariantCulture)}", h.Window.Message);
        h.Type("3");

        session.Dispose();
        Assert.True(PressAndWait(h, 'p'), "the analysis did not finish in time");
        using var after = h.Session();
        output.WriteLine(h.Window.Message);
        output.WriteLine(h.ScreenText);
        Assert.StartsWith("Analysed ms", h.Window.Message);
        string analysed = h.ScreenText;
        // Every period asked for gets a line: its power against the red-noise level, or why it cannot be tested.
        Assert.Matches(@"11 yr: (\d+\.\d x the 95 % red-noise level|not testable)", analysed);
        Assert.Matches(@"88 yr: (\d+\.\d x the 95 % red-noise level|not testable)", analysed);
        Assert.DoesNotContain("NaN", analysed);
        // Regime shifts are marked beside the plot at their depth.
        Assert.Contains("◀", h.Row(3) + h.Row(4) + h.Row(5) + h.Row(6));
    }

    private static string Number(double v) => v.ToString(Math.Abs(v) >= 100 ? "0" : "0.##", System.Globalization.CultureInfo.InvariantCulture);
}
