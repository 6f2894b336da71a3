using System.Globalization;
using System.IO.Compression;
using System.Security.Cryptography;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using StratLink.AgeModelling;
using StratLink.Compositing;
using StratLink.Model;
using StratLink.Quantities;

namespace StratLink.Export;

/// <summary>
/// Writes a build as a LiPD file (Linked PaleoData 1.3; McKay and Emile-Geay 2016, Clim. Past 12:1093-1100,
/// doi:10.5194/cp-12-1093-2016): a zip holding a BagIt bag (RFC 8493: <c>bag/bagit.txt</c>,
/// <c>bag/bag-info.txt</c>, <c>bag/manifest-sha256.txt</c>, <c>bag/tagmanifest-sha256.txt</c>) whose payload is
/// <c>data/metadata.jsonld</c> and headerless CSV tables it describes column by column. The composite is the
/// paleoData measurement table (every column of composite.csv, with its unit); the age model is chronData's
/// model, with a summary table (median and 95 % range) and the whole age ensemble as an ensemble table, one
/// column per member. The archive is reproducible: fixed entry times, invariant numbers, ordered keys.
/// </summary>
public static class LipdWriter
{
    public const string LipdVersion = "1.3";
    public const string CompositeTable = "paleo0measurement0.csv";
    public const string SummaryTable = "chron0model0summary0.csv";
    public const string EnsembleTable = "chron0model0ensemble0.csv";

    private static readonly DateTimeOffset EntryTime = new(1980, 1, 1, 0, 0, 0, TimeSpan.Zero);

    public static void Write(Stream output, Project project, CompositeResult composite, AgeModelResult? ages, string archiveType)
    {
        string unit = composite.Grid.Unit.Symbol();
        var payload = new SortedDictionary<string, byte[]>(StringComparer.Ordinal);
        var (compositeCsv, compositeColumns) = CompositeColumns(project, composite, unit);
        payload["data/" + CompositeTable] = compositeCsv;

        var meta = new JsonObject
        {
            ["lipdVersion"] = 1.3,
            ["createdBy"] = "stratlink",
            ["dataSetName"] = DataSetName(project),
            ["archiveType"] = archiveType,
            ["geo"] = Geo(project),
            ["pub"] = new JsonArray([.. project.Cores.Select(c => c.Citation).OfType<string>().Distinct(StringComparer.Ordinal)
                .Select(c => (JsonNode)new JsonObject { ["citation"] = c })]),
            ["paleoData"] = new JsonArray(new JsonObject
            {
                ["measurementTable"] = new JsonArray(Table("paleo0measurement0", CompositeTable, compositeColumns)),
            }),
        };
        if (ages is { IsBuilt: true } && composite.Ages is { } summary)
        {
            payload["data/" + SummaryTable] = SummaryCsv(composite, summary);
            payload["data/" + EnsembleTable] = EnsembleCsv(composite, ages);
            var summaryColumns = new JsonArray(
                Column(1, "depth", unit, "composite depth"),
                Column(2, "ageMedian", "yr BP", "median of the age ensemble, calendar years before 1950"),
                Column(3, "unc2.5", "yr BP", "2.5 percentile of the age ensemble"),
                Column(4, "unc97.5", "yr BP", "97.5 percentile of the age ensemble"));
            var ensembleColumns = new JsonArray(
                Column(1, "depth", unit, "composite depth"),
                new JsonObject
                {
                    ["number"] = new JsonArray([.. Enumerable.Range(2, ages.MemberCount).Select(i => (JsonNode)i)]),
                    ["variableName"] = "ageEnsemble",
                    ["units"] = "yr BP",
                    ["description"] = $"one column per Monte Carlo member ({ages.MemberCount}), seed {ages.Seed}",
                });
            meta["chronData"] = new JsonArray(new JsonObject
            {
                ["model"] = new JsonArray(new JsonObject
                {
                    ["method"] = new JsonObject
                    {
                        ["algorithm"] = $"StratLink Monte Carlo age-depth model ({ages.Interpolation} interpolation, {ages.MemberCount} members, seed {ages.Seed})",
                    },
                    ["summaryTable"] = new JsonArray(Table("chron0model0summary0", SummaryTable, summaryColumns)),
                    ["ensembleTable"] = new JsonArray(Table("chron0model0ensemble0", EnsembleTable, ensembleColumns)),
                }),
            });
        }
        payload["data/metadata.jsonld"] = Encoding.UTF8.GetBytes(meta.ToJsonString(new JsonSerializerOptions { WriteIndented = true }) + "\n");
        WriteBag(output, payload);
    }

