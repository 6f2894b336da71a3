using StratLink.Cli.Dashboard.Drawing;
using StratLink.Cli.Dashboard.Keys;

namespace StratLink.Cli.Dashboard;

/// <summary>The help screen: every key from the key table, grouped by where it works, then the legend and cautions.</summary>
public static class HelpText
{
    public const string EventLayerCaution =
        "Counts and recurrence of event layers (turbidites, flood beds) read from these ties are " +
        "interpretations: they need review by qualified specialists and defer to local codes and " +
        "practice. They are not a hazard assessment.";

    public static IReadOnlyList<string> Lines(GlyphSet glyphs)
    {
        var lines = new List<string>();
        void Section(string title, IEnumerable<KeyEntry> entries)
        {
            lines.Add("## " + title);
            foreach (var e in entries) lines.Add($"  {e.KeysText,-18} {e.Help}");
            lines.Add("");
        }
        Section("Everywhere", KeyTable.Entries.Where(e => e.Everywhere));
        foreach (var screen in Screens.All)
        {
            var entries = KeyTable.Entries.Where(e => !e.Everywhere && e.AppliesTo(screen)).ToList();
            if (entries.Count > 0) Section($"On the {screen.Title()} screen", entries);
        }
        lines.Add("## What the logs show");
        lines.Add($"  {"[P1 0-880]",-18} the strip above the logs: every core with its depth span; the shown ones in brackets");
        lines.Add($"  {(glyphs.Unicode ? "⡇⠸ braille dots" : "* stars"),-18} the signal, min to max in each dot row, on its 2-98 % range (the clipped share is below the logs)");
        lines.Add($"  {glyphs.Gap,-18} gap: no recovery, nothing known");
        lines.Add($"  {glyphs.Disturbed,-18} disturbed: left out of alignment and splice");
        lines.Add($"  {glyphs.TieMark + " " + glyphs.SelectedTieMark,-18} a tie (marker layer) in this core, the selected tie; solid lines join it across logs");
        lines.Add($"  {glyphs.TieThrough,-18} a tie passing a log that does not hold it, on its way to a log further on");
        lines.Add($"  {"dotted lines",-18} the alignment: which depths correspond after the last run");
        lines.Add($"  {(glyphs.Unicode ? "▶" : ">"),-18} the depth cursor; the active log's cursor row is highlighted");
        lines.Add($"  {glyphs.ActiveLog + " " + glyphs.PartnerLog,-18} before the active log's name, and before the partner that new ties go to");
        lines.Add("");
        lines.Add("## What the ages and composite show (after r)");
        lines.Add($"  {glyphs.Band,-18} 95 % band: ages over the model's members, composite over cores");
        lines.Add($"  {glyphs.ErrorBar + glyphs.ControlMark + glyphs.ErrorBar,-18} an age control: given (calibrated) age and its 95 % range ({glyphs.ExcludedControlMark} when left out)");
        lines.Add($"  {"A B strip",-18} the splice: the core each depth is taken from (legend below)");
        lines.Add($"  {(glyphs.Unicode ? "◀" : "<"),-18} a regime shift found by p (listed below with the periods)");
        lines.Add("");
        lines.Add("## Colour");
        lines.Add("  Sixteen colours, or none when NO_COLOR is set; every mark above is a glyph or a");
        lines.Add("  letter as well, so nothing is lost in monochrome.");
        lines.Add("");
        lines.Add("## Saving");
        lines.Add("  Every edit is written at once to a recovery file beside the project");
        lines.Add("  (.NAME.recovery.yaml); the next start offers it back if the session was lost.");
        lines.Add("  Saving replaces the project file atomically and keeps the old one as NAME.bak.");
        lines.Add("");
        lines.Add("## Caution");
        foreach (string part in Wrap(EventLayerCaution, 76)) lines.Add("  " + part);
        return lines;
    }

    private static IEnumerable<string> Wrap(string text, int width)
    {
        var line = new System.Text.StringBuilder();
        foreach (string word in text.Split(' '))
        {
            if (line.Length > 0 && line.Length + 1 + word.Length > width)
            {
                yield return line.ToString();
                line.Clear();
            }
            if (line.Length > 0) line.Append(' ');
            line.Append(word);
        }
        if (line.Length > 0) yield return line.ToString();
    }
}
