using System.CommandLine;
using StratLink.AgeModelling.Calibration;
using StratLink.Checks;
using StratLink.ProjectIO;
using StratLink.Quantities;

namespace StratLink.Cli.Commands;

/// <summary><c>stratlink calibrate</c>: one radiocarbon date against a curve file; prints median, HPD ranges and a density plot.</summary>
internal static class CalibrateCommand
{
    public static Command Create(CliContext ctx)
    {
        var c14 = NumberOption.Create("--c14", "Conventional radiocarbon age, 14C yr BP.", required: true);
        var error = NumberOption.Create("--error", "Its 1-sigma error, 14C yr.", required: true);
        var curve = new Option<FileInfo>("--curve") { Description = "Calibration curve file (cal BP, 14C age, sigma, ...; '#' header lines).", Required = true };
        var deltaR = NumberOption.Create("--delta-r", "Reservoir offset Delta-R, 14C yr.");
        var deltaRError = NumberOption.Create("--delta-r-error", "1-sigma error of Delta-R, 14C yr.");
        var csv = new Option<FileInfo?>("--csv") { Description = "Write the calendar-age density here (columns age_bp, probability)." };
        var json = new Option<bool>("--json") { Description = "Print median and ranges as JSON instead of text." };

        var command = new Command("calibrate", "Calibrate one radiocarbon date against a curve file.")
        {
            c14, error, curve, deltaR, deltaRError, csv, json,
        };
        command.SetAction(parse =>
        {
            double age = parse.GetValue(c14), err = parse.GetValue(error), dr = parse.GetValue(deltaR), drErr = parse.GetValue(deltaRError);
            if (!(err > 0)) { ctx.Fail("--error must be positive."); return ExitCodes.Usage; }
            if (!(drErr >= 0)) { ctx.Fail("--delta-r-error cannot be negative."); return ExitCodes.Usage; }
            var problems = new FindingList();
            var loaded = CalibrationCurveCache.Shared.Get(parse.GetValue(curve)!.FullName, problems);
            if (loaded is null)
            {
                foreach (var p in problems) ctx.Fail(p.ToString());
                return ExitCodes.Usage;
            }
            var result = Calibrator.Calibrate(RadiocarbonAge.FromYearsBP(age), err, loaded, dr, drErr);
            var report = new CalibrationReport(RadiocarbonAge.FromYearsBP(age), err, dr, drErr, result);
            if (parse.GetValue(json)) ctx.Out.WriteLine(report.ToJson());
            else foreach (string line in report.ToLines()) ctx.Out.WriteLine(line);
            if (!result.IsUsable)
            {
                ctx.Fail(result.Message ?? "no calendar age");
                return ExitCodes.Findings;
            }
            if (parse.GetValue(csv) is { } csvFile)
            {
                var sw = new StringWriter();
                CalibrationReport.WriteDensityCsv(sw, result.Density);
                AtomicFile.WriteAllText(csvFile.FullName, sw.ToString(), keepBackup: false);
            }
            return ExitCodes.Success;
        });
        return command;
    }
}
