using StratLink.Cli.Dashboard;
using StratLink.Cli.Dashboard.Drawing;
using StratLink.Cli.Dashboard.Session;
using StratLink.Cli.Dashboard.Views;
using Terminal.Gui.App;
using Terminal.Gui.Drivers;
using Terminal.Gui.Input;
using Terminal.Gui.Testing;

namespace StratLink.Tests.Dashboard;

/// <summary>
/// The dashboard window on the in-memory ANSI driver (DisableRealDriverIO=1): laid out and drawn
/// with Begin (no main loop), keys injected synchronously, screen cells read back.
/// </summary>
internal sealed class DashboardHarness : IDisposable
{
    private readonly SessionToken? _token;

    public DashboardHarness(TestProject project, int width = 80, int height = 24, GlyphSet? glyphs = null, bool begin = true,
        IDashboardWorkflows? workflows = null, ColourMode colours = ColourMode.Sixteen)
    {
        Project = project;
        App = Application.Create();
        App.Init(DriverRegistry.Names.ANSI);
        App.Driver!.SetScreenSize(width, height);
        State = new DashboardState(project.Loaded);
        Workflows = new TestWorkflows(project.Loaded);
        Prompts = new ScriptedPrompts();
        Recovery = new RecoveryFile(project.FilePath);
        Window = new DashboardWindow(App, State, workflows ?? Workflows, Prompts, glyphs ?? GlyphSet.Utf8, Recovery, null, colours);
        if (begin)
        {
            _token = App.Begin(Window);
            App.LayoutAndDraw();
        }
    }

    public TestProject Project { get; }
    public IApplication App { get; }
    public DashboardState State { get; }
    public TestWorkflows Workflows { get; }
    public ScriptedPrompts Prompts { get; }
    public RecoveryFile Recovery { get; }
    public DashboardWindow Window { get; }

    public void Press(params Key[] keys)
    {
        foreach (var k in keys) App.InjectKey(k);
        App.LayoutAndDraw();
    }

    public void Type(string chars)
    {
        foreach (char c in chars) App.InjectKey(new Key(c));
        App.LayoutAndDraw();
    }

    public string Row(int r)
    {
        var cells = App.Driver!.Contents!;
        return string.Concat(Enumerable.Range(0, App.Driver.Cols).Select(c => cells[r, c].Grapheme));
    }

    public string Cell(int r, int c) => App.Driver!.Contents![r, c].Grapheme;

    /// <summary>
    /// Runs the window's main loop, calling <paramref name="step"/> on each iteration until it returns true;
    /// returns false when the watchdog stopped it after <paramref name="limit"/> instead.
    /// </summary>
    public bool RunUntil(Func<int, bool> step, TimeSpan? limit = null)
    {
        bool timedOut = false;
        App.AddTimeout(limit ?? TimeSpan.FromSeconds(10), () => { timedOut = true; App.RequestStop(); return false; });
        int i = 0;
        void OnIteration(object? s, EventArgs<IApplication?> e)
        {
            if (step(i++)) App.RequestStop();
        }
        App.Iteration += OnIteration;
        App.Run(Window);
        App.Iteration -= OnIteration;
        return !timedOut;
    }

    /// <summary>Lays out and draws the window without a main loop until disposed (after <see cref="RunUntil"/> has returned).</summary>
    public IDisposable Session()
    {
        var token = App.Begin(Window);
        App.LayoutAndDraw();
        return new EndSession(App, token);
    }

    private sealed class EndSession(IApplication app, SessionToken? token) : IDisposable
    {
        public void Dispose()
        {
            if (token is not null) app.End(token);
        }
    }

    public Terminal.Gui.Drawing.Attribute? Attr(int r, int c) => App.Driver!.Contents![r, c].Attribute;

    public string ScreenText => App.Driver!.ToString() ?? "";

    public int Rows => App.Driver!.Rows;

    public void Dispose()
    {
        if (_token is not null) App.End(_token);
        Window.Dispose();
        App.Dispose();
    }
}
