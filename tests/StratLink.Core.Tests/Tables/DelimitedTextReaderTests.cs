using System.Text;
using StratLink.Checks;
using StratLink.ProjectIO;
using StratLink.Tables;

namespace StratLink.Tests.Tables;

/// <summary>Synthetic tables: each case's expected values are written by hand in the test's own input.</summary>
public sealed class DelimitedTextReaderTests : IDisposable
{
    private readonly TempFolder _dir = new();
    private readonly FindingList _problems = [];

    public void Dispose() => _dir.Dispose();

    private DelimitedTable? Read(string file, string key = "depth", int? headerLine = null, string[]? missing = null, string[]? text = null) =>
        DelimitedTextReader.Read(file, new DelimitedReadOptions { KeyColumn = key, HeaderLine = headerLine, MissingValues = missing ?? [], TextColumns = text ?? [] }, _problems);

    [Fact]
    public void Semicolon_with_decimal_comma()
    {
        var t = Read(_dir.Write("a.csv", "depth;ms;density\n0,5;12,25;1,8\n1,5;-3;2\n"));
        Assert.NotNull(t);
        Assert.Empty(_problems);
        Assert.Equal(Delimiter.Semicolon, t.Layout.Delimiter);
        Assert.Equal([0.5, 1.5], t.Numeric["depth"]);
        Assert.Equal([12.25, -3], t.Numeric["ms"]);
        Assert.Equal([1.8, 2], t.Numeric["density"]);
    }

    [Fact]
    public void Decimal_comma_is_not_read_in_a_comma_table()
    {
        // "1,5" in a comma table is two fields, so the row has one field too many.
        var t = Read(_dir.Write("a.csv", "depth,ms\n1,5,2\n2,3\n"));
        Assert.NotNull(t);
        var f = Assert.Single(_problems);
        Assert.Equal(ProjectCodes.TableFieldCount, f.Code);
        Assert.Equal(2, f.Line);
        Assert.Equal([2.0], t.Numeric["depth"]);
    }

    [Fact]
    public void Tab_table_with_spaces_and_quotes_in_names()
    {
        var t = Read(_dir.Write("a.txt", "\"depth\"\tms (SI)\t\"Ca/Ti, ratio\"\n1\t2\t3\n"));
        Assert.NotNull(t);
        Assert.Empty(_problems);
        Assert.Equal(Delimiter.Tab, t.Layout.Delimiter);
        Assert.Equal(["depth", "ms (SI)", "Ca/Ti, ratio"], t.Columns);
        Assert.Equal([3.0], t.Numeric["Ca/Ti, ratio"]);
    }

    [Fact]
    public void Blank_runs_with_leading_and_trailing_blanks()
    {
        var t = Read(_dir.Write("a.txt", "  depth   ms\t d18O  \n 1.0   2  \t3\n\n 2.0\t\t5 6   \n"));
        Assert.NotNull(t);
        Assert.Empty(_problems);
        Assert.Equal(Delimiter.Whitespace, t.Layout.Delimiter);
        Assert.Equal([1.0, 2.0], t.Numeric["depth"]);
        Assert.Equal([3.0, 6.0], t.Numeric["d18O"]);
        Assert.Equal([2, 4], t.Lines);
    }

    [Theory]
    [InlineData("\r")]
    [InlineData("\n")]
    [InlineData("\r\n")]
    public void Every_line_end_gives_the_same_lines(string eol)
    {
        var t = Read(_dir.Write("a.csv", string.Join(eol, "# comment", "depth,ms", "1,10", "", "2,20", "3,30")));
        Assert.NotNull(t);
        Assert.Empty(_problems);
        Assert.Equal([1.0, 2, 3], t.Numeric["depth"]);
        Assert.Equal([3, 5, 6], t.Lines);
        Assert.Equal(2, t.Layout.HeaderLine);
    }

    [Fact]
    public void Mixed_line_ends_count_each_break_once()
    {
        var t = Read(_dir.Write("a.txt", "depth ms\r1 10\n2 20\r\n3 30\r\r\n4 40"));
        Assert.NotNull(t);
        Assert.Empty(_problems);
        Assert.Equal([2, 3, 4, 6], t.Lines);
        Assert.Equal([10.0, 20, 30, 40], t.Numeric["ms"]);
    }

