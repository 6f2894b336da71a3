using System.Text;
using StratLink.Checks;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Quantities;
using StratLink.Tables;

namespace StratLink.Tests.Tables;

/// <summary>
/// The readers on real published files, parsed as they are (free-text preambles, Latin-1 bytes,
/// CRLF, NOAA '#' headers). Expected values are the first and last rows as printed in each file, and
/// whole columns are compared with an independent naive split of the same lines.
/// </summary>
public sealed class OpenDataTableTests
{
    private readonly FindingList _problems = [];

    private static CoreSpec Core(string depthColumn, params string[] signals) =>
        new() { Id = "X", Table = "x", DepthColumn = depthColumn, Signals = [.. signals] };

    /// <summary>Reference parse: split every line after the header on blanks/tabs (valid for these files only).</summary>
    private static List<string[]> NaiveRows(string path, int headerLine, char[] separators) =>
        [.. File.ReadAllText(path, Encoding.Latin1).Replace("\r\n", "\n").Replace('\r', '\n').Split('\n')
            .Skip(headerLine)
            .Select(l => l.Split(separators, StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries))
            .Where(f => f.Length > 0)];

    private static double[] Column(List<string[]> rows, int index) =>
        [.. rows.Select(r => double.Parse(r[index], System.Globalization.CultureInfo.InvariantCulture))];

    // Source: Bickert, Curry & Wefer 1997, Proc. ODP Sci. Results 154:239-254 (ceara-rise/ODP925_d18O_Bickert1997.txt).
    [Fact]
    public void Odp925_d18O_free_text_preamble_latin1_blank_runs()
    {
        string path = SharedData.File("ceara-rise/ODP925_d18O_Bickert1997.txt");
        var t = DelimitedTextReader.Read(path, new DelimitedReadOptions { KeyColumn = "mcd" }, _problems);
        Assert.NotNull(t);
        Assert.Empty(_problems);
        Assert.Equal(11, t.Layout.HeaderLine);
        Assert.Equal(Delimiter.Whitespace, t.Layout.Delimiter);
        // The preamble's degree signs are byte 0xA1, not valid UTF-8.
        Assert.Equal(Encoding.Latin1.CodePage, t.Layout.Encoding.CodePage);
        Assert.Equal(["Hole", "Type", "species"], t.TextOnlyColumns);
        Assert.Equal(1030, t.RowCount);
        Assert.Equal((0.11, 2.48, 1.43), (t.Numeric["mcd"][0], t.Numeric["d18O"][0], t.Numeric["d13C"][0]));
        Assert.Equal((83.22, 2.79, 0.62), (t.Numeric["mcd"][^1], t.Numeric["d18O"][^1], t.Numeric["d13C"][^1]));
        var naive = NaiveRows(path, 11, [' ', '\t']);
        Assert.Equal(Column(naive, 6), t.Numeric["mcd"]);
        Assert.Equal(Column(naive, 7), t.Numeric["d18O"]);
    }

    // Same source. Several species were measured at one depth, so depths repeat: as a core table that is
    // an error naming each repeat (the first is 0.81 mcd at line 20, after line 19), listed up to a limit.
    [Fact]
    public void Odp925_d18O_repeated_depths_are_errors_with_lines()
    {
        string path = SharedData.File("ceara-rise/ODP925_d18O_Bickert1997.txt");
        var t = CoreTableReader.Read(path, Core("mcd", "d18O", "d13C"), DepthUnit.Metre, _problems, CancellationToken.None);
        Assert.Null(t);
        var order = _problems.Where(f => f.Code == ProjectCodes.TableDepthOrder).ToList();
        Assert.Equal(20, order.Count(f => f.Line is not null));
        Assert.Equal(20, order[0].Line);
        Assert.Contains("line 19", order[0].Message);
        // 98 repeats counted by hand with awk over column 7.
        Assert.Contains(order, f => f.Line is null && f.Message.StartsWith("98 problems", StringComparison.Ordinal));
    }

    // Same source, site 927: header on line 9 ("Site Hole Core Sect Type  top mcd ..."), 801 rows.
    [Fact]
    public void Odp927_d18O_reads_all_rows()
    {
        string path = SharedData.File("ceara-rise/ODP927_d18O_Bickert1997.txt");
        var t = DelimitedTextReader.Read(path, new DelimitedReadOptions { KeyColumn = "mcd" }, _problems);
        Assert.NotNull(t);
        Assert.Empty(_problems);
        Assert.Equal(9, t.Layout.HeaderLine);
        Assert.Equal(801, t.RowCount);
        Assert.Equal((0.02, 98.88), (t.Numeric["mcd"][0], t.Numeric["mcd"][^1]));
        Assert.Equal(Column(NaiveRows(path, 9, [' ']), 7), t.Numeric["d18O"]);
    }

    // Source: Bickert et al. 1997 age model of site 925 (ceara-rise/ODP925_agemodel_Bickert1997.txt):
    // header "mcd age", 373 tie points, depths strictly increasing.
    [Fact]
    public void Odp925_agemodel_is_a_clean_core_table()
    {
        string path = SharedData.File("ceara-rise/ODP925_agemodel_Bickert1997.txt");
        var t = CoreTableReader.Read(path, Core("mcd"), DepthUnit.Metre, _problems, CancellationToken.None);
        Assert.NotNull(t);
        Assert.Empty(_problems);
        Assert.Equal(373, t.Count);
        Assert.Equal(["age"], t.SignalNames);
        Assert.Equal((0.98, 0.021), (t.Depths[0], t.Signals["age"][0]));
        Assert.Equal((372.18, 15.806), (t.Depths[^1], t.Signals["age"][^1]));
        Assert.Equal(2, t.SourceLines![0]);
    }

