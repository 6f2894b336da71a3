using CsvHelper;
using StratLink.Checks;
using StratLink.Export;
using StratLink.Quantities;

namespace StratLink.Tests.Export;

public sealed class ChecksCsvWriterTests
{
    [Fact]
    public void FindingsRoundTripThroughAnIndependentCsvReader()
    {
        var findings = new[]
        {
            new Finding { Severity = Severity.Error, Code = "tie.crossing", Core = "GS-2", Item = "X/Y", Depth = 152.25, Message = "Marker X lies \"above\" Y, not below; check it.\nSecond line." },
            new Finding { Severity = Severity.Note, Code = "check.not-run", Message = "No aligner." },
        };
        string csv = ToCsv(findings, DepthUnit.Centimetre);
        Assert.StartsWith("severity,code,core,item,depth_cm,message\n", csv);

        // CsvHelper (RFC 4180) reads back exactly what was written.
        using var reader = CsvReader.FromText(csv);
        var rows = new List<string[]>();
        while (reader.Read())
            rows.Add(new[] { "severity", "code", "core", "item", "depth_cm", "message" }.Select(c => reader.GetString(c)).ToArray());
        Assert.Equal(2, rows.Count);
        Assert.Equal(["error", "tie.crossing", "GS-2", "X/Y", "152.25", findings[0].Message], rows[0]);
        Assert.Equal(["note", "check.not-run", "", "", "", "No aligner."], rows[1]);
    }

    private static string ToCsv(IEnumerable<Finding> findings, DepthUnit unit)
    {
        using var w = new StringWriter();
        ChecksCsvWriter.Write(w, findings, unit);
        return w.ToString();
    }

    [Fact]
    public void DepthColumnNamesTheProjectUnitAndNumbersRoundTrip()
    {
        string csv = ToCsv([new Finding { Severity = Severity.Warning, Code = "c", Depth = 0.1 + 0.2, Message = "m" }], DepthUnit.Metre);
        // "R" keeps every digit: 0.1 + 0.2 is 0.30000000000000004 in IEEE 754 binary64 (the standard's round-trip text).
        Assert.Equal("severity,code,core,item,depth_m,message\nwarning,c,,,0.30000000000000004,m\n", csv);
    }
}
