namespace StratLink.Tables;

/// <summary>How the fields of a delimited text table are separated.</summary>
public enum Delimiter
{
    Comma,
    Semicolon,
    Tab,

    /// <summary>Runs of spaces and tabs (column-aligned text); a cell can then be neither empty nor hold a space.</summary>
    Whitespace,
}

internal static class Delimiters
{
    /// <summary>The order in which a header line is tried: a tab or semicolon table may hold commas and spaces in its names.</summary>
    public static readonly Delimiter[] DetectionOrder = [Delimiter.Tab, Delimiter.Semicolon, Delimiter.Comma, Delimiter.Whitespace];

    public static char Char(this Delimiter d) => d switch
    {
        Delimiter.Comma => ',',
        Delimiter.Semicolon => ';',
        Delimiter.Tab => '\t',
        _ => ' ',
    };

    public static string Describe(this Delimiter d) => d switch
    {
        Delimiter.Comma => "comma",
        Delimiter.Semicolon => "semicolon",
        Delimiter.Tab => "tab",
        _ => "spaces",
    };
}
