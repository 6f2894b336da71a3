using StratLink.Cli.Dashboard.Drawing;
using Terminal.Gui.App;

namespace StratLink.Cli.Dashboard.Dialogs;

/// <summary>The prompts as modal dialogs of the running application.</summary>
public sealed class DialogPrompts(IApplication app, GlyphSet glyphs) : IPrompts
{
    public string? AskText(string title, string label, string initial)
    {
        using var dialog = new TextPromptDialog(title, label, initial);
        app.Run(dialog);
        return dialog.Ok ? dialog.Field.Text : null;
    }

    public int? Choose(string title, string message, IReadOnlyList<string> options, int initial = 0)
    {
        using var dialog = new ChoiceDialog(title, message, options, initial, glyphs);
        app.Run(dialog);
        return dialog.Choice;
    }

    public void ShowText(string title, IReadOnlyList<string> lines)
    {
        using var dialog = new TextPageDialog(title, lines, glyphs);
        app.Run(dialog);
    }
}
