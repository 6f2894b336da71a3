using StratLink.Cli.Dashboard.Drawing;
using Terminal.Gui.ViewBase;
using Terminal.Gui.Views;

namespace StratLink.Cli.Dashboard.Dialogs;

/// <summary>A message and a list of options; Enter chooses, Esc cancels.</summary>
public sealed class ChoiceDialog : Dialog
{
    public ChoiceDialog(string title, string message, IReadOnlyList<string> options, int initial, GlyphSet glyphs)
    {
        Title = title;
        int messageRows = string.IsNullOrEmpty(message) ? 0 : message.Split('\n').Length;
        Width = Dim.Percent(80);
        Height = Math.Min(20, messageRows + options.Count + 4);
        var text = new Label { Text = message, X = 1, Y = 0, Width = Dim.Fill(1), Height = messageRows };
        List = new ChoiceList(options, initial, glyphs) { X = 1, Y = messageRows + (messageRows > 0 ? 1 : 0), Width = Dim.Fill(1), Height = Dim.Fill() };
        List.Chosen += i =>
        {
            Choice = i;
            RequestStop();
        };
        Add(text, List);
    }

    public ChoiceList List { get; }

    /// <summary>The chosen index, or null when cancelled.</summary>
    public int? Choice { get; private set; }
}
