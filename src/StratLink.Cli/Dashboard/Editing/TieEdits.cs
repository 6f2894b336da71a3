using System.Collections.Immutable;
using System.Text.RegularExpressions;
using StratLink.Model;

namespace StratLink.Cli.Dashboard.Editing;

/// <summary>
/// Edits of marker ties and age controls as pure functions from one project to the next. Each
/// returns the new project, or an explanation when the edit cannot be made.
/// </summary>
public static partial class TieEdits
{
    [GeneratedRegex("^[A-Za-z0-9._-]+$")]
    private static partial Regex IdPattern();

    /// <summary>Depths written by the dashboard are rounded to this many decimals of the project unit.</summary>
    public const int DepthDecimals = 2;

    public static double RoundDepth(double depth) => Math.Round(depth, DepthDecimals, MidpointRounding.AwayFromZero);

    /// <summary>The first free id of the form <c>tie-N</c>.</summary>
    public static string NextTieId(Project project)
    {
        for (int n = 1; ; n++)
        {
            string id = $"tie-{n}";
            if (project.FindMarker(id) is null) return id;
        }
    }

    /// <summary>A new tie (marker of kind <c>other</c>) joining two cores at the given depths.</summary>
    public static EditOutcome AddTie(Project p, string coreA, double depthA, string coreB, double depthB)
    {
        if (coreA == coreB) return EditOutcome.Refused("a tie joins two different cores");
        string id = NextTieId(p);
        var marker = new MarkerSpec
        {
            Id = id,
            Kind = MarkerKind.Other,
            Depths = [new MarkerDepth(coreA, p.Depth(RoundDepth(depthA))), new MarkerDepth(coreB, p.Depth(RoundDepth(depthB)))],
        };
        return EditOutcome.Done(p with { Markers = p.Markers.Add(marker) }, $"add tie {id}", id);
    }

    /// <summary>Sets the tie's depth in <paramref name="core"/> (adding the core when the tie lacks it).</summary>
    public static EditOutcome MoveTie(Project p, string markerId, string core, double depth)
    {
        if (p.FindMarker(markerId) is not { } m) return EditOutcome.Refused($"there is no tie '{markerId}'");
        var entry = new MarkerDepth(core, p.Depth(RoundDepth(depth)));
        int i = m.Depths.FindIndex(d => d.CoreId == core);
        var depths = i >= 0 ? m.Depths.SetItem(i, entry) : m.Depths.Add(entry);
        string verb = i >= 0 ? "move" : "extend";
        return EditOutcome.Done(Replace(p, m, m with { Depths = depths }), $"{verb} tie {markerId} in {core}", markerId);
    }

    /// <summary>Removes the tie with all its cores; refused while an age control is placed at it.</summary>
    public static EditOutcome DeleteTie(Project p, string markerId)
    {
        if (p.FindMarker(markerId) is not { } m) return EditOutcome.Refused($"there is no tie '{markerId}'");
        var users = p.Ages.OfType<CalendarAgeControl>().Where(a => a.Marker == markerId).Select(a => a.Id).ToList();
        if (users.Count > 0)
            return EditOutcome.Refused($"age control {string.Join(", ", users)} is placed at tie {markerId}; change that first");
        return EditOutcome.Done(p with { Markers = p.Markers.Remove(m) }, $"delete tie {markerId}", null);
    }

    /// <summary>Renames a tie and every age control placed at it.</summary>
    public static EditOutcome RenameTie(Project p, string markerId, string newId)
    {
        newId = newId.Trim();
        if (p.FindMarker(markerId) is not { } m) return EditOutcome.Refused($"there is no tie '{markerId}'");
        if (newId == markerId) return EditOutcome.Refused("the name is unchanged");
        if (!IdPattern().IsMatch(newId)) return EditOutcome.Refused($"'{newId}' is not a valid name (letters, digits, '.', '_' and '-')");
        if (p.FindMarker(newId) is not null) return EditOutcome.Refused($"a tie named '{newId}' exists already");
        var ages = p.Ages.Select(a => a is CalendarAgeControl c && c.Marker == markerId ? c with { Marker = newId } : a).ToImmutableList();
        var renamed = Replace(p, m, m with { Id = newId }) with { Ages = ages };
        return EditOutcome.Done(renamed, $"rename tie {markerId} to {newId}", newId);
    }

    public static EditOutcome SetKind(Project p, string markerId, MarkerKind kind)
    {
        if (p.FindMarker(markerId) is not { } m) return EditOutcome.Refused($"there is no tie '{markerId}'");
        if (m.Kind == kind) return EditOutcome.Refused($"tie {markerId} is a {kind.Name()} already");
        return EditOutcome.Done(Replace(p, m, m with { Kind = kind }), $"make tie {markerId} a {kind.Name()}", markerId);
    }

    /// <summary>Leaves an age control out of the age model, or takes it back in.</summary>
    public static EditOutcome ToggleExclude(Project p, string controlId)
    {
        var control = p.Ages.FirstOrDefault(a => a.Id == controlId);
        if (control is null) return EditOutcome.Refused($"there is no age control '{controlId}'");
        var changed = control with { Exclude = !control.Exclude };
        string what = changed.Exclude ? "exclude" : "include";
        return EditOutcome.Done(p with { Ages = p.Ages.Replace(control, changed) }, $"{what} age control {controlId}", controlId);
    }

    private static Project Replace(Project p, MarkerSpec old, MarkerSpec updated) =>
        p with { Markers = p.Markers.Replace(old, updated) };
}
