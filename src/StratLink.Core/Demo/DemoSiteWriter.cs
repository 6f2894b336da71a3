using System.Globalization;
using System.Text;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Tables;

namespace StratLink.Demo;

/// <summary>
/// Writes a demo site to a folder: the project file, one table per core, the varve table, and the
/// hidden truth under <c>truth/</c>. Comma-separated, invariant culture, one header row, depth
/// ascending, "\n" line ends, so the same site gives byte-identical files on every machine.
/// </summary>
public static class DemoSiteWriter
{
    /// <summary>Writes every file of <paramref name="site"/> under <paramref name="dir"/>; returns the project file's path.</summary>
    public static string Write(DemoSite site, string dir)
    {
        string unit = site.Project.DepthUnit.Symbol();
        foreach (var core in site.Project.Cores)
            Save(Path.Combine(dir, core.Table), CoreTableCsv(site.Tables[core.Id]));
        foreach (var control in site.Project.Ages.OfType<Model.VarveCountControl>())
            Save(Path.Combine(dir, control.Table), VarvesCsv(site.CountedVarvesOf(control.Core)));
        foreach (var (id, truth) in site.Truth)
            Save(Path.Combine(dir, "truth", $"{id}-truth.csv"), TruthCsv(truth, unit));
        Save(Path.Combine(dir, "truth", "README.md"), TruthReadme(site));
        string projectPath = Path.Combine(dir, site.ProjectFileName);
        Save(projectPath, ProjectSchema.ModelineComment + "\n" + ProjectWriter.ToYaml(site.Project));
        Save(Path.Combine(dir, ProjectSchema.FileName), ProjectSchema.Text);
        return projectPath;
    }

    private static void Save(string path, string text) => AtomicFile.WriteAllText(path, text, keepBackup: false);

    internal static string CoreTableCsv(CoreTable table)
    {
        var sb = new StringBuilder();
        sb.Append("depth");
        foreach (string name in table.SignalNames) sb.Append(',').Append(name);
        sb.Append('\n');
        for (int i = 0; i < table.Count; i++)
        {
            sb.Append(Format(table.Depths[i], 1));
            foreach (var (name, values) in table.Signals) sb.Append(',').Append(Format(values[i], Decimals(name)));
            sb.Append('\n');
        }
        return sb.ToString();
    }

    /// <summary>ms to 0.1 SI x 1e-5, density and ln(Ca/Ti) to three decimals: finer than their noise.</summary>
    private static int Decimals(string signal) => signal == "ms" ? 1 : 3;

    internal static string VarvesCsv(IReadOnlyList<VarveLayer> varves)
    {
        var sb = new StringBuilder("depth_top,depth_bottom\n");
        foreach (var v in varves) sb.Append(Format(v.Top, 2)).Append(',').Append(Format(v.Bottom, 2)).Append('\n');
        return sb.ToString();
    }

    internal static string TruthCsv(CoreTruth truth, string unit)
    {
        var sb = new StringBuilder($"depth_{unit},true_composite_depth_{unit},true_age_bp\n");
        for (int i = 0; i < truth.Depths.Length; i++)
            sb.Append(Format(truth.Depths[i], 1)).Append(',')
                .Append(Format(truth.CompositeDepths[i], 3)).Append(',')
                .Append(Format(truth.AgesBP[i], 2)).Append('\n');
        return sb.ToString();
    }

    private static string TruthReadme(DemoSite site) =>
        $"The files here hold the hidden truth of the demo project {site.ProjectFileName} (generated with seed {site.Seed}). "
        + $"For every sample of a core, <core>-truth.csv gives its depth, its true composite depth (the depth of the same age in the "
        + $"reference core {site.ReferenceCoreId}) and its true calendar age in cal BP. They are for checking alignments and age models, "
        + $"not input to them. The site \"{site.Project.Site.Name}\", its cores, events and data are invented.\n\n"
        + $"The ages: the sediment is laminated, and the reference core {site.ReferenceCoreId} carries a varve count over its whole "
        + $"length ({site.ReferenceCountedVarves.Count} varves counted, {site.ReferenceTrueVarveCount} true), anchored at its intact top in the "
        + $"coring year with a 2 % miscount rate, and the freeze core {site.VarveCoreId} one over its metre ({site.CountedVarves.Count} counted, "
        + $"{site.TrueVarveCount} true). The age model uses every control: the reference count carries the ensemble, the coring year, the "
        + $"tephra ages and the freeze-core count weigh its members. Each core lists its event layers (turbidites, flood beds, tephras) "
        + $"under events: the age model cuts them out as instantaneous deposits. The true climate "
        + $"signal holds AR(1) red noise, cycles of 11 yr (amplitude 0.6) and 88 yr (0.8), and regime shifts at "
        + string.Join(" and ", site.History.RegimeShifts.Select(r => FormattableString.Invariant($"{r.AgeBP:0} cal BP ({r.Step:+0.0;-0.0})")))
        + "; the varve chronology keeps the 11-yr cycle in most age-model members.\n";

    /// <summary>Invariant, fixed decimals; a value that rounds to zero is written without a minus sign.</summary>
    private static string Format(double value, int decimals) =>
        (Math.Round(value, decimals) + 0.0).ToString("F" + decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);
}
