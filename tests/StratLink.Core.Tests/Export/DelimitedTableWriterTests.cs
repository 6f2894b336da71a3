using Microsoft.VisualBasic.FileIO;
using StratLink.Export;

namespace StratLink.Tests.Export;

public class DelimitedTableWriterTests
{
    private static List<string[]> ReadBack(string text, string delimiter)
    {
        // The .NET runtime's own RFC 4180-style parser as an independent reader.
        using var parser = new TextFieldParser(new StringReader(text)) { HasFieldsEnclosedInQuotes = true, TrimWhiteSpace = false };
        parser.SetDelimiters(delimiter);
        var rows = new List<string[]>();
        while (!parser.EndOfData) rows.Add(parser.ReadFields()!);
        return rows;
    }

    [Fact]
    public void Numbers_are_invariant_and_round_trip_NaN_is_empty_and_text_is_quoted()
    {
        var sw = new StringWriter();
        var w = new DelimitedTableWriter(sw, TableFormat.Csv);
        w.Header(["depth_cm", "note", "value"]);
        w.Number(0.1).Text("a, \"quoted\" note").Number(double.NaN);
        w.EndRow();
        w.Number(1.0 / 3).Text(null).Number(-68);
        w.EndRow();

        string text = sw.ToString();
        Assert.StartsWith("depth_cm,note,value\n0.1,", text);
        Assert.DoesNotContain("\r", text);
        var rows = ReadBack(text, ",");
        Assert.Equal(3, rows.Count);
        Assert.Equal(["0.1", "a, \"quoted\" note", ""], rows[1]);
        Assert.Equal(1.0 / 3, double.Parse(rows[2][0], System.Globalization.CultureInfo.InvariantCulture));
        Assert.Equal("", rows[2][1]);
        Assert.Equal("-68", rows[2][2]);
    }

    [Fact]
    public void Tsv_uses_tabs_and_a_row_of_the_wrong_width_is_refused()
    {
        var sw = new StringWriter();
        var w = new DelimitedTableWriter(sw, TableFormat.Tsv);
        w.Header(["a", "b"]);
        w.Number(1.5).Number(2e-7);
        w.EndRow();
        Assert.Equal("a\tb\n1.5\t2E-07\n", sw.ToString());
        Assert.Equal(2e-7, double.Parse(ReadBack(sw.ToString(), "\t")[1][1], System.Globalization.CultureInfo.InvariantCulture));
        w.Number(1);
        Assert.Throws<InvalidOperationException>(w.EndRow);
    }

    [Fact]
    public void Infinities_and_flags_are_written_as_words()
    {
        // Common practice in numeric tables (numpy writes inf, R writes Inf); lower case as our analysis tables have it.
        var sw = new StringWriter();
        var w = new DelimitedTableWriter(sw, TableFormat.Csv);
        w.Header(["period_yr", "tentative"]);
        w.Number(double.PositiveInfinity).Bool(true);
        w.EndRow();
        w.Number(double.NegativeInfinity).Bool(false);
        w.EndRow();
        Assert.Equal("period_yr,tentative\ninf,true\n-inf,false\n", sw.ToString());
    }
}
