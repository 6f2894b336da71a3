using System.Globalization;
using System.Text.RegularExpressions;

namespace StratLink.Cli.Dashboard.Views;

/// <summary>Which axis a typed "go to" value is on.</summary>
public enum JumpAxis
{
    /// <summary>No unit typed: the axis the screen shows.</summary>
    Shown,
    Depth,
    Age,
}

/// <summary>
/// A value typed after the go-to key: a number, optionally followed by "BP" or "cal BP" (an age) or
/// by a depth unit (cm, m, mm: a depth). A decimal comma is read like a point.
/// </summary>
public readonly partial record struct JumpTarget(double Value, JumpAxis Axis)
{
    public static JumpTarget? Parse(string? text)
    {
        if (text is null) return null;
        var m = Pattern().Match(text.Trim());
        if (!m.Success) return null;
        if (!double.TryParse(m.Groups[1].Value.Replace(',', '.'), NumberStyles.Float, CultureInfo.InvariantCulture, out double v)
            || !double.IsFinite(v)) return null;
        string unit = m.Groups[2].Value.ToLowerInvariant().Replace(" ", "");
        return unit switch
        {
            "" => new JumpTarget(v, JumpAxis.Shown),
            "bp" or "calbp" => new JumpTarget(v, JumpAxis.Age),
            _ => new JumpTarget(v, JumpAxis.Depth),
        };
    }

    [GeneratedRegex(@"^([-+]?[0-9]+(?:[.,][0-9]*)?)\s*((?:cal\s*)?bp|cm|mm|m)?$", RegexOptions.IgnoreCase)]
    private static partial Regex Pattern();
}
