using StratLink.Cli.Dashboard.Drawing;

namespace StratLink.Cli.Dashboard.Views;

/// <summary>
/// Two rows on top: site, project file, saved state and whether the results are current; then the
/// screens with their number keys, the shown one highlighted.
/// </summary>
public sealed class HeaderBar : DashView
{
    private readonly DashboardState _state;

    public HeaderBar(DashboardState state, GlyphSet glyphs) : base(glyphs)
    {
        _state = state;
        Height = 2;
    }

    public Screen Current { get; set; }

    /// <summary>How many of the site's cores the logs show, for "k of n cores shown" on the tab row.</summary>
    public Func<(int Shown, int Total)>? ShownCores { get; set; }

    public static string SavedText(DashboardState state) => state.IsSaved ? "saved" : "UNSAVED edits";

    public static string ResultsText(ResultsState results) => results switch
    {
        ResultsState.NotRun => "not run yet",
        ResultsState.Current => "results current",
        ResultsState.Stale => "results STALE (inputs changed)",
        _ => "",
    };

    private string Shorten(string text, int width) =>
        text.Length <= width ? text : text[..Math.Max(1, width - 1)] + (Glyphs.Unicode ? "…" : "~");

    protected override bool OnDrawingContent(Terminal.Gui.ViewBase.DrawContext? context)
    {
        var pal = Colors;
        ClearViewport(pal.Normal);
        int w = Viewport.Width;
        string sep = Glyphs.Unicode ? " │ " : " | ";
        string site = string.IsNullOrWhiteSpace(_state.Project.Site.Name) ? "(no site name)" : _state.Project.Site.Name;
        string file = Path.GetFileName(_state.FilePath);
        string saved = SavedText(_state);
        string results = ResultsText(_state.ResultsState);
        // The states matter most: the site name gives way first, then the file name (long names at 80 columns).
        int room = w - (" StratLink".Length + 4 * sep.Length + saved.Length + results.Length);
        file = Shorten(file, Math.Clamp(room - 5, 8, Math.Max(8, file.Length)));
        site = Shorten(site, Math.Max(4, room - file.Length));

        int x = 0;
        void Part(string text, Terminal.Gui.Drawing.Attribute attr)
        {
            Put(x, 0, text, attr);
            x += text.Length;
        }
        Part(" StratLink", pal.Strong);
        Part(sep, pal.Dim);
        Part(site, pal.Normal);
        Part(sep, pal.Dim);
        Part(file, pal.Normal);
        Part(sep, pal.Dim);
        Part(saved, _state.IsSaved ? pal.Normal : pal.Warning);
        Part(sep, pal.Dim);
        Part(results, _state.ResultsState == ResultsState.Stale ? pal.Warning : pal.Normal);

        x = 0;
        foreach (var screen in Screens.All)
        {
            string tab = $" {(int)screen + 1} {screen.Title()} ";
            Put(x, 1, tab, screen == Current ? pal.ActiveHeader : pal.Dim);
            x += tab.Length + 1;
        }
        if (ShownCores?.Invoke() is var (shown, total) && total > 0)
        {
            string cores = $"{shown} of {total} cores shown ";
            if (x + cores.Length <= w) Put(w - cores.Length, 1, cores, shown < total ? pal.Warning : pal.Normal);
        }
        return true;
    }
}
