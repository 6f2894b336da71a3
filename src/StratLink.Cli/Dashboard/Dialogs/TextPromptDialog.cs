using Terminal.Gui.ViewBase;
using Terminal.Gui.Views;

namespace StratLink.Cli.Dashboard.Dialogs;

/// <summary>One labelled text field with Cancel and OK (Enter accepts, Esc cancels).</summary>
public sealed class TextPromptDialog : Dialog
{
    public TextPromptDialog(string title, string label, string initial)
    {
        Title = title;
        Width = Dim.Percent(70);
        Height = 7;
        var caption = new Label { Text = label, X = 1, Y = 0 };
        Field = new TextField { Text = initial, X = 1, Y = 1, Width = Dim.Fill(2) };
        Add(caption, Field);
        AddButton(new Button { Text = "_Cancel" });
        AddButton(new Button { Text = "_OK" });
    }

    public TextField Field { get; }

    /// <summary>True when OK (the last button, the default) was pressed.</summary>
    public bool Ok => Result == 1;
}
