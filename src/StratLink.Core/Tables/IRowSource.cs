namespace StratLink.Tables;

/// <summary>The data records after a table's header, one at a time, as byte fields.</summary>
internal interface IRowSource : IDisposable
{
    /// <summary>Moves to the next record that is not blank; false at the end or when <see cref="Failure"/> is set.</summary>
    bool MoveNext();

    /// <summary>1-based file line of the current record.</summary>
    int LineNumber { get; }

    int FieldCount { get; }

    /// <summary>How the field bytes are encoded (CsvHelper hands out UTF-8 whatever the file's encoding).</summary>
    System.Text.Encoding FieldEncoding { get; }

    /// <summary>Field <paramref name="index"/> of the current record, unquoted; valid until the next move.</summary>
    ReadOnlySpan<byte> Field(int index);

    /// <summary>Why reading stopped early (a line too long to be a row), with its line; null when it reached the end.</summary>
    (string Message, int? Line)? Failure { get; }
}
