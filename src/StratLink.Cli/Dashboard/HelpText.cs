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
            foreach (var e in entries) Legend(e.KeysText, e.Help);
            lines.Add("");
        }
        // A mark and what it means, the meaning wrapped beside the mark's column so every line fits 80 columns.
        void Legend(string mark, string meaning)
        {
            var parts = Wrap(meaning, 55).ToList();
            for (int i = 0; i < parts.Count; i++) lines.Add($"  {(i == 0 ? mark : ""),-18} {parts[i]}");
        }
        void Paragraph(string text)
        {
            foreach (string part in Wrap(text, 76)) lines.Add("  " + part);
        }
        Section("Everywhere", KeyTable.Entries.Where(e => e.Everywhere));
        foreach (var screen in Screens.All)
        {
            var entries = KeyTable.Entries.Where(e => !e.Everywhere && e.AppliesTo(screen)).ToList();
            if (entries.Count > 0) Section($"On the {screen.Title()} screen", entries);
        }
        lines.Add("## What the logs show");
        Legend("[P1 0-880]", "the strip above the logs: every core with its depth span; the shown ones in brackets");
        Legend(glyphs.Unicode ? "⡇⠸ braille dots" : "* stars", "the signal, min to max in each dot row, on its 2-98 % range (the clipped share is below the logs)");
        Legend(glyphs.Gap, "gap: no recovery, nothing known");
        Legend(glyphs.Disturbed, "disturbed: left out of alignment and splice");
        Legend(glyphs.EventLayer, "event layer: an instantaneous deposit, cut out of the ages and the stacks, kept for alignment");
        Legend(glyphs.TieMark + " " + glyphs.EventTieMark + " " + glyphs.SelectedTieMark, "a tie (marker layer) in this core: a tephra or other layer, an event layer (turbidite, flood, event), the selected tie; solid lines join it across logs");
        Legend(glyphs.TieThrough, "a tie passing a log that does not hold it, on its way to a log further on");
        Legend("dotted lines", "the alignment: which depths correspond after the last run, where both cores have record");
        Legend(glyphs.Unicode ? "▶" : ">", "the depth cursor; the active log's cursor row is highlighted");
        Legend(glyphs.ActiveLog + " " + glyphs.PartnerLog, "before the active log's name, and before the partner that new ties go to");
        lines.Add("");
        lines.Add("## What the ages and composite show (after r)");
        Legend(glyphs.Band, "95 % band: ages over the model's members, composite over cores");
        Legend(glyphs.ErrorBar + glyphs.ControlMark + glyphs.ErrorBar, $"an age control: given (calibrated) age and its 95 % range ({glyphs.ExcludedControlMark} when left out)");
        Legend("A B strip", "the splice: the core each depth is taken from (legend below)");
        Legend(glyphs.Unicode ? "◀" : "<", "a regime shift found by p (listed below with the periods)");
        lines.Add("");
        lines.Add("## Colour");
        Paragraph("Sixteen colours, or none when NO_COLOR is set; every mark above is a glyph or a letter as well, so nothing is lost in monochrome.");
        lines.Add("");
        lines.Add("## Saving");
        Paragraph("Every edit is written at once to a recovery file beside the project (.NAME.recovery.yaml); the next start offers it back if the session was lost. Saving replaces the project file atomically and keeps the old one as NAME.bak.");
        lines.Add("");
        lines.Add("## Caution");
        Paragraph(EventLayerCaution);
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
