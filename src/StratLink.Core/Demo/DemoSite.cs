using StratLink.Model;
using StratLink.Tables;

namespace StratLink.Demo;

/// <summary>
/// One generated demo site, in memory: the project, the core tables, the freeze core's counted varves
/// and the hidden truth (true history, event layers, true composite depth and age of every sample).
/// </summary>
public sealed class DemoSite
{
    internal DemoSite(int seed, string fileStem, Project project, IReadOnlyDictionary<string, CoreTable> tables,
        IReadOnlyDictionary<string, CoreTruth> truth, string varveCoreId, IReadOnlyList<VarveLayer> countedVarves,
        int trueVarveCount, IReadOnlyList<VarveLayer> referenceCountedVarves, int referenceTrueVarveCount, SiteHistory history, IReadOnlyList<EventLayer> events)
    {
        Seed = seed;
        FileStem = fileStem;
        Project = project;
        Tables = tables;
        Truth = truth;
        VarveCoreId = varveCoreId;
        CountedVarves = countedVarves;
        TrueVarveCount = trueVarveCount;
        ReferenceCountedVarves = referenceCountedVarves;
        ReferenceTrueVarveCount = referenceTrueVarveCount;
        History = history;
        Events = events;
    }

    /// <summary>The seed the site was generated from.</summary>
    public int Seed { get; }

    /// <summary>Project file name without <c>.stratlink.yaml</c>.</summary>
    public string FileStem { get; }

    public string ProjectFileName => FileStem + ".stratlink.yaml";

    /// <summary>The project as written; table paths are relative to the project file.</summary>
    public Project Project { get; }

    /// <summary>Core id to its samples (gaps hold no rows), in the project's core order.</summary>
    public IReadOnlyDictionary<string, CoreTable> Tables { get; }

    /// <summary>Core id to the hidden truth of its samples.</summary>
    public IReadOnlyDictionary<string, CoreTruth> Truth { get; }

    /// <summary>The core with annual varves (the freeze core).</summary>
    public string VarveCoreId { get; }

    /// <summary>The varves as counted (with the odd missed or doubled varve), top down.</summary>
    public IReadOnlyList<VarveLayer> CountedVarves { get; }

    /// <summary>Number of whole true varves inside the varved core.</summary>
    public int TrueVarveCount { get; }

    /// <summary>The reference piston core's varves as counted over its whole length, top down.</summary>
    public IReadOnlyList<VarveLayer> ReferenceCountedVarves { get; }

    /// <summary>Number of whole true varves inside the reference core.</summary>
    public int ReferenceTrueVarveCount { get; }

    /// <summary>The counted varves of a core that has a varve table (the freeze core or the reference core).</summary>
    public IReadOnlyList<VarveLayer> CountedVarvesOf(string coreId) =>
        coreId == VarveCoreId ? CountedVarves
        : coreId == ReferenceCoreId ? ReferenceCountedVarves
        : throw new ArgumentException($"Core {coreId} has no varve count.", nameof(coreId));

    public SiteHistory History { get; }

    /// <summary>Every event layer of the site, listed as a marker or not, oldest last.</summary>
    public IReadOnlyList<EventLayer> Events { get; }

    public string ReferenceCoreId => Project.ReferenceCoreId;
}
