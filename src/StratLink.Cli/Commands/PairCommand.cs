using System.CommandLine;
using System.Globalization;
using StratLink.Alignment;
using StratLink.Checks;
using StratLink.Export;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Tables;

namespace StratLink.Cli.Commands;

/// <summary>
/// <c>stratlink pair A.csv B.csv</c>: aligns two tables directly by dynamic time warping, without a
/// project; prints the distance and optionally writes the path as 1-based row pairs.
/// </summary>
internal static class PairCommand
{
    public static Command Create(CliContext ctx)
    {
        var tableA = new Argument<string>("a") { Description = "First table (the query, rows i): delimited text with a header line." };
        var tableB = new Argument<string>("b") { Description = "Second table (the reference, rows j)." };
        var signals = new Option<string?>("--signals") { Description = "Comma-separated signal columns to align on (default: every numeric column both tables share)." };
        var depthColumn = new Option<string>("--depth-column")
        {
            Description = "Column that orders the rows; a table without it is taken in file order (then name --signals).",
            DefaultValueFactory = _ => "depth",
        };
        var pattern = new Option<string>("--pattern")
        {
            Description = $"Step pattern: {string.Join(", ", StepPattern.Names)}.",
            DefaultValueFactory = _ => StepPattern.Symmetric2.Name,
        };
        var window = new Option<int?>("--window") { Description = "Sakoe-Chiba window: rows i and j may match only when |i - j| <= W." };
        var openBegin = new Option<bool>("--open-begin") { Description = "A's first row may match any row of B (patterns normalised by A's length)." };
        var openEnd = new Option<bool>("--open-end") { Description = "A's last row may match any row of B (normalisable patterns)." };
        var pathFile = new Option<string?>("--path") { Description = "Write the path here: index_a,index_b (1-based, every lattice cell visited; .tsv for tabs)." };

        var command = new Command("pair", "Align two tables directly by dynamic time warping and print the distance.")
        {
            tableA, tableB, signals, depthColumn, pattern, window, openBegin, openEnd, pathFile,
        };
        command.SetAction(parse =>
        {
            string fileA = parse.GetValue(tableA)!, fileB = parse.GetValue(tableB)!;
            string depth = parse.GetValue(depthColumn)!;
            string patternName = parse.GetValue(pattern)!;
            if (StepPattern.Find(patternName) is not { } stepPattern)
            {
                ctx.Fail($"--pattern: unknown step pattern '{patternName}' (one of {string.Join(", ", StepPattern.Names)}).");
                return ExitCodes.Usage;
            }
            int? w = parse.GetValue(window);
            if (w < 0)
            {
                ctx.Fail($"--window: {w} is negative; give a window of 0 or more rows.");
                return ExitCodes.Usage;
            }
            var options = new PairOptions { Pattern = stepPattern, Window = w, OpenBegin = parse.GetValue(openBegin), OpenEnd = parse.GetValue(openEnd) };
            try
            {
                DtwSolver.Validate(stepPattern, new DtwOptions { OpenBegin = options.OpenBegin, OpenEnd = options.OpenEnd });
            }
            catch (ArgumentException e)
            {
                ctx.Fail($"--pattern {stepPattern.Name}{(options.OpenBegin ? " --open-begin" : "")}{(options.OpenEnd ? " --open-end" : "")}: {e.Message}");
                return ExitCodes.Usage;
            }

            string[] wanted = (parse.GetValue(signals) ?? "").Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);
            var problems = new FindingList();
            var a = ReadTable(fileA, "A", depth, wanted, problems, ctx.Cancellation);
            var b = ReadTable(fileB, "B", depth, wanted, problems, ctx.Cancellation);
            foreach (var f in problems.Where(f => f.Severity != Severity.Note)) ctx.Error.WriteLine(f.ToString());
            if (a is null || b is null) return ExitCodes.Usage;

            IReadOnlyList<string> used = wanted.Length > 0 ? wanted : a.SignalNames.Where(b.Signals.ContainsKey).ToArray();
            if (used.Count == 0)
            {
                ctx.Fail($"{fileA} and {fileB} share no numeric column besides '{depth}'; name the signals with --signals.");
                return ExitCodes.Usage;
            }
            PairResult result;
            try
            {
                result = PairAligner.Align(a, b, used, options, ctx.Cancellation);
            }
            catch (Exception e) when (e is ArgumentException or InvalidOperationException)
            {
                ctx.Fail(e.Message);
                return ExitCodes.Usage;
            }
            Report(ctx.Out, fileA, a, fileB, b, used, options, result);

            if (parse.GetValue(pathFile) is { } outFile)
            {
                try
                {
                    WritePath(outFile, result);
                }
                catch (Exception e) when (e is IOException or UnauthorizedAccessException)
                {
                    ctx.Fail($"--path: cannot write {outFile}: {e.Message}");
                    return ExitCodes.Usage;
                }
                ctx.Out.WriteLine($"path written       {outFile}");
            }
            return ExitCodes.Success;
        });
        return command;
    }

    /// <summary>
    /// The table ordered by its depth column when it has one (depths checked to increase), else in
    /// file order with the row number as depth; rows are then found by the first named signal.
    /// </summary>
    private static CoreTable? ReadTable(string path, string id, string depthColumn, string[] signals, FindingList problems, CancellationToken ct)
    {
        var spec = new CoreSpec { Id = id, Table = path, DepthColumn = depthColumn, Signals = [.. signals] };
        var found = new FindingList();
        var table = CoreTableReader.Read(path, spec, DepthUnit.Centimetre, found, ct);
        bool noDepthColumn = table is null && found.Any(f => f.Code == ProjectCodes.TableNoHeader && f.Field == depthColumn);
        if (!noDepthColumn)
        {
            problems.AddRange(found);
            return table;
        }
        if (signals.Length == 0)
        {
            problems.AddError(ProjectCodes.TableNoHeader,
                $"no column '{depthColumn}' to order the rows by; name it with --depth-column, or name the signals with --signals to take the rows in file order", path, null, depthColumn);
            return null;
        }
        var raw = DelimitedTextReader.Read(path, new DelimitedReadOptions { KeyColumn = signals[0] }, problems, ct);
        if (raw is null) return null;
        var columns = new Dictionary<string, double[]>(StringComparer.Ordinal);
        foreach (string s in signals)
            if (raw.Numeric.TryGetValue(s, out var values)) columns[s] = values;
        var rowOrder = new double[raw.RowCount];
        for (int r = 0; r < rowOrder.Length; r++) rowOrder[r] = r + 1;
        return new CoreTable(id, DepthUnit.Centimetre, rowOrder, columns, path, raw.Lines);
    }

    private static void Report(TextWriter o, string fileA, CoreTable a, string fileB, CoreTable b, IReadOnlyList<string> signals, PairOptions options, PairResult r)
    {
        var inv = CultureInfo.InvariantCulture;
        string window = options.Window is int w ? $"Sakoe-Chiba window {w.ToString(inv)}" : "no window";
        string ends = (options.OpenBegin, options.OpenEnd) switch
        {
            (true, true) => ", open begin and end",
            (true, false) => ", open begin",
            (false, true) => ", open end",
            _ => "",
        };
        o.WriteLine($"A                  {fileA} ({a.Count.ToString(inv)} rows)");
        o.WriteLine($"B                  {fileB} ({b.Count.ToString(inv)} rows)");
        o.WriteLine($"signals            {string.Join(", ", signals)}");
        o.WriteLine($"step pattern       {r.Pattern.Name}, {window}{ends}");
        o.WriteLine($"distance           {r.Distance.ToString("R", inv)}");
        if (r.NormalisedDistance is double nd)
            o.WriteLine($"normalised         {nd.ToString("R", inv)} ({(r.Pattern.Normalisation == StepNormalisation.N ? "over A's length" : "over A's length + B's matched length")})");
        o.WriteLine($"path               {r.IndexA.Length.ToString(inv)} cells, A rows {r.IndexA[0].ToString(inv)}-{r.IndexA[^1].ToString(inv)} to B rows {r.IndexB[0].ToString(inv)}-{r.IndexB[^1].ToString(inv)}");
    }

    private static void WritePath(string file, PairResult r)
    {
        var format = string.Equals(Path.GetExtension(file), ".tsv", StringComparison.OrdinalIgnoreCase) ? TableFormat.Tsv : TableFormat.Csv;
        AtomicFile.Write(file, w =>
        {
            var t = new DelimitedTableWriter(w, format);
            t.Header(["index_a", "index_b"]);
            for (int k = 0; k < r.IndexA.Length; k++)
            {
                t.Number(r.IndexA[k]).Number(r.IndexB[k]);
                t.EndRow();
            }
        }, keepBackup: false);
    }
}
