using System.Globalization;
using StratLink.AgeModelling;
using StratLink.Checks;
using StratLink.Compositing;
using StratLink.Workflows;

namespace StratLink.Cli.Dashboard.Results;

/// <summary>Reads the library's <see cref="BuildResult"/> into what the dashboard's screens draw.</summary>
public static class RunResultsFromBuild
{
    public static RunResults Read(BuildResult build, DateTimeOffset finishedAt)
    {
        var ages = build.Ages;
        var skipped = new List<string>();
        AgeCurve? curve = null;
        if (ages.IsBuilt)
        {
            var grid = build.Composite.Grid;
            double top = ages.Composite?.Depths.FirstOrDefault() ?? grid.ValueAt(0);
            double bottom = ages.Composite is { Count: > 0 } c ? c.Depths[^1] : grid.ValueAt(grid.Count - 1);
            curve = new AgeCurve(ages, top, bottom, ages.Composite, ages.CompositeEvents);
        }
        else
        {
            string why = ages.Findings.FirstOrDefault(f => f.Severity == Severity.Error)?.Message ?? "no usable age controls";
            skipped.Add("ages: " + why);
        }
        // The file's own problems are listed by the findings screen already; the run adds the rest.
        var fileProblems = new HashSet<Finding>(build.Project.Problems, ReferenceEqualityComparer.Instance);
        return new RunResults
        {
            Project = build.Project.Project,
            FinishedAt = finishedAt,
            Alignment = build.Alignment,
            Ages = curve,
            Controls = ages.Controls.Select(Control).ToList(),
            Composite = Composite(build.Composite),
            Checks = build.Findings.Where(f => !fileProblems.Contains(f)).ToList(),
            Build = build,
            Skipped = skipped,
        };
    }

    /// <summary>
    /// The control's given age (calibrated for radiocarbon) as its error bar, so it can be compared with the
    /// modelled curve; varve counts, which have no given age distribution, show their modelled age instead.
    /// </summary>
    internal static ControlOutcome Control(AgeControlSummary s)
    {
        double? depth = double.IsNaN(s.CompositeTop) ? null : s.CompositeTop;
        var hpd = s.InputHpd95;
        double median, lo, hi;
        string? ranges;
        if (hpd.Length > 0)
        {
            median = s.InputMedianBP;
            lo = hpd.Min(r => r.YoungBP);
            hi = hpd.Max(r => r.OldBP);
            ranges = string.Join(",", hpd.Select(r => $"{Int(r.YoungBP)}..{Int(r.OldBP)}"));
        }
        else
        {
            (median, lo, hi) = (s.ModelledMedianBP, s.ModelledLoBP, s.ModelledHiBP);
            ranges = double.IsNaN(lo) ? null : $"{Num(lo)}..{Num(hi)}";
        }
        string? posterior = double.IsNaN(s.ModelledLoBP) ? null : $"{Num(s.ModelledLoBP)}..{Num(s.ModelledHiBP)}";
        return new ControlOutcome(s.Id, depth, median, lo, hi, Flags(s), ranges, posterior, s.OutlierShare);
    }

    private static string Flags(AgeControlSummary s)
    {
        var flags = new List<string>();
        if (s.Problem is { } problem) flags.Add("unusable: " + problem);
        if (s.Excluded) flags.Add("excluded");
        if (s.Flagged) flags.Add("FLAGGED");
        if (s.OutlierShare >= AgeModeller.OutlierWarnShare) flags.Add("OUTLIER");
        if (!double.IsNaN(s.ContradictionShare) && s.ContradictionShare > 0)
            flags.Add($"out of order {Num(s.ContradictionShare * 100)}%");
        if (!double.IsNaN(s.LeaveOneOutZ)) flags.Add($"z {s.LeaveOneOutZ.ToString("+0.0;-0.0", CultureInfo.InvariantCulture)}");
        if (s.Used && !double.IsNaN(s.ModelledMedianBP)) flags.Add($"model {Num(s.ModelledMedianBP)}");
        return string.Join("; ", flags);
    }

    private static CompositeRecords Composite(CompositeResult composite)
    {
        var grid = composite.Grid;
        var depths = new double[grid.Count];
        for (int i = 0; i < depths.Length; i++) depths[i] = grid.ValueAt(i);
        double[]? ages = composite.Ages?.MedianBP.ToArray();
        var signals = composite.Records
            .Select(r => new CompositeSignal(r.Signal, depths, r.Mean.ToArray(), r.Lo.ToArray(), r.Hi.ToArray(), ages, r.Standardised))
            .ToList();
        var splice = composite.Splice.Pieces
            .Select(p => new SpliceSegment(p.Core, p.From.In(grid.Unit), p.To.In(grid.Unit)))
            .ToList();
        return new CompositeRecords(signals, splice, []);
    }

    private static string Int(int v) => v.ToString(CultureInfo.InvariantCulture);

    private static string Num(double v) => v.ToString(Math.Abs(v) >= 100 ? "0" : "0.#", CultureInfo.InvariantCulture);
}
