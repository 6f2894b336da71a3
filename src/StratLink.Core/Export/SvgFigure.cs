using System.Text;

namespace StratLink.Export;

/// <summary>Writes one or more <see cref="SvgPlot"/> panels stacked top to bottom into a standalone SVG document.</summary>
public static class SvgFigure
{
    public static string Stack(IReadOnlyList<SvgPlot> panels, int width = 800, int panelHeight = 320)
    {
        int height = panelHeight * panels.Count;
        var sb = new StringBuilder();
        sb.Append($"<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"{width}\" height=\"{height}\" viewBox=\"0 0 {width} {height}\" font-family=\"sans-serif\">\n");
        sb.Append($"<rect width=\"{width}\" height=\"{height}\" fill=\"#fff\"/>\n");
        for (int i = 0; i < panels.Count; i++) panels[i].Render(sb, 0, i * panelHeight, width, panelHeight, $"panel{i}");
        sb.Append("</svg>\n");
        return sb.ToString();
    }
}
