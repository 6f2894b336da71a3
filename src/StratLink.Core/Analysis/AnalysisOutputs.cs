using System.Globalization;
using System.Text;
using StratLink.ProjectIO;

namespace StratLink.Analysis;

/// <summary>
/// Writes an <see cref="AnalysisResult"/> as tables (spectrum.csv, shifts.csv, filtered.csv, summary.csv; comma
/// separated, invariant culture, empty field = no value) and figures (spectrum.svg, shifts.svg, filtered.svg).
/// Columns vary with the periods asked for and the presence of an ensemble, so rows are written directly.
/// </summary>
public static class AnalysisOutputs
{
    /// <summary>Writes every file into <paramref name="directory"/> (created if missing) and returns their names.</summary>
    public static IReadOnlyList<string> Write(AnalysisResult result, string directory)
    {
        Directory.CreateDirectory(directory);
        var files = new List<(string Name, string Text)>
        {
            ("spectrum.csv", SpectrumTable(result)),
            ("shifts.csv", ShiftsTable(result)),
            ("filtered.csv", FilteredTable(result)),
            ("summary.csv", SummaryTable(result)),
            ("spectrum.svg", AnalysisFigures.Spectrum(result)),
            ("shifts.svg", AnalysisFigures.Shifts(result)),
            ("filtered.svg", AnalysisFigures.Filtered(result)),
        };
        foreach (var (name, text) in files) AtomicFile.WriteAllText(Path.Combine(directory, name), text, keepBackup: false);
        return files.Select(f => f.Name).ToList();
    }

    internal static string SpectrumTable(AnalysisResult r)
    {
        var s = r.Spectrum;
        var header = new List<string> { "frequency_per_yr", "period_yr", "power", "raw_power", "background" };
        header.AddRange(SignificanceLevels.Percents.Select(p => $"chi2_{p}"));
        if (s.MonteCarloLevels is not null) header.AddRange(SignificanceLevels.Percents.Select(p => $"mc_{p}"));
        if (r.Ensemble is not null) header.Add("members_above_chi2_95_share");
        var sb = new StringBuilder(string.Join(',', header)).Append('\n');
        for (int k = 0; k < s.Frequencies.Length; k++)
        {
            var row = new List<double> { s.Frequencies[k], s.Periods[k], s.Power[k], s.RawPower[k], s.Background[k] };
            row.AddRange(s.ChiSquareLevels.Select(l => l[k]));
            if (s.MonteCarloLevels is { } mc) row.AddRange(mc.Select(l => l[k]));
            if (r.Ensemble is { } e) row.Add(e.ShareAbove95[k]);
            sb.Append(string.Join(',', row.Select(Number))).Append('\n');
        }
        return sb.ToString();
    }

    internal static string ShiftsTable(AnalysisResult r)
    {
        var sb = new StringBuilder("index,age_bp,mean_before,mean_after,rsi,tentative,members_age_lo_bp,members_age_hi_bp,members_matched_share\n");
        for (int i = 0; i < r.Regimes.Shifts.Count; i++)
        {
            var s = r.Regimes.Shifts[i];
            var spread = r.Ensemble?.Shifts[i];
            sb.Append(s.Index.ToString(CultureInfo.InvariantCulture)).Append(',')
              .Append(string.Join(',', new[] { s.AgeBP, s.MeanBefore, s.MeanAfter, s.Rsi }.Select(Number))).Append(',')
              .Append(s.Tentative ? "true" : "false").Append(',')
              .Append(string.Join(',', new[] { spread?.AgeLoBP ?? double.NaN, spread?.AgeHiBP ?? double.NaN, spread?.ShareMatched ?? double.NaN }.Select(Number)))
              .Append('\n');
        }
        return sb.ToString();
    }

