using System.Globalization;
using System.Text;
using StratLink.Alignment;
using StratLink.Checks;
using StratLink.Model;
using StratLink.Quantities;
using StratLink.Tables;
using StratLink.Tests.TestSupport;
using Xunit.Abstractions;

namespace StratLink.Tests.Alignment;

/// <summary>
/// Real data: benthic d18O of ODP Site 849 (eastern equatorial Pacific; Mix et al. 1995, Proc. ODP
/// Sci. Results 138:371-412) aligned by dtw to the LR04 benthic stack (Lisiecki and Raymo 2005,
/// Paleoceanography 20, PA1003) over the stack's interval of the site's span, and the transferred
/// ages compared with the authors' own tuned age of every sample (an independent orbital tuning, so
/// the two age models differ by a few kyr at best).
/// </summary>
public class DatedTargetAlignerTests(ITestOutputHelper output)
{
    private static string Folder => RepoPaths.Data("benthic-stack");

    private static IEnumerable<string[]> Rows(string file) =>
        Encoding.Latin1.GetString(File.ReadAllBytes(file)).Replace("\r\n", "\n").Replace('\r', '\n').Split('\n')
            .Where(l => !l.StartsWith('#')).Select(l => l.Split((char[]?)null, StringSplitOptions.RemoveEmptyEntries));

    private static bool Number(string s, out double v) => double.TryParse(s, NumberStyles.Float, CultureInfo.InvariantCulture, out v);

    [Fact]
    public void Odp849_ages_transferred_from_the_LR04_stack_agree_with_the_published_age_model()
    {
        // ODP 849: depth (cm, revised composite), age (yr BP), d13C, d18O; replicate depths averaged.
        var samples = new SortedDictionary<double, (double Age, double Sum, int N)>();
        foreach (var f in Rows(Path.Combine(Folder, "ODP849_isot_Mix1995_NOAA.txt")))
        {
            if (f.Length < 4 || !Number(f[0], out double z) || !Number(f[1], out double age) || !Number(f[3], out double d18o)) continue;
            var (a, s, n) = samples.GetValueOrDefault(z, (age, 0, 0));
            samples[z] = (a, s + d18o, n + 1);
        }
        Assert.True(samples.Count > 1000, $"only {samples.Count} ODP 849 samples parsed");
        double[] depths = [.. samples.Keys];
        double[] published = samples.Values.Select(v => v.Age / 1000).ToArray(); // kyr
        var core = new CoreTable("ODP849", DepthUnit.Centimetre, depths, new Dictionary<string, double[]> { ["d18o"] = samples.Values.Select(v => v.Sum / v.N).ToArray() });

        // LR04: age (ka), d18O, standard error; the stack over the site's span (its first and last tuned ages).
        var stack = Rows(Path.Combine(Folder, "LR04stack.txt"))
            .Where(f => f.Length >= 2 && Number(f[0], out _) && Number(f[1], out _))
            .Select(f => (Age: double.Parse(f[0], CultureInfo.InvariantCulture), D18O: double.Parse(f[1], CultureInfo.InvariantCulture)))
            .Where(r => r.Age >= Math.Floor(published[0]) && r.Age <= Math.Ceiling(published[^1])).ToArray();
        Assert.True(stack.Length > 1000, $"only {stack.Length} LR04 rows in the site's span");

        var settings = new AlignmentSettings { Window = 0.1, Ensemble = 200 };
        var ages = DatedTargetAligner.Align(core, "d18o", stack.Select(r => r.Age).ToArray(), stack.Select(r => r.D18O).ToArray(), settings, 7, new FindingList());

        double sq = 0;
        int inside = 0;
        var widths = new double[depths.Length];
        for (int k = 0; k < depths.Length; k++)
        {
            double e = ages.AgeAt(depths[k]) - published[k];
            sq += e * e;
            var (lo, hi) = ages.AgeRange(depths[k]);
            if (published[k] >= lo && published[k] <= hi) inside++;
            widths[k] = hi - lo;
        }
        double rms = Math.Sqrt(sq / depths.Length), coverage = (double)inside / depths.Length;
        double straight = Math.Sqrt(depths.Select((z, k) => stack[0].Age + (stack[^1].Age - stack[0].Age) * (z - depths[0]) / (depths[^1] - depths[0]) - published[k]).Sum(e => e * e) / depths.Length);
        output.WriteLine($"ODP 849 -> LR04 by d18O: RMS {rms:0.0} kyr against the published ages (constant rate between the ends: {straight:0.0} kyr); 95% band holds the published age at {coverage:P1} of {depths.Length} samples, median width {Statistics.PercentileSorted([.. widths.Order()], 50):0.0} kyr");

        // As age controls with LR04's own age error (about 4 kyr over the last 1 Myr and 6 kyr before;
        // Lisiecki and Raymo 2005, from memory): the share of published ages within 1.96 sigma.
        var controls = ages.Controls(depths, age => age <= 1000 ? 4 : 6);
        double held = controls.Select((c, k) => Math.Abs(c.Age - published[k]) <= 1.96 * c.Sigma ? 1.0 : 0.0).Average();
        output.WriteLine($"as age controls (alignment spread and LR04 age error in quadrature): 95% interval holds the published age at {held:P1}");
        Assert.All(controls, c => Assert.True(c.Sigma >= 4, $"sigma {c.Sigma:0.0} kyr at {c.CoreDepth} cm is below the target's own age error"));
        // Bounds: dtw must at least halve the constant-rate error, and stay within half a 41-kyr
        // obliquity cycle of the authors' tuning (the scale on which a tuning can be off by a cycle; common practice).
        Assert.True(rms <= 0.5 * straight, $"RMS {rms:0.0} kyr is not at most half the constant-rate {straight:0.0} kyr");
        Assert.True(rms <= 20.5, $"RMS {rms:0.0} kyr exceeds half an obliquity cycle");
    }
}