    [Fact]
    public void Latin1_bytes_decode_in_names_and_text_cells()
    {
        // "T °C" in Latin-1 is 0xB0 for the degree sign, invalid as UTF-8.
        byte[] bytes = Encoding.Latin1.GetBytes("site: Bl\u00e5vik\ndepth;T \u00b0C;note\n1;4,5;gr\u00e5\n2;5;\n");
        var t = Read(_dir.WriteBytes("a.csv", bytes), text: ["note"]);
        Assert.NotNull(t);
        Assert.Empty(_problems);
        Assert.Equal(Encoding.Latin1.CodePage, t.Layout.Encoding.CodePage);
        Assert.Equal([4.5, 5], t.Numeric["T \u00b0C"]);
        Assert.Equal(new string?[] { "gr\u00e5", null }, t.Text["note"].AsEnumerable());
    }

    [Fact]
    public void Latin1_blank_run_table()
    {
        byte[] bytes = Encoding.Latin1.GetBytes("4\u00b012 N\ndepth v\u00e6rdi label\n1 2 \u00e6\n");
        var t = Read(_dir.WriteBytes("a.txt", bytes), text: ["label"]);
        Assert.NotNull(t);
        Assert.Equal([2.0], t.Numeric["v\u00e6rdi"]);
        Assert.Equal(new string?[] { "\u00e6" }, t.Text["label"].AsEnumerable());
    }

    [Fact]
    public void Missing_values_NA_NaN_empty_and_listed()
    {
        var t = Read(_dir.Write("a.csv", "depth,ms,rho\n1,NA,-999\n2,nan,-999.0\n3,,7\n4,5,N/A\n"), missing: ["-999", "N/A"]);
        Assert.NotNull(t);
        Assert.Empty(_problems);
        Assert.Equal([double.NaN, double.NaN, double.NaN, 5], t.Numeric["ms"]);
        Assert.Equal([double.NaN, double.NaN, 7, double.NaN], t.Numeric["rho"]);
    }

    [Fact]
    public void Text_cell_in_numeric_column_is_an_error_with_line_and_column()
    {
        var t = Read(_dir.Write("a.csv", "depth,ms\n1,2\n2,3..1\n3,4\n"));
        Assert.NotNull(t);
        var f = Assert.Single(_problems);
        Assert.Equal((ProjectCodes.TableBadCell, 3, "ms", Severity.Error), (f.Code, f.Line, f.Field, f.Severity));
        Assert.Contains("'3..1'", f.Message);
        Assert.True(double.IsNaN(t.Numeric["ms"][1]));
    }

    [Fact]
    public void Wholly_text_column_is_not_a_signal_and_not_an_error()
    {
        var t = Read(_dir.Write("a.csv", "id,depth,comment,ms\nA1,1,crack,2\nA2,2,,3\n"));
        Assert.NotNull(t);
        Assert.Empty(_problems);
        Assert.Equal(["id", "comment"], t.TextOnlyColumns);
        Assert.Equal(["depth", "ms"], t.Numeric.Keys);
    }

    [Fact]
    public void Quoted_cells_may_hold_the_delimiter()
    {
        var t = Read(_dir.Write("a.csv", "depth,comment,ms\n1,\"crack, 2 mm\",2\n2,\"said \"\"soupy\"\"\",\"3.5\"\n"));
        Assert.NotNull(t);
        Assert.Empty(_problems);
        Assert.Equal(["comment"], t.TextOnlyColumns);
        Assert.Equal([2.0, 3.5], t.Numeric["ms"]);
    }

    [Fact]
    public void Duplicate_header_is_an_error()
    {
        var t = Read(_dir.Write("a.csv", "depth,ms,ms\n1,2,3\n"));
        Assert.Null(t);
        var f = Assert.Single(_problems);
        Assert.Equal((ProjectCodes.TableDuplicateColumn, 1, "ms"), (f.Code, f.Line, f.Field));
    }

    [Fact]
    public void Preamble_is_skipped_and_header_line_overrides()
    {
        string file = _dir.Write("a.txt", "Core X, depth in cm\nmeasured 2019\n\ndepth\tms\n1\t2\n");
        var t = Read(file);
        Assert.NotNull(t);
        Assert.Equal(4, t.Layout.HeaderLine);
        // With the header line given, the key column need not be the first match.
        var t2 = Read(file, key: "ms", headerLine: 4);
        Assert.NotNull(t2);
        Assert.Equal([2.0], t2.Numeric["ms"]);
    }

    [Fact]
    public void No_header_names_the_column_and_a_case_hint()
    {
        var t = Read(_dir.Write("a.csv", "Depth,ms\n1,2\n"));
        Assert.Null(t);
        var f = Assert.Single(_problems);
        Assert.Equal(ProjectCodes.TableNoHeader, f.Code);
        Assert.Contains("'Depth'", f.Message);
    }

