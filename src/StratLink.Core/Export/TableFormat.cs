namespace StratLink.Export;

/// <summary>Delimited text flavours of the output tables.</summary>
public enum TableFormat
{
    /// <summary>Comma-separated (RFC 4180 quoting).</summary>
    Csv,

    /// <summary>Tab-separated, same quoting.</summary>
    Tsv,
}

public static class TableFormats
{
    public static char Delimiter(this TableFormat format) => format == TableFormat.Tsv ? '\t' : ',';

    /// <summary>File extension with its dot.</summary>
    public static string Extension(this TableFormat format) => format == TableFormat.Tsv ? ".tsv" : ".csv";
}
