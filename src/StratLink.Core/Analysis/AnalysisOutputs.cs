using System.Globalization;
using StratLink.Export;
using StratLink.ProjectIO;

namespace StratLink.Analysis;

/// <summary>
/// Writes an <see cref="AnalysisResult"/> as tables (spectrum.csv, shifts.csv, filtered.csv, summary.csv; comma
/// separated through <see cref="DelimitedTableWriter"/>) and figures (spectrum.svg, shifts.svg, filtered.svg).
/// Columns vary with the periods asked for and the presence of an ensemble.
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
            ("spectrum.svg", AnalysisFigures.Spectrum(result).ToXml()),
            ("shifts.svg", AnalysisFigures.Shifts(result).ToXml()),
            ("filtered.svg", AnalysisFigures.Filtered(result).ToXml()),
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
        return Table(header, w =>
        {
            for (int k = 0; k < s.Frequencies.Length; k++)
            {
                w.Number(s.Frequencies[k]).Number(s.Periods[k]).Number(s.Power[k]).Number(s.RawPower[k]).Number(s.Background[k]);
                foreach (var level in s.ChiSquareLevels) w.Number(level[k]);
                if (s.MonteCarloLevels is { } mc) foreach (var level in mc) w.Number(level[k]);
                if (r.Ensemble is { } e) w.Number(e.ShareAbove95[k]);
                w.EndRow();
            }
        });
    }

    internal static string ShiftsTable(AnalysisResult r) =>
        Table(["index", "age_bp", "mean_before", "mean_after", "rsi", "tentative", "members_age_lo_bp", "members_age_hi_bp", "members_matched_share"], w =>
        {
            for (int i = 0; i < r.Regimes.Shifts.Count; i++)
            {
                var s = r.Regimes.Shifts[i];
                var spread = r.Ensemble?.Shifts[i];
                w.Number(s.Index).Number(s.AgeBP).Number(s.MeanBefore).Number(s.MeanAfter).Number(s.Rsi).Bool(s.Tentative)
                 .Number(spread?.AgeLoBP ?? double.NaN).Number(spread?.AgeHiBP ?? double.NaN).Number(spread?.ShareMatched ?? double.NaN);
                w.EndRow();
            }
        });

    internal static string FilteredTable(AnalysisResult r)
    {
        var f = r.Filtered;
        var header = new List<string> { "age_bp", "value", "lowpass" };
        header.AddRange(f.BandPasses.Select(b => "bandpass_" + Number(b.CentrePeriodYears) + "yr"));
        return Table(header, w =>
        {
            for (int i = 0; i < f.AgesBP.Length; i++)
            {
                w.Number(f.AgesBP[i]).Number(f.Values[i]).Number(f.LowPass.Values[i]);
                foreach (var b in f.BandPasses) w.Number(b.Values[i]);
                w.EndRow();
            }
        });
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
        return Table(["key", "value"], w =>
        {
            foreach (var (k, v) in rows)
            {
                w.Text(k).Text(v);
                w.EndRow();
            }
        });
    }

    private static string Number(double v) => DelimitedTableWriter.Format(v);

    private static string Table(IReadOnlyList<string> header, Action<DelimitedTableWriter> writeRows)
    {
        var text = new StringWriter(CultureInfo.InvariantCulture);
        var w = new DelimitedTableWriter(text, TableFormat.Csv);
        w.Header(header);
        writeRows(w);
        return text.ToString();
    }
}