    // Source: Bickert et al. 1997 age model of site 927 (ceara-rise/ODP927_agemodel_Bickert1997.txt). As
    // printed, 91.28 mcd appears twice (lines 81-82) and 220.04 (line 319) follows 220.27 (line 318).
    [Fact]
    public void Odp927_agemodel_depth_order_errors_name_the_lines()
    {
        string path = SharedData.File("ceara-rise/ODP927_agemodel_Bickert1997.txt");
        var t = CoreTableReader.Read(path, Core("mcd"), DepthUnit.Metre, _problems, CancellationToken.None);
        Assert.Null(t);
        Assert.Equal([82, 319], _problems.Select(f => f.Line ?? 0));
        Assert.All(_problems, f => Assert.Equal(ProjectCodes.TableDepthOrder, f.Code));
        Assert.Contains("repeats the depth at line 81", _problems[0].Message);
        Assert.Contains("lies above the depth 220.27 at line 318", _problems[1].Message);
    }

    // Same file with sort: true: the out-of-order row is sorted in; the repeated depth remains an error.
    [Fact]
    public void Odp927_agemodel_sorted_still_refuses_the_repeat()
    {
        string path = SharedData.File("ceara-rise/ODP927_agemodel_Bickert1997.txt");
        var t = CoreTableReader.Read(path, Core("mcd") with { Sort = true }, DepthUnit.Metre, _problems, CancellationToken.None);
        Assert.Null(t);
        var f = Assert.Single(_problems);
        Assert.Equal((ProjectCodes.TableDepthOrder, 82), (f.Code, f.Line));
    }

    // Source: Lisiecki & Raymo 2005, Paleoceanography 20, PA1003 (benthic-stack/LR04stack.txt): tab
    // separated, CRLF, a 3-line citation and a blank line before the header on line 5; 2115 rows 0-5320 ka.
    [Theory]
    [InlineData(null)]
    [InlineData(5)]
    public void Lr04_tab_crlf_with_citation_preamble(int? headerLine)
    {
        string path = SharedData.File("benthic-stack/LR04stack.txt");
        var spec = Core("Time (ka)") with { HeaderLine = headerLine };
        var t = CoreTableReader.Read(path, spec, DepthUnit.Metre, _problems, CancellationToken.None);
        Assert.NotNull(t);
        Assert.Empty(_problems);
        Assert.Equal(2115, t.Count);
        Assert.Equal(["Benthic d18O (per mil)", "Standard error (per mil)"], t.SignalNames);
        Assert.Equal((0.0, 3.23, 0.03), (t.Depths[0], t.Signals["Benthic d18O (per mil)"][0], t.Signals["Standard error (per mil)"][0]));
        Assert.Equal((5320.0, 2.91, 0.09), (t.Depths[^1], t.Signals["Benthic d18O (per mil)"][^1], t.Signals["Standard error (per mil)"][^1]));
        Assert.Equal(Column(NaiveRows(path, 5, ['\t']), 1), t.Signals["Benthic d18O (per mil)"]);
    }

    // Source: Mix et al. 1995, Proc. ODP Sci. Results 138:371-412 (benthic-stack/ODP849_isot_Mix1995_NOAA.txt):
    // 40 '#' lines (one of them naming the 'depth' variable), header on line 41, 1415 rows, missing = -999.
    [Fact]
    public void Odp849_noaa_comment_header()
    {
        string path = SharedData.File("benthic-stack/ODP849_isot_Mix1995_NOAA.txt");
        var t = DelimitedTextReader.Read(path, new DelimitedReadOptions { KeyColumn = "depth", MissingValues = ["-999"] }, _problems);
        Assert.NotNull(t);
        Assert.Empty(_problems);
        Assert.Equal(41, t.Layout.HeaderLine);
        Assert.Equal(["depth", "yrBP", "d13Cforams-b", "d18Oforams-b"], t.Columns);
        Assert.Equal(1415, t.RowCount);
        Assert.Equal((7.0, 3585.0, 0.21, 3.66), (t.Numeric["depth"][0], t.Numeric["yrBP"][0], t.Numeric["d13Cforams-b"][0], t.Numeric["d18Oforams-b"][0]));
        Assert.Equal((15221.0, 4978185.0, -0.03, 3.12), (t.Numeric["depth"][^1], t.Numeric["yrBP"][^1], t.Numeric["d13Cforams-b"][^1], t.Numeric["d18Oforams-b"][^1]));
        Assert.Equal(Column(NaiveRows(path, 41, [' ']), 3), t.Numeric["d18Oforams-b"]);
    }

    // Same file: replicate analyses share a depth (89 cm on lines 48-49 first); 174 repeats counted with awk.
    [Fact]
    public void Odp849_replicates_are_repeated_depth_errors_even_when_sorted()
    {
        string path = SharedData.File("benthic-stack/ODP849_isot_Mix1995_NOAA.txt");
        var spec = Core("depth") with { Sort = true, MissingValues = ["-999"] };
        var t = CoreTableReader.Read(path, spec, DepthUnit.Centimetre, _problems, CancellationToken.None);
        Assert.Null(t);
        Assert.Equal(49, _problems[0].Line);
        Assert.Contains("repeats the depth at line 48", _problems[0].Message);
        Assert.Contains(_problems, f => f.Message.StartsWith("174 problems", StringComparison.Ordinal));
    }
}
