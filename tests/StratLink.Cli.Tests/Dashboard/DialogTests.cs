using StratLink.Cli.Dashboard.Dialogs;
using StratLink.Cli.Dashboard.Drawing;
using Terminal.Gui.App;
using Terminal.Gui.Drivers;
using Terminal.Gui.Input;
using Terminal.Gui.Testing;

namespace StratLink.Tests.Dashboard;

/// <summary>The real dialogs behind the prompts, driven by injected keys.</summary>
[Collection("TerminalGui")]
public sealed class DialogTests
{
    private static IApplication NewApp()
    {
        var app = Application.Create();
        app.Init(DriverRegistry.Names.ANSI);
        app.Driver!.SetScreenSize(80, 24);
        return app;
    }

    [Fact]
    public void Text_prompt_returns_the_typed_name_on_enter()
    {
        using var app = NewApp();
        using var dialog = new TextPromptDialog("Rename tie ash-1", "New name:", "");
        var token = app.Begin(dialog);
        app.LayoutAndDraw();
        foreach (char c in "ash-9") app.InjectKey(new Key(c));
        app.InjectKey(Key.Enter);
        Assert.True(dialog.Ok);
        Assert.Equal("ash-9", dialog.Field.Text);
        if (token is not null) app.End(token);
    }

    [Fact]
    public void Choice_list_chooses_with_arrows_and_enter()
    {
        using var app = NewApp();
        using var dialog = new ChoiceDialog("Kind of tie", "", ["tephra", "turbidite", "flood"], 0, GlyphSet.Utf8);
        var token = app.Begin(dialog);
        app.LayoutAndDraw();
        Assert.Contains("1 tephra", app.Driver!.ToString());
        app.InjectKey(Key.CursorDown);
        app.InjectKey(Key.CursorDown);
        app.InjectKey(Key.Enter);
        Assert.Equal(2, dialog.Choice);
        if (token is not null) app.End(token);
    }

    [Fact]
    public void Esc_cancels_a_choice()
    {
        using var app = NewApp();
        using var dialog = new ChoiceDialog("Quit", "There are unsaved edits.", ["Save", "Discard", "Stay"], 0, GlyphSet.Utf8);
        bool timedOut = false;
        app.AddTimeout(TimeSpan.FromSeconds(5), () => { timedOut = true; app.RequestStop(); return false; });
        void OnIteration(object? s, EventArgs<IApplication?> e)
        {
            app.Iteration -= OnIteration;
            app.InjectKey(Key.Esc);
        }
        app.Iteration += OnIteration;
        app.Run(dialog);
        Assert.False(timedOut);
        Assert.Null(dialog.Choice);
    }
}