    private static (byte[] Csv, JsonArray Columns) CompositeColumns(Project project, CompositeResult composite, string unit)
    {
        var columns = new JsonArray(
            Column(1, "depth", unit, "composite depth"),
            Column(2, "ageMedian", "yr BP", "median age, calendar years before 1950 (NaN without an age model)"),
            Column(3, "ageLo", "yr BP", "2.5 percentile of the age"),
            Column(4, "ageHi", "yr BP", "97.5 percentile of the age"),
            Column(5, "sourceCore", "unitless", "core the splice takes this depth from"));
        int n = 6;
        foreach (var r in composite.Records)
        {
            string u = composite.Standardised ? "z-score" : UnitOf(project, r.Signal);
            columns.Add(Column(n++, $"{r.Signal}_mean", u, $"{r.Signal}: mean of the cores' stacked values"));
            columns.Add(Column(n++, $"{r.Signal}_lo", u, $"{r.Signal}: 2.5 percentile over cores and alignment members"));
            columns.Add(Column(n++, $"{r.Signal}_hi", u, $"{r.Signal}: 97.5 percentile over cores and alignment members"));
            columns.Add(Column(n++, $"{r.Signal}_n", "count", $"{r.Signal}: cores with a value"));
            columns.Add(Column(n++, $"{r.Signal}_splice", u, $"{r.Signal}: the spliced record"));
        }
        var csv = Csv(w =>
        {
            var ages = composite.Ages;
            for (int row = 0; row < composite.Grid.Count; row++)
            {
                var cells = new List<string>
                {
                    Num(composite.Grid.ValueAt(row)), Num(ages?.MedianBP[row] ?? double.NaN), Num(ages?.LoBP[row] ?? double.NaN),
                    Num(ages?.HiBP[row] ?? double.NaN), composite.Splice.SourceByRow[row] ?? "NaN",
                };
                foreach (var r in composite.Records)
                    cells.AddRange([Num(r.Mean[row]), Num(r.Lo[row]), Num(r.Hi[row]), r.N[row].ToString(CultureInfo.InvariantCulture), Num(r.Spliced[row])]);
                w.Write(string.Join(",", cells));
                w.Write('\n');
            }
        });
        return (csv, columns);
    }

    private static byte[] SummaryCsv(CompositeResult composite, CompositeAges ages) => Csv(w =>
    {
        for (int row = 0; row < composite.Grid.Count; row++)
            w.Write($"{Num(composite.Grid.ValueAt(row))},{Num(ages.MedianBP[row])},{Num(ages.LoBP[row])},{Num(ages.HiBP[row])}\n");
    });

    /// <summary>Ages to 0.1 yr: far below any age uncertainty, and it keeps thousands of members to a sensible size.</summary>
    private static byte[] EnsembleCsv(CompositeResult composite, AgeModelResult ages) => Csv(w =>
    {
        var sb = new StringBuilder();
        for (int row = 0; row < composite.Grid.Count; row++)
        {
            sb.Clear().Append(Num(composite.Grid.ValueAt(row)));
            var depth = composite.Grid.DepthAt(row);
            for (int m = 0; m < ages.MemberCount; m++)
                sb.Append(',').Append(ages.MemberAgeAt(m, depth).ToString("0.#", CultureInfo.InvariantCulture));
            w.Write(sb.Append('\n').ToString());
        }
    });

