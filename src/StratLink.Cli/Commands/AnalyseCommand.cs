using System.CommandLine;
using System.Globalization;
using StratLink.Analysis;
using StratLink.Checks;
using StratLink.Workflows;

namespace StratLink.Cli.Commands;

/// <summary>
/// <c>stratlink analyse PROJECT --signal NAME [--periods 11,88] [--splice] [--shift-cutoff YEARS]
/// [--shift-probability P] [--huber H] [--members N] --out DIR</c>: periodogram with red-noise levels, band-pass
/// filters and regime shifts of one composite signal, on every age-model member (or a seeded sample of N).
/// </summary>
internal static class AnalyseCommand
{
    public static Command Create(CliContext ctx)
    {
        var project = ProjectArgument.Create();
        var signal = new Option<string>("--signal") { Description = "Composite signal to analyse (a column of the core tables).", Required = true };
        var periods = new Option<string?>("--periods") { Description = "Periods in years to follow across the age ensemble and band-pass, comma-separated (e.g. 11,88)." };
        var splice = new Option<bool>("--splice") { Description = "Analyse the spliced record instead of the mean of the stacked cores." };
        var cutoff = NumberOption.Create("--shift-cutoff",
            "Cut-off length of the regime-shift test in years (regimes shorter than this are not sought); converted to samples with the record's mean spacing.",
            RegimeShiftOptions.LongRecordCutoffYears);
        var probability = NumberOption.Create("--shift-probability",
            "Target probability of the regime-shift t-test (two-tailed).",
            RegimeShiftOptions.LongRecordProbability);
        var huber = NumberOption.Create("--huber",
            "Huber parameter of the regime-shift test, in standard deviations (outliers beyond it are down-weighted).",
            RegimeShiftOptions.LongRecordHuber);
        var members = new Option<int>("--members")
        {
            Description = "Age-model members analysed at most (a seeded sample when the ensemble is larger).",
            DefaultValueFactory = _ => new AnalysisOptions().MaxMembers,
        };
        var output = new Option<DirectoryInfo>("--out") { Description = "Folder for spectrum.csv, shifts.csv, filtered.csv and the figures.", Required = true };
        var cmd = new Command("analyse", "Look for cycles and abrupt regime shifts in a composite signal, across the age-model ensemble.")
        {
            project, signal, periods, splice, cutoff, probability, huber, members, output,
        };
        cmd.SetAction(parse =>
        {
            if (!TryParsePeriods(parse.GetValue(periods), out var periodList, out string? bad))
            {
                ctx.Fail($"--periods: '{bad}' is not a positive number of years (write e.g. --periods 11,88).");
                return ExitCodes.Usage;
            }
            double cutoffYears = parse.GetValue(cutoff), prob = parse.GetValue(probability), h = parse.GetValue(huber);
            int maxMembers = parse.GetValue(members);
            string? usage = !(cutoffYears > 0) || !double.IsFinite(cutoffYears) ? $"--shift-cutoff: {Num(cutoffYears)} is not a positive number of years."
                : !(prob > 0 && prob < 1) ? $"--shift-probability: {Num(prob)} is not a probability between 0 and 1."
                : !(h > 0) ? $"--huber: {Num(h)} must be positive (in standard deviations)."
                : maxMembers < 1 ? $"--members: {maxMembers} must be at least 1."
                : null;
            if (usage is not null)
            {
                ctx.Fail(usage);
                return ExitCodes.Usage;
            }
            if (LoadForRun.Load(parse.GetValue(project)!, ctx, "nothing was analysed") is not { } loaded) return ExitCodes.Usage;
            string name = parse.GetValue(signal)!;
            using var progress = new ConsoleProgress(ctx);
            var build = BuildWorkflow.Run(loaded, progress, ctx.Cancellation);
            if (build.Composite.Record(name) is null)
            {
                ctx.Fail($"--signal: the composite has no signal '{name}' (it has: {string.Join(", ", build.Composite.Records.Select(r => r.Signal))}).");
                return ExitCodes.Usage;
            }
            var defaults = AnalysisOptions.ForCompositeRecord(loaded.Project.AgeModel.Seed, periodList);
            var options = defaults with
            {
                MaxMembers = maxMembers,
                ShiftCutoffYears = cutoffYears,
                Regimes = defaults.Regimes with { Probability = prob, HuberParameter = h },
            };
            AnalysisResult result;
            try
            {
                result = AnalysisWorkflow.Run(build, name, parse.GetValue(splice), options, progress, ctx.Cancellation);
            }
            catch (InvalidOperationException e)
            {
                ctx.Fail(e.Message);
                return ExitCodes.Findings;
            }
            string dir = parse.GetValue(output)!.FullName;
            var files = AnalysisOutputs.Write(result, dir);
            ctx.Out.WriteLine($"Analysed {name} ({result.Series.Count} samples, {result.Ensemble?.Members.Length ?? 0} age-model members, seed {options.Seed}).");
            foreach (var pc in result.Periods)
            {
                string share = pc.ShareOfMembersAbove95 is double sh ? $", above it in {sh * 100:0} % of members" : "";
                ctx.Out.WriteLine(FormattableString.Invariant(
                    $"  {pc.PeriodYears:0.#} yr: nearest peak {pc.PeakPeriodYears:0.#} yr, power {pc.PowerOverLevel95:0.00} x the 95 % red-noise level{share}"));
            }
            var regimes = result.Options.Regimes;
            ctx.Out.WriteLine(FormattableString.Invariant(
                $"Regime shifts (l = {CutoffText(regimes.CutoffLength, cutoffYears, result.Series.MeanSpacingYears)}, p = {Num(regimes.Probability)}, h = {Num(regimes.HuberParameter)}): {result.Regimes.Shifts.Count}"));
            foreach (var shift in result.Regimes.Shifts)
            {
                var spread = result.Ensemble?.Shifts.FirstOrDefault(s => s.Shift == shift);
                string range = spread is null ? ""
                    : FormattableString.Invariant($", 95 % range over members {spread.AgeLoBP:0}-{spread.AgeHiBP:0} cal BP, found in {spread.ShareMatched * 100:0} % of members");
                ctx.Out.WriteLine(FormattableString.Invariant(
                    $"  {shift.AgeBP:0} cal BP: mean {shift.MeanBefore:0.###} -> {shift.MeanAfter:0.###}{(shift.Tentative ? " (tentative)" : "")}{range}"));
            }
            ctx.Out.WriteLine($"Files in {dir}:");
            foreach (string f in files) ctx.Out.WriteLine("  " + f);
            return ExitCodes.Success;
        });
        return cmd;
    }

    private static string Num(double v) => v.ToString("0.###", CultureInfo.InvariantCulture);

    // The test takes two samples at least: on a coarse record the cut-off asked for is far shorter than the one used.
    private static string CutoffText(int samples, double askedYears, double spacingYears) =>
        askedYears / spacingYears < samples - 0.5
            ? $"{samples} samples = {Math.Round(samples * spacingYears).ToString(CultureInfo.InvariantCulture)} yr, the least the test takes; --shift-cutoff {Num(askedYears)} yr is shorter"
            : $"{samples} samples = {Num(askedYears)} yr";

    internal static bool TryParsePeriods(string? text, out IReadOnlyList<double> periods, out string? bad)
    {
        var list = new List<double>();
        bad = null;
        foreach (string part in (text ?? "").Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries))
        {
            if (!double.TryParse(part, NumberStyles.Float, CultureInfo.InvariantCulture, out double p) || !(p > 0) || !double.IsFinite(p))
            {
                bad = part;
                periods = [];
                return false;
            }
            list.Add(p);
        }
        periods = list;
        return true;
    }
}
