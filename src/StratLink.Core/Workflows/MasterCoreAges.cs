using System.Globalization;
using MathNet.Numerics.Interpolation;
using StratLink.Checks;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Tables;

namespace StratLink.Workflows;

/// <summary>
/// Dates a target given as signal against depth (a dated master core) by its own age model: ages (and
/// their errors) linear in depth between the model's rows, in the target's age unit. Target rows above
/// the model's first depth or below its last are not extrapolated (an age model says nothing there):
/// their age is NaN, so the loader leaves them out, with a note.
/// </summary>
internal static class MasterCoreAges
{
    public static (double[] Ages, double[]? Errors)? Read(string file, DatedTargetAgeModel model, CoreTable target, DepthUnit unit, SourceMap lines,
        FindingList problems, CancellationToken ct)
    {
        void Error(string key, string code, string message) =>
            problems.AddError(code, message, lines.File, lines.LineOf("target.age_model." + key) ?? lines.LineOf("target.age_model"), "target.age_model." + key);
        var columns = new CoreSpec
        {
            Id = "target age model",
            Table = model.Table,
            DepthColumn = model.DepthColumn,
            HeaderLine = model.HeaderLine,
            Signals = model.ErrorColumn is { } e ? [model.AgeColumn, e] : [model.AgeColumn],
        };
        CoreTable? table;
        try
        {
            table = CoreTableReader.Read(file, columns, unit, problems, ct);
        }
        catch (Exception ex) when (ex is not OperationCanceledException)
        {
            problems.AddError(ProjectCodes.Unreadable, $"cannot read the target's age model table: {ex.Message}", file);
            return null;
        }
        if (table is null) return null;
        foreach (string column in columns.Signals.Where(c => !table.Signals.ContainsKey(c)))
        {
            Error(column == model.AgeColumn ? "age_column" : "error_column", ProjectCodes.TableMissingColumn,
                $"the target's age model table has no numeric column '{column}'; it has: {string.Join(", ", table.SignalNames)}");
            return null;
        }
        var rawAges = table.Signals[model.AgeColumn];
        var rawErrors = model.ErrorColumn is { } ec ? table.Signals[ec] : null;
        var keep = Enumerable.Range(0, table.Count).Where(i => double.IsFinite(rawAges[i]) && (rawErrors is null || double.IsFinite(rawErrors[i]))).ToArray();
        if (keep.Length < 2)
        {
            Error("table", ProjectCodes.TableEmpty, $"the target's age model has {keep.Length} row(s) with a depth and an age; dating the target needs at least two");
            return null;
        }
        double[] z = [.. keep.Select(i => table.Depths[i])], age = [.. keep.Select(i => rawAges[i])];
        double[]? err = rawErrors is null ? null : [.. keep.Select(i => rawErrors[i])];
        for (int k = 1; k < age.Length; k++)
        {
            if (age[k] > age[k - 1]) continue;
            int line = table.SourceLines?[keep[k]] ?? 0;
            problems.AddError(ProjectCodes.TableAgeOrder,
                $"line {line}: age {Text(age[k])} at depth {Text(z[k])} is not older than {Text(age[k - 1])} at {Text(z[k - 1])} above it; an age model's ages must increase with depth",
                file, line == 0 ? null : line, model.AgeColumn);
            return null;
        }

        var ageAt = LinearSpline.InterpolateSorted(z, age);
        var errorAt = err is null ? null : LinearSpline.InterpolateSorted(z, err);
        var ages = new double[target.Count];
        var errors = err is null ? null : new double[target.Count];
        int outside = 0;
        for (int i = 0; i < target.Count; i++)
        {
            double d = target.Depths[i];
            if (d < z[0] || d > z[^1])
            {
                ages[i] = double.NaN;
                if (errors is not null) errors[i] = double.NaN;
                outside++;
                continue;
            }
            ages[i] = ageAt.Interpolate(d);
            if (errors is not null) errors[i] = errorAt!.Interpolate(d);
        }
        if (outside > 0)
            problems.AddNote(ProjectCodes.TableBeyondAgeModel,
                $"{outside} of the target's {target.Count} rows lie outside its age model's depths ({Text(z[0])} to {Text(z[^1])}) and are left out: an age model is not extrapolated",
                target.SourceFile, null, "target.age_model");
        return (ages, errors);
    }

    private static string Text(double v) => v.ToString("0.###", CultureInfo.InvariantCulture);
}