    private static string UnitOf(Project project, string signal) =>
        project.Cores.Select(c => c.Units.GetValueOrDefault(signal)).FirstOrDefault(u => u is not null) ?? "unknown";

    /// <summary>A table with its columns; each column's TSid (the standard's variable id) derives from the table and the column, so it is stable across runs.</summary>
    private static JsonObject Table(string name, string file, JsonArray columns)
    {
        foreach (var c in columns.OfType<JsonObject>())
            c["TSid"] = "SL" + Convert.ToHexString(SHA256.HashData(Encoding.UTF8.GetBytes($"{name}/{c["variableName"]}")))[..12];
        return new JsonObject
        {
            ["tableName"] = name,
            ["filename"] = file,
            ["missingValue"] = "NaN",
            ["columns"] = columns,
        };
    }

    private static JsonObject Column(int number, string name, string units, string description) => new()
    {
        ["number"] = number,
        ["variableName"] = name,
        ["units"] = units,
        ["description"] = description,
    };

    private static JsonObject Geo(Project project)
    {
        double? lat = project.Site.Latitude ?? project.Cores.Select(c => c.Latitude).FirstOrDefault(v => v is not null);
        double? lon = project.Site.Longitude ?? project.Cores.Select(c => c.Longitude).FirstOrDefault(v => v is not null);
        var geo = new JsonObject { ["type"] = "Feature", ["properties"] = new JsonObject { ["siteName"] = project.Site.Name } };
        if (lat is double la && lon is double lo)
            geo["geometry"] = new JsonObject { ["type"] = "Point", ["coordinates"] = new JsonArray(lo, la) };
        return geo;
    }

    private static string DataSetName(Project project)
    {
        var sb = new StringBuilder();
        foreach (char ch in project.Site.Name) sb.Append(char.IsAsciiLetterOrDigit(ch) || ch is '-' or '_' ? ch : '_');
        string name = sb.ToString().Trim('_');
        return name.Length > 0 ? name + ".composite" : "stratlink.composite";
    }

    private static void WriteBag(Stream output, SortedDictionary<string, byte[]> payload)
    {
        var tags = new SortedDictionary<string, byte[]>(StringComparer.Ordinal)
        {
            ["bagit.txt"] = Encoding.UTF8.GetBytes("BagIt-Version: 1.0\nTag-File-Character-Encoding: UTF-8\n"),
            ["bag-info.txt"] = Encoding.UTF8.GetBytes($"Bag-Software-Agent: stratlink\nPayload-Oxum: {payload.Values.Sum(b => (long)b.Length)}.{payload.Count}\n"),
            ["manifest-sha256.txt"] = Manifest(payload),
        };
        tags["tagmanifest-sha256.txt"] = Manifest(tags);
        using var zip = new ZipArchive(output, ZipArchiveMode.Create, leaveOpen: true);
        foreach (var (name, bytes) in tags.Concat(payload))
        {
            var entry = zip.CreateEntry("bag/" + name, CompressionLevel.Optimal);
            entry.LastWriteTime = EntryTime;
            using var s = entry.Open();
            s.Write(bytes);
        }
    }

    private static byte[] Manifest(SortedDictionary<string, byte[]> files) =>
        Encoding.UTF8.GetBytes(string.Concat(files.Select(f => $"{Convert.ToHexStringLower(SHA256.HashData(f.Value))}  {f.Key}\n")));

    private static byte[] Csv(Action<StreamWriter> write)
    {
        using var ms = new MemoryStream();
        using (var w = new StreamWriter(ms, new UTF8Encoding(false), 64 * 1024, leaveOpen: true)) write(w);
        return ms.ToArray();
    }

    private static string Num(double v) => double.IsNaN(v) ? "NaN" : v.ToString("R", CultureInfo.InvariantCulture);
}
