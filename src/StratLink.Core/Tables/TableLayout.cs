using System.Text;

namespace StratLink.Tables;

/// <summary>How a delimited text file is laid out: where its header is, how fields are separated, how it is encoded.</summary>
public sealed record TableLayout(int HeaderLine, Delimiter Delimiter, Encoding Encoding, IReadOnlyList<string> Columns);
