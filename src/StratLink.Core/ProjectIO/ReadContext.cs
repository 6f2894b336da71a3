using StratLink.Checks;
using StratLink.Quantities;

namespace StratLink.ProjectIO;

/// <summary>State shared by the section readers while one project file is read.</summary>
internal sealed class ReadContext(string file)
{
    public string File { get; } = file;
    public FindingList Problems { get; } = [];
    public SourceMap Map { get; } = new(file);

    /// <summary>
    /// Every key the section readers asked for, as (section, key) with list items written <c>[]</c>
    /// (<c>cores[]</c>, <c>ages[]</c>): the keys the reader accepts, taken from its own code, so the format
    /// reference and the schema can be checked against it.
    /// </summary>
    public HashSet<(string Section, string Key)> KeysAsked { get; } = [];

    /// <summary>The project's depth unit, known once <c>depth_unit</c> is read (cm until then).</summary>
    public DepthUnit Unit { get; set; } = DepthUnit.Centimetre;
}
