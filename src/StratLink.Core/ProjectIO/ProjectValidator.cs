using StratLink.Checks;
using StratLink.Model;

namespace StratLink.ProjectIO;

/// <summary>Checks of a project that need no table: ids, cross references, intervals.</summary>
internal static class ProjectValidator
{
    private static readonly System.Text.RegularExpressions.Regex IdPattern = new("^[A-Za-z0-9._-]+$");

    public static void Validate(Project p, FindingList problems, SourceMap map)
    {
        void Error(string code, string path, string message) =>
            problems.AddError(code, message, map.File, map.LineOf(path), path);

        var coreIds = new HashSet<string>(StringComparer.Ordinal);
        foreach (var c in p.Cores)
        {
            string path = $"cores[{c.Id}]";
            if (!IdPattern.IsMatch(c.Id)) Error(ProjectCodes.InvalidValue, path + ".id", $"core id '{c.Id}' may only hold letters, digits, '.', '_' and '-'");
            if (!coreIds.Add(c.Id)) Error(ProjectCodes.DuplicateId, path + ".id", $"core id '{c.Id}' is used twice");
            CheckOverlaps(c.Gaps, path + ".gaps", "gaps", problems, map);
        }
        DuplicateIds(p.Markers.Select(m => m.Id), "markers", "marker", problems, map);
        DuplicateIds(p.Ages.Select(a => a.Id), "ages", "age control", problems, map);

        foreach (var m in p.Markers)
        {
            var seen = new HashSet<string>();
            foreach (var d in m.Depths)
            {
                string path = $"markers[{m.Id}].depths.{d.CoreId}";
                if (!coreIds.Contains(d.CoreId)) Error(ProjectCodes.UnknownCore, path, $"marker '{m.Id}' names core '{d.CoreId}', which the project does not have");
                if (!seen.Add(d.CoreId)) Error(ProjectCodes.DuplicateId, path, $"marker '{m.Id}' gives core '{d.CoreId}' twice");
            }
            if (m.Depths.Count == 1)
                problems.AddWarning("project.single-core-marker", $"marker '{m.Id}' is in one core only, so it ties nothing", map.File, map.LineOf($"markers[{m.Id}]"), $"markers[{m.Id}]");
        }

        var markerIds = p.Markers.Select(m => m.Id).ToHashSet(StringComparer.Ordinal);
        foreach (var a in p.Ages)
        {
            string path = $"ages[{a.Id}]";
            string? core = a switch
            {
                CalendarAgeControl c => c.Core,
                RadiocarbonAgeControl r => r.Core,
                VarveCountControl v => v.Core,
                _ => null,
            };
            if (core is not null && !coreIds.Contains(core))
                Error(ProjectCodes.UnknownCore, path + ".core", $"age control '{a.Id}' names core '{core}', which the project does not have");
            if (a is CalendarAgeControl { Marker: string mk } && !markerIds.Contains(mk))
                Error(ProjectCodes.UnknownMarker, path + ".marker", $"age control '{a.Id}' names marker '{mk}', which the project does not have");
        }

        if (p.Alignment.Reference is string reference && !coreIds.Contains(reference))
            Error(ProjectCodes.UnknownCore, "alignment.reference", $"the reference core '{reference}' is not one of the project's cores");
        if (p.Composite.Splice is { } splice)
            foreach (var iv in splice.Where(iv => !coreIds.Contains(iv.Core)))
                Error(ProjectCodes.UnknownCore, "composite.splice", $"splice interval names core '{iv.Core}', which the project does not have");
        if (p.Target is { } target)
            foreach (string core in target.Cores.Where(c => !coreIds.Contains(c)))
                Error(ProjectCodes.UnknownCore, "target.cores", $"the target dates core '{core}', which the project does not have");
        if (p.Cores.Count == 0 && map.LineOf("cores") is null)
            problems.AddError(ProjectCodes.MissingKey, "required key 'cores' is missing", map.File, 1, "cores");
    }

    private static void DuplicateIds(IEnumerable<string> ids, string section, string what, FindingList problems, SourceMap map)
    {
        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (string id in ids)
            if (!seen.Add(id))
                problems.AddError(ProjectCodes.DuplicateId, $"{what} id '{id}' is used twice", map.File, map.LineOf($"{section}[{id}]"), $"{section}[{id}].id");
    }

    private static void CheckOverlaps(IReadOnlyList<Quantities.DepthInterval> intervals, string path, string what, FindingList problems, SourceMap map)
    {
        var sorted = intervals.OrderBy(i => i.Top).ToList();
        for (int i = 1; i < sorted.Count; i++)
            if (sorted[i].Top < sorted[i - 1].Bottom)
                problems.AddWarning("project.overlapping-intervals", $"{what} {sorted[i - 1]} and {sorted[i]} overlap", map.File, map.LineOf(path), path);
    }
}
