using System.Globalization;

namespace StratLink.Quantities;

/// <summary>The length unit a project states for every depth in its file and tables.</summary>
public enum DepthUnit
{
    Millimetre,
    Centimetre,
    Metre,
}

public static class DepthUnits
{
    /// <summary>The spelling used in project files and column names (<c>mm</c>, <c>cm</c>, <c>m</c>).</summary>
    public static string Symbol(this DepthUnit unit) => unit switch
    {
        DepthUnit.Millimetre => "mm",
        DepthUnit.Centimetre => "cm",
        DepthUnit.Metre => "m",
        _ => throw new ArgumentOutOfRangeException(nameof(unit)),
    };

    public static bool TryParse(string? text, out DepthUnit unit)
    {
        switch (text?.Trim().ToLowerInvariant())
        {
            case "mm": unit = DepthUnit.Millimetre; return true;
            case "cm": unit = DepthUnit.Centimetre; return true;
            case "m": unit = DepthUnit.Metre; return true;
            default: unit = default; return false;
        }
    }

    /// <summary>Millimetres in one <paramref name="unit"/>.</summary>
    public static double Millimetres(this DepthUnit unit) => unit switch
    {
        DepthUnit.Millimetre => 1.0,
        DepthUnit.Centimetre => 10.0,
        DepthUnit.Metre => 1000.0,
        _ => throw new ArgumentOutOfRangeException(nameof(unit)),
    };

    /// <summary>Converts a length; exact when the units are the same, so values never pick up rounding noise needlessly.</summary>
    public static double Convert(double value, DepthUnit from, DepthUnit to) =>
        from == to ? value : value * from.Millimetres() / to.Millimetres();

    internal static string Format(double value, DepthUnit unit) =>
        value.ToString("0.###", CultureInfo.InvariantCulture) + " " + unit.Symbol();
}
