using System.CommandLine;
using System.Globalization;
using StratLink.Analysis;
using StratLink.Checks;
using StratLink.Workflows;

namespace StratLink.Cli.Commands;

/// <summary>
/// <c>stratlink analyse PROJECT --signal NAME [--periods 11,88] --out DIR</c>: periodogram with red-noise
/// levels, band-pass filters and regime shifts of one composite signal, on every age-model member.
/// </summary>
internal static class AnalyseCommand
{
    public static Command Create(CliContext ctx)
    {
        var project = ProjectArgument.Create();
        var signal = new Option<string>("--signal") { Description = "Composite signal to analyse (a column of the core tables).", Required = true };
        var periods = new Option<string?>("--periods") { Description = "Periods in years to follow across the age ensemble and band-pass, comma-separated (e.g. 11,88)." };
        var splice = new Option<bool>("--splice") { Description = "Analyse the spliced record instead of the mean of the stacked cores." };
        var output = new Option<DirectoryInfo>("--out") { Description = "Folder for spectrum.csv, shifts.csv, filtered.csv and the figures.", Required = true };
        var cmd = new Command("analyse", "Look for cycles and abrupt regime shifts in a composite signal, across the age-model ensemble.")
        {
            project, signal, periods, splice, output,
        };
        cmd.SetAction(parse =>
        {
            if (!TryParsePeriods(parse.GetValue(periods), out var periodList, out string? bad))
            {
                ctx.Fail($"--periods: '{bad}' is not a positive number of years (write e.g. --periods 11,88).");
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
            var options = new AnalysisOptions { Seed = loaded.Project.AgeModel.Seed, PeriodsYears = periodList };
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
            ctx.Out.WriteLine($"Files in {dir}:");
            foreach (string f in files) ctx.Out.WriteLine("  " + f);
            return ExitCodes.Success;
        });
        return cmd;
    }

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
