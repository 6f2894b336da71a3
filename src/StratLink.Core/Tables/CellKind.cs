namespace StratLink.Tables;

/// <summary>What a table cell holds.</summary>
internal enum CellKind
{
    Number,
    Missing,
    Text,
}