    internal static string FilteredTable(AnalysisResult r)
    {
        var f = r.Filtered;
        var header = new List<string> { "age_bp", "value", "lowpass" };
        header.AddRange(f.BandPasses.Select(b => "bandpass_" + Number(b.CentrePeriodYears) + "yr"));
        var sb = new StringBuilder(string.Join(',', header)).Append('\n');
        for (int i = 0; i < f.AgesBP.Length; i++)
        {
            var row = new List<double> { f.AgesBP[i], f.Values[i], f.LowPass.Values[i] };
            row.AddRange(f.BandPasses.Select(b => b.Values[i]));
            sb.Append(string.Join(',', row.Select(Number))).Append('\n');
        }
        return sb.ToString();
    }

    internal static string SummaryTable(AnalysisResult r)
    {
        var s = r.Spectrum;
        var o = r.Options;
        var rows = new List<(string, string)>
        {
            ("signal", r.SignalName),
            ("value_unit", r.ValueUnit ?? ""),
            ("seed", o.Seed.ToString(CultureInfo.InvariantCulture)),
            ("samples", r.Series.Count.ToString(CultureInfo.InvariantCulture)),
            ("oldest_age_bp", Number(r.Series.AgesBP[0])),
            ("youngest_age_bp", Number(r.Series.AgesBP[^1])),
            ("mean_spacing_yr", Number(r.Series.MeanSpacingYears)),
            ("persistence_tau_yr", Number(s.Persistence.TauYears)),
            ("persistence_rho", Number(s.Persistence.Rho)),
            ("spectrum_segments", s.Segments.ToString(CultureInfo.InvariantCulture)),
            ("spectrum_taper", s.Taper.ToString()),
            ("spectrum_oversampling", Number(o.Spectrum.Oversampling)),
            ("spectrum_degrees_of_freedom", Number(s.DegreesOfFreedom)),
            ("spectrum_6db_bandwidth_per_yr", Number(s.SixDecibelBandwidth)),
            ("spectrum_nyquist_per_yr", Number(s.NyquistFrequency)),
            ("spectrum_surrogates", s.Surrogates.ToString(CultureInfo.InvariantCulture)),
            ("spectrum_level_source", s.LevelSource),
            ("regime_cutoff_samples", o.Regimes.CutoffLength.ToString(CultureInfo.InvariantCulture)),
            ("regime_probability", Number(o.Regimes.Probability)),
            ("regime_huber", Number(o.Regimes.HuberParameter)),
            ("regime_sigma_l", Number(r.Regimes.SigmaL)),
            ("regime_critical_difference", Number(r.Regimes.CriticalDifference)),
            ("lowpass_sigma_yr", Number(r.Filtered.LowPass.SigmaYears)),
            ("lowpass_half_power_period_yr", Number(r.Filtered.LowPass.HalfPowerShortPeriodYears)),
            ("members_used", (r.Ensemble?.Members.Length ?? 0).ToString(CultureInfo.InvariantCulture)),
        };
        foreach (var b in r.Filtered.BandPasses)
        {
            string p = Number(b.CentrePeriodYears);
            rows.Add(($"bandpass_{p}yr_sigma_yr", Number(b.SigmaYears)));
            rows.Add(($"bandpass_{p}yr_half_power_band_yr", Number(b.HalfPowerShortPeriodYears) + "-" + Number(b.HalfPowerLongPeriodYears)));
        }
        foreach (var c in r.Periods)
        {
            string p = Number(c.PeriodYears);
            rows.Add(($"period_{p}yr_peak_period_yr", Number(c.PeakPeriodYears)));
            rows.Add(($"period_{p}yr_power_over_level95", Number(c.PowerOverLevel95)));
            rows.Add(($"period_{p}yr_members_above_95_share", Number(c.ShareOfMembersAbove95 ?? double.NaN)));
        }
        var sb = new StringBuilder("key,value\n");
        foreach (var (k, v) in rows) sb.Append(k).Append(',').Append(Quote(v)).Append('\n');
        return sb.ToString();
    }

    internal static string Number(double v) =>
        double.IsNaN(v) ? "" : double.IsPositiveInfinity(v) ? "inf" : double.IsNegativeInfinity(v) ? "-inf" : v.ToString("R", CultureInfo.InvariantCulture);

    private static string Quote(string v) => v.IndexOfAny([',', '"', '\n']) >= 0 ? "\"" + v.Replace("\"", "\"\"") + "\"" : v;
}
