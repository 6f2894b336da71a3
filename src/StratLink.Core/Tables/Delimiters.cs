namespace StratLink.Tables;

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
}
