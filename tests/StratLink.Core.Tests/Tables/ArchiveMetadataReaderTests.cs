using StratLink.Checks;
using StratLink.Model;
using StratLink.Quantities;
using StratLink.Tables;

namespace StratLink.Tests.Tables;

/// <summary>The archive layouts read directly as core tables, with their metadata.</summary>
public sealed class ArchiveMetadataReaderTests : IDisposable
{
    private readonly TempFolder _dir = new();

    public void Dispose() => _dir.Dispose();

    /// <summary>
    /// ODP Site 849 benthic isotopes as the NOAA paleoclimate archive serves them (Mix et al. 1995,
    /// Proc. ODP Sci. Results 138:371-412; see ../shared/data/PROVENANCE.md). Expected values read off the
    /// file's own header: position "0.11.00N ( 0.18333)", "110.31.06W ( -110.5183)", depth in cm, -999 missing;
    /// 1415 rows with 1241 distinct depths (counted independently with a Python one-liner splitting on blanks).
    /// </summary>
    [Fact]
    public void The_NOAA_text_of_ODP_849_loads_with_its_site_position_citation_units_and_replicates()
    {
        string file = SharedData.File("benthic-stack/ODP849_isot_Mix1995_NOAA.txt");
        var probe = TableProbe.Probe(file);
        Assert.Equal("depth", probe.DepthColumn);
        Assert.Equal(41, probe.HeaderLine);
        Assert.Equal(Delimiter.Whitespace, probe.Delimiter);

        var layout = new TableLayout(probe.HeaderLine, probe.Delimiter, System.Text.Encoding.Latin1, probe.Columns);
        var meta = ArchiveMetadataReader.Read(file, layout);
        Assert.Equal(ArchiveMetadata.NoaaText, meta.Layout);
        Assert.Equal("ODP849", meta.Site);
        Assert.Equal(0.18333, meta.Latitude!.Value, 1e-9);
        Assert.Equal(-110.5183, meta.Longitude!.Value, 1e-9);
        Assert.StartsWith("Mix, A.C., N.G. Pisias", meta.Citation);
        Assert.Contains("Scientific Results 138", meta.Citation);
        Assert.Equal("cm", meta.Units["depth"]);
        Assert.Equal("-999", meta.MissingValue);

        var problems = new FindingList();
        var spec = new CoreSpec { Id = "ODP849", Table = file, RepeatedDepths = RepeatedDepths.Mean, MissingValues = ["-999"] };
        var t = CoreTableReader.Read(file, spec, DepthUnit.Centimetre, problems);
        Assert.NotNull(t);
        Assert.Equal(1241, t.Count);
        Assert.Equal(["yrBP", "d13Cforams-b", "d18Oforams-b"], t.SignalNames);
        // Two replicates at 89 cm: 4.55 and 4.8 permil, mean 4.675.
        Assert.Equal(4.675, t.Signals["d18Oforams-b"][Array.IndexOf(t.Depths, 89.0)], 1e-12);
        Assert.DoesNotContain(problems, p => p.Severity == Severity.Error);
    }

    /// <summary>
    /// A file of our own in the layout described on the archive's "Metaheader" page (PANGAEA wiki: the
    /// data description starts with "/* DATA DESCRIPTION:" and ends with "*/", fields Citation, Event(s),
    /// Parameter(s), ... as "Field:&lt;tab&gt;value", then the tab-separated table with "Name [unit]" column
    /// names). The values are invented; the word "Depth" inside the block must not be taken for the header.
    /// </summary>
    [Fact]
    public void A_tab_file_after_a_data_description_block_loads_with_its_metadata()
    {
        const string text =
            "/* DATA DESCRIPTION:\n" +
            "Citation:\tAuthor, A (2021): Stable isotopes of core GS-7. Invented Data Archive, https://doi.org/10.0000/EXAMPLE.1\n" +
            "Event(s):\tGS-7 * LATITUDE: 60.1234 * LONGITUDE: 5.4321 * ELEVATION: -210.0 m * METHOD/DEVICE: Gravity corer\n" +
            "Parameter(s):\tDepth, sediment/rock [m] (Depth sed) * GEOCODE\n" +
            "\tδ18O, benthic foraminifera [‰ PDB] (δ18O) * PI: Author, A\n" +
            "License:\tCreative Commons Attribution 4.0 International (CC-BY-4.0)\n" +
            "Size:\t8 data points\n" +
            "*/\n" +
            "Depth sed [m]\tδ18O [‰ PDB]\n" +
            "0.05\t3.41\n0.10\t3.52\n0.15\t3.60\n0.20\t3.58\n";
        string file = _dir.Write("GS-7_isotopes.tab", text);
        var probe = TableProbe.Probe(file);
        Assert.Equal("Depth sed [m]", probe.DepthColumn);
        Assert.Equal(DepthUnit.Metre, probe.Unit);
        Assert.Equal(9, probe.HeaderLine);
        Assert.Equal(Delimiter.Tab, probe.Delimiter);
        Assert.False(probe.DecimalComma);

        var meta = ArchiveMetadataReader.Read(file, new TableLayout(probe.HeaderLine, probe.Delimiter, System.Text.Encoding.UTF8, probe.Columns));
        Assert.Equal(ArchiveMetadata.DescriptionBlock, meta.Layout);
        Assert.Equal("GS-7", meta.Site);
        Assert.Equal(60.1234, meta.Latitude);
        Assert.Equal(5.4321, meta.Longitude);
        Assert.StartsWith("Author, A (2021)", meta.Citation);
        Assert.Equal("‰ PDB", meta.Units["δ18O [‰ PDB]"]);
        Assert.Equal("m", meta.Units["Depth sed [m]"]);

        var problems = new FindingList();
        var t = CoreTableReader.Read(file, new CoreSpec { Id = "GS-7", Table = file, DepthColumn = "Depth sed [m]" }, DepthUnit.Metre, problems);
        Assert.NotNull(t);
        Assert.Empty(problems);
        Assert.Equal([0.05, 0.10, 0.15, 0.20], t.Depths);
        Assert.Equal([3.41, 3.52, 3.60, 3.58], t.Signals["δ18O [‰ PDB]"]);
    }
}
