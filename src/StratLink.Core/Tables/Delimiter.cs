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
