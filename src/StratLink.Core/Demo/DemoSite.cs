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
        int trueVarveCount, SiteHistory history, IReadOnlyList<EventLayer> events)
    {
        Seed = seed;
        FileStem = fileStem;
        Project = project;
        Tables = tables;
        Truth = truth;
        VarveCoreId = varveCoreId;
        CountedVarves = countedVarves;
        TrueVarveCount = trueVarveCount;
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

    public SiteHistory History { get; }

    /// <summary>Every event layer of the site, listed as a marker or not, oldest last.</summary>
    public IReadOnlyList<EventLayer> Events { get; }

    public string ReferenceCoreId => Project.ReferenceCoreId;
}
