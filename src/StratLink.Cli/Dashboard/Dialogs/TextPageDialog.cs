using StratLink.Cli.Dashboard.Drawing;
using Terminal.Gui.ViewBase;
using Terminal.Gui.Views;

namespace StratLink.Cli.Dashboard.Dialogs;

/// <summary>A full-screen page of text (the help screen); Esc or Enter closes it.</summary>
public sealed class TextPageDialog : Dialog
{
    public TextPageDialog(string title, IReadOnlyList<string> lines, GlyphSet glyphs)
    {
        Title = title;
        Width = Dim.Fill();
        Height = Dim.Fill();
        Page = new TextPage(lines, glyphs) { X = 0, Y = 0, Width = Dim.Fill(), Height = Dim.Fill(2) };
        Add(Page);
        AddButton(new Button { Text = "_Close" });
    }

    public TextPage Page { get; }
}
