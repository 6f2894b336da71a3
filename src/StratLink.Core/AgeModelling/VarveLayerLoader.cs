using StratLink.Checks;
using StratLink.Model;
using StratLink.Quantities;
using StratLink.Tables;
using StratLink.Workflows;

namespace StratLink.AgeModelling;

/// <summary>Reads the varve table of every varve-count control of a project, for <see cref="AgeModeller.Run"/>.</summary>
public static class VarveLayerLoader
{
    /// <summary>
    /// Control id to varve tops and bottoms in the project unit. A table that cannot be read is left out, its
    /// problems (file, line, column) added to <paramref name="problems"/>; the age model then lists the control as not used.
    /// </summary>
    public static IReadOnlyDictionary<string, (double[] Tops, double[] Bottoms)> Load(LoadedProject project, FindingList problems, CancellationToken ct = default)
    {
        var layers = new Dictionary<string, (double[] Tops, double[] Bottoms)>();
        foreach (var control in project.Project.Ages.OfType<VarveCountControl>())
        {
            ct.ThrowIfCancellationRequested();
            var table = IntervalTableReader.Read(project.Document.Resolve(control.Table), project.Project.DepthUnit, problems, ct);
            if (table is null) continue;
            if (OutsideCore(project, control, table.Tops, table.Bottoms, problems)) continue;
            layers[control.Id] = (table.Tops, table.Bottoms);
        }
        return layers;
    }

    /// <summary>
    /// A varve interval reaching beyond its core's samples by more than one sample spacing is an error at the control's
    /// <c>table</c> key: a count cannot date sediment the core does not hold (most often a wrong core or depth unit).
    /// </summary>
    private static bool OutsideCore(LoadedProject project, VarveCountControl control, double[] tops, double[] bottoms, FindingList problems)
    {
        if (tops.Length == 0 || !project.Tables.TryGetValue(control.Core, out var core) || core.Count < 2) return false;
        var unit = project.Project.DepthUnit;
        double first = DepthUnits.Convert(core.Depths[0], core.Unit, unit), last = DepthUnits.Convert(core.Depths[^1], core.Unit, unit);
        double spacing = (last - first) / (core.Count - 1);
        double top = tops.Min(), bottom = bottoms.Max();
        if (top >= first - spacing && bottom <= last + spacing) return false;
        string key = $"ages[{control.Id}].table";
        string Num(double v) => v.ToString("0.###", System.Globalization.CultureInfo.InvariantCulture);
        problems.Add(new Finding
        {
            Severity = Severity.Error, Code = ProjectIO.ProjectCodes.VarvesOutsideCore, Item = control.Id, Core = control.Core,
            Message = $"the varve count '{control.Id}' covers {Num(top)}-{Num(bottom)} {unit.Symbol()}, outside core '{control.Core}''s sampled range {Num(first)}-{Num(last)} {unit.Symbol()}",
            File = project.Document.FilePath, Line = project.Document.Lines.LineOf(key), Field = key, Depth = top < first - spacing ? top : bottom,
        });
        return true;
    }
}
