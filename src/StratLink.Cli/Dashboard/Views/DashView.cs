using System.Text;
using StratLink.Cli.Dashboard.Drawing;
using Terminal.Gui.Drawing;
using Terminal.Gui.ViewBase;
using Attribute = Terminal.Gui.Drawing.Attribute;

namespace StratLink.Cli.Dashboard.Views;

/// <summary>Base of the dashboard's hand-drawn views: text and glyph helpers in viewport coordinates, clipped to the viewport.</summary>
public abstract class DashView : View
{
    protected DashView(GlyphSet glyphs)
    {
        Glyphs = glyphs;
        CanFocus = false;
    }

    public GlyphSet Glyphs { get; }

    protected Palette Colors => Palette.From(GetAttributeForRole(VisualRole.Normal));

    /// <summary>Writes <paramref name="text"/> at (x, y), cut at <paramref name="maxWidth"/> and the viewport edge.</summary>
    protected void Put(int x, int y, string text, Attribute attribute, int maxWidth = int.MaxValue)
    {
        var vp = Viewport;
        if (y < 0 || y >= vp.Height || x >= vp.Width) return;
        SetAttribute(attribute);
        int limit = (int)Math.Min(vp.Width, (long)x + Math.Max(0, maxWidth));
        int col = x;
        foreach (Rune r in text.EnumerateRunes())
        {
            if (col >= limit) break;
            if (col >= 0) AddRune(col, y, r);
            col++;
        }
    }

    protected void Fill(int x, int y, int width, string glyph, Attribute attribute)
    {
        for (int i = 0; i < width; i++) Put(x + i, y, glyph, attribute);
    }

    protected void ClearViewport(Attribute attribute)
    {
        var vp = Viewport;
        for (int y = 0; y < vp.Height; y++) Fill(0, y, vp.Width, " ", attribute);
    }

    /// <summary>Draws a dot canvas at (x, y), inked cells only, so shading drawn before stays where there is no curve.</summary>
    protected void PutCanvas(int x, int y, DotCanvas canvas, Attribute attribute)
    {
        SetAttribute(attribute);
        var vp = Viewport;
        for (int r = 0; r < canvas.Rows; r++)
        {
            int yy = y + r;
            if (yy < 0 || yy >= vp.Height) continue;
            for (int c = 0; c < canvas.Columns; c++)
            {
                if (!canvas.IsInked(c, r)) continue;
                int xx = x + c;
                if (xx < 0 || xx >= vp.Width) continue;
                AddRune(xx, yy, canvas.CellRune(c, r, Glyphs.Unicode, Glyphs.CurveInk));
            }
        }
    }

    /// <summary>Text fitted to exactly <paramref name="width"/> columns (cut or padded).</summary>
    protected static string Fit(string text, int width)
    {
        if (width <= 0) return "";
        return text.Length > width ? text[..width] : text.PadRight(width);
    }
}