    [Fact]
    public void Header_line_without_the_key_column_lists_the_columns()
    {
        var t = Read(_dir.Write("a.csv", "x;y;z\n1;2;3\n"), headerLine: 1);
        Assert.Null(t);
        var f = Assert.Single(_problems);
        Assert.Equal((ProjectCodes.TableMissingColumn, 1), (f.Code, f.Line));
        Assert.Contains("x, y, z", f.Message);
    }

    [Fact]
    public void Short_row_is_an_error_and_trailing_delimiters_are_not()
    {
        var t = Read(_dir.Write("a.csv", "depth;ms;rho\n1;2;3;;\n2;3\n;;\n3;4;5\n"));
        Assert.NotNull(t);
        var f = Assert.Single(_problems);
        Assert.Equal((ProjectCodes.TableFieldCount, 3), (f.Code, f.Line));
        Assert.Equal([1.0, 3], t.Numeric["depth"]);
    }

    [Fact]
    public void Many_bad_cells_are_listed_up_to_a_limit_then_counted()
    {
        var sb = new StringBuilder("depth,ms\n");
        for (int i = 0; i < 100; i++) sb.Append(i).Append(',').Append(i % 2 == 0 ? "x" : "1").Append('\n');
        var t = Read(_dir.Write("a.csv", sb.ToString()));
        Assert.NotNull(t);
        Assert.All(_problems, f => Assert.Equal(ProjectCodes.TableBadCell, f.Code));
        Assert.Equal(2, _problems[0].Line);
        Assert.Contains(_problems, f => f.Message.Contains("50 cells"));
        Assert.True(_problems.Count <= 22);
    }

    [Fact]
    public void Huge_line_gives_a_message_not_an_exception()
    {
        string file = Path.Combine(_dir.Path, "huge.csv");
        using (var w = new StreamWriter(file))
        {
            w.Write("depth,ms\n1,2\n3,");
            w.Write(new string('7', 10 * 1024 * 1024));
            w.Write("\n4,5\n");
        }
        var t = Read(file);
        Assert.Null(t);
        var f = Assert.Single(_problems);
        Assert.Equal(ProjectCodes.TableLineTooLong, f.Code);
        Assert.Equal(3, f.Line);
    }

    [Fact]
    public void Huge_blank_run_line_gives_a_message()
    {
        string file = Path.Combine(_dir.Path, "huge.txt");
        using (var w = new StreamWriter(file))
        {
            w.Write("depth ms\n1 2\n3 ");
            w.Write(new string('7', 10 * 1024 * 1024));
        }
        var t = Read(file);
        Assert.Null(t);
        var f = Assert.Single(_problems);
        Assert.Equal((ProjectCodes.TableLineTooLong, 3), (f.Code, f.Line));
    }

    [Fact]
    public void Binary_junk_gives_a_message()
    {
        var bytes = new byte[200_000];
        new Random(7).NextBytes(bytes);
        bytes[10] = 0;
        var t = Read(_dir.WriteBytes("junk.csv", bytes));
        Assert.Null(t);
        var f = Assert.Single(_problems);
        Assert.Equal(ProjectCodes.TableProblem, f.Code);
        Assert.Contains("not a text table", f.Message);
    }

    [Fact]
    public void Binary_junk_without_nul_bytes_gives_messages_not_exceptions()
    {
        var rng = new Random(11);
        var bytes = new byte[300_000];
        rng.NextBytes(bytes);
        for (int i = 0; i < bytes.Length; i++) if (bytes[i] == 0) bytes[i] = 1;
        byte[] header = Encoding.ASCII.GetBytes("depth,ms\n");
        var t = Read(_dir.WriteBytes("junk.csv", [.. header, .. bytes]));
        Assert.NotEmpty(_problems);
        Assert.All(_problems, f => Assert.Equal(Severity.Error, f.Severity));
        Assert.True(t is null || _problems.HasErrors);
    }

    [Fact]
    public void Missing_file_is_a_finding()
    {
        var t = Read(Path.Combine(_dir.Path, "nope.csv"));
        Assert.Null(t);
        Assert.Equal(ProjectCodes.MissingFile, Assert.Single(_problems).Code);
    }

    [Fact]
    public void Utf8_bom_is_not_part_of_the_first_name()
    {
        var t = Read(_dir.WriteBytes("a.csv", [0xEF, 0xBB, 0xBF, .. "depth,ms\n1,2\n"u8]));
        Assert.NotNull(t);
        Assert.Equal("depth", t.Columns[0]);
        var t2 = Read(_dir.WriteBytes("b.txt", [0xEF, 0xBB, 0xBF, .. "depth ms\n1 2\n"u8]));
        Assert.NotNull(t2);
        Assert.Equal([1.0], t2.Numeric["depth"]);
    }
}
