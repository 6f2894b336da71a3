using StratLink.Checks;
using StratLink.Model;
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
            if (table is not null) layers[control.Id] = (table.Tops, table.Bottoms);
        }
        return layers;
    }
}
