using System.Collections.Immutable;
using MathNet.Numerics.Distributions;
using StratLink.Model;
using StratLink.Quantities;
using StratLink.Tables;

namespace StratLink.Demo;

/// <summary>
/// Generates the invented demo site "Mirrowick Fjord, inner basin" from one true site history: four
/// parallel cores (two piston cores, a gravity core that lost its top, a freeze core), each with
/// its own smoothly varying accumulation rate, event layers, section gaps, proxies with their own
/// noise and calibration offsets, marker layers, tephra and coring-year ages and varve counts of the
/// laminated sediment in the reference core (used for ages) and the freeze core (a check).
/// Pure and deterministic: the same seed gives the same site, number for number.
/// </summary>
public static class DemoSiteGenerator
{
    public const string SiteName = "Mirrowick Fjord, inner basin";
    public const string FileStem = "mirrowick-fjord";

    /// <summary>Every core of the site was taken in 2019 CE.</summary>
    public const int CoringYearCE = 2019;

    public const double CoringAgeBP = CalendarAge.ReferenceYearCE - CoringYearCE;

    /// <summary>Sample spacing in cm (the project unit).</summary>
    public const double SampleStep = 0.5;

    public const string ReferenceCore = "MW19-P1";
    public const string VarveCore = "MW19-F4";
    public static readonly IReadOnlyList<string> SignalNames = ["ms", "density", "ca_ti"];

    private const int HistoryYears = 6000;

    /// <summary>Share of varves the counts miss or split (half each): 2 %, the common practice rate the age model assumes.</summary>
    private const double VarveMiscountRate = 0.02;

    /// <summary>Samples average the column over their slice, resolved in this many sub-steps (event layers are a few mm thick).</summary>
    private const int SubSamples = 10;

    /// <param name="MeanRate">Mean accumulation rate, cm/yr. Fjord basins accumulate a few mm per year
    /// (common practice; about 1-10 mm/yr is the usual range quoted for fjords).</param>
    /// <param name="SectionLength">Liner section length, cm; section breaks are where gaps may fall (0 = one section).</param>
    /// <param name="DisturbedTop">The top few cm came up soupy and mixed (listed under disturbed).</param>
    private sealed record CorePlan(string Id, string Type, double MeanRate, double MinLength, double MaxLength,
        double MinLostTop, double MaxLostTop, double SectionLength, int GapCount, bool DisturbedTop,
        double MsNoise, double DensityNoise, double CaTiNoise);

    /// <param name="Thickness">Thickness in each core's complete column, cm, in core order (0 = not deposited there).</param>
    /// <param name="AgeError">1 sigma of the published age of a tephra, years; null for undated events.</param>
    private sealed record EventPlan(string Id, MarkerKind Kind, double AgeBP, bool IsMarker, double[] Thickness, double? AgeError = null);

    private static readonly CorePlan[] Cores =
    [
        new("MW19-P1", "piston", 0.235, 850, 890, 0, 0, 150, 2, false, 1.2, 0.010, 0.04),
        new("MW19-P2", "piston", 0.220, 720, 790, 0, 0, 150, 3, true, 1.5, 0.012, 0.05),
        new("MW19-G3", "gravity", 0.200, 285, 315, 30, 45, 100, 1, false, 2.0, 0.015, 0.06),
        new("MW19-F4", "freeze", 0.210, 80, 95, 0, 0, 0, 0, false, 1.5, 0.015, 0.05),
    ];

    // Event ages fall mid-year so that a layer lies inside one varve. Flood-1 lies above the gravity
    // core's lost top, so that core lacks one marker.
    private static readonly EventPlan[] Events =
    [
        new("flood-1", MarkerKind.Flood, 8.5, true, [2.5, 3.2, 2.0, 2.2]),
        new("ash-1", MarkerKind.Tephra, 180.5, true, [0.6, 0.5, 0.6, 0.7], AgeError: 1),
        new("turb-1", MarkerKind.Turbidite, 561.5, true, [4.0, 6.0, 3.0, 0]),
        new("flood-a", MarkerKind.Flood, 823.5, false, [0, 1.5, 1.2, 0]),
        new("ash-2", MarkerKind.Tephra, 1187.5, true, [0.5, 0.5, 0.4, 0], AgeError: 25),
        new("turb-2", MarkerKind.Turbidite, 1722.5, true, [5.0, 3.5, 4.0, 0]),
        new("flood-b", MarkerKind.Flood, 2046.5, false, [1.5, 0, 0, 0]),
        new("ash-3", MarkerKind.Tephra, 2641.5, true, [0.8, 0.7, 0.8, 0], AgeError: 40),
        new("flood-2", MarkerKind.Flood, 2953.5, true, [3.0, 4.0, 3.0, 0]),
    ];

    public static DemoSite Generate(int seed) => Generate(seed, DemoSiteShape.Shipped);

    public static DemoSite Generate(int seed, DemoSiteShape shape)
    {
        var history = SiteHistory.Simulate(SeedStreams.For(seed, "history"), CoringAgeBP, HistoryYears,
            ar1Coefficient: 0.7, ar1StdDev: 1.0,
            cycles: [new SignalCycle(11, 0.6, PhaseOf(seed, "cycle-11")), new SignalCycle(88, 0.8, PhaseOf(seed, "cycle-88"))],
            shifts: [new RegimeShift(1480, 0.9), new RegimeShift(2710, -0.8)],
            productivityAr1: 0.98);
        var events = DrawEvents(seed);

        // Each core's column, then its recovered part: the reference first, since the others must end above its base age.
        double[] commonLogRate = LogRateWiggles(SeedStreams.For(seed, "rate/common"), history.AgesBP, 4, 80, 800, 0.15);
        var strata = new Dictionary<string, CoreStratigraphy>();
        var lengths = new Dictionary<string, double>();
        double referenceBaseAge = double.PositiveInfinity;
        foreach (var plan in Cores)
        {
            var geometry = SeedStreams.For(seed, "geometry/" + plan.Id);
            double lostTop = Math.Round(Uniform(geometry, plan.MinLostTop, plan.MaxLostTop), 1);
            var strat = CoreStratigraphy.Build(history.AgesBP, Rate(seed, plan, history.AgesBP, commonLogRate),
                events.Select(e => (e.AgeBP, e.ThicknessIn(plan.Id))).ToList(), lostTop);
            double length = Uniform(geometry, plan.MinLength, plan.MaxLength);
            if (shape.LengthOf(plan.Id) is { } chosen) length = chosen;
            else if (plan.Id == ReferenceCore) referenceBaseAge = strat.AgeAt(length);
            // Every core must end well above the reference core's base so its true composite depth exists.
            else length = Math.Min(length, strat.CoreDepthAtAge(referenceBaseAge - 150));
            // The freeze core should hold the youngest dated tephra, within its metre.
            if (plan.Id == VarveCore && strat.LayerOf(EventIndex("ash-1")) is { } ash)
                length = Math.Min(Math.Max(length, ash.Base + 5), 100);
            strata[plan.Id] = strat;
            lengths[plan.Id] = Math.Round(length, 1);
        }

        var coreSpecs = ImmutableList.CreateBuilder<CoreSpec>();
        var tables = new Dictionary<string, CoreTable>();
        var truths = new Dictionary<string, CoreTruth>();
        foreach (var plan in Cores)
        {
            var strat = strata[plan.Id];
            double length = lengths[plan.Id];
            var gaps = Gaps(SeedStreams.For(seed, "gaps/" + plan.Id), plan, length, strat, events.Count);
            ImmutableList<DepthInterval> disturbed = plan.DisturbedTop
                ? [DepthInterval.FromTopBottom(0, Math.Round(Uniform(SeedStreams.For(seed, "disturbed"), 5, 9) * 2) / 2, DepthUnit.Centimetre)]
                : [];
            double[] depths = SampleDepths(length, gaps);
            var signals = Signals(seed, plan, strat, history, events, depths, length, disturbed);
            tables[plan.Id] = new CoreTable(plan.Id, DepthUnit.Centimetre, depths, signals);
            truths[plan.Id] = new CoreTruth(plan.Id, length, depths, strat, strata[shape.Reference]);
            coreSpecs.Add(new CoreSpec
            {
                Id = plan.Id,
                Type = plan.Type,
                Table = $"cores/{plan.Id}.csv",
                CoringYear = CoringYearCE,
                Signals = [.. SignalNames],
                Gaps = [.. gaps],
                Disturbed = disturbed,
                Events = EventIntervals(strat, events.Count, length, gaps),
            });
        }

        var markers = Markers(SeedStreams.For(seed, "picks"), events, strata, lengths, coreSpecs);
        var (counted, trueCount) = Varves(SeedStreams.For(seed, "varves"), strata[VarveCore], lengths[VarveCore]);
        var (referenceCounted, referenceTrueCount) = Varves(SeedStreams.For(seed, "varves/" + ReferenceCore), strata[ReferenceCore], lengths[ReferenceCore]);
        var project = new Project
        {
            Site = new SiteInfo(SiteName),
            DepthUnit = DepthUnit.Centimetre,
            Cores = coreSpecs.ToImmutable(),
            Markers = markers,
            Ages = AgeControls(SeedStreams.For(seed, "ages"), events, markers),
            Alignment = new AlignmentSettings
            {
                Reference = shape.Reference,
                Signals = [new SignalWeight("ms", 1.0), new SignalWeight("density", 0.5), new SignalWeight("ca_ti", 0.75)],
                Window = 0.15,
                Ensemble = 200,
                Method = AlignmentMethods.Dtw,
            },
            Composite = new CompositeSettings { Step = 0.5, Splice = null },
            AgeModel = new AgeModelSettings { Iterations = 2000, Seed = 42 },
        };
        return new DemoSite(seed, FileStem, project, tables, truths, VarveCore, counted, trueCount, referenceCounted, referenceTrueCount, history, events);
    }

    private static int EventIndex(string id) => Array.FindIndex(Events, e => e.Id == id);

    private static double Uniform(Random rng, double lo, double hi) => lo + (hi - lo) * rng.NextDouble();

    private static double PhaseOf(int seed, string stream) => Uniform(SeedStreams.For(seed, stream), 0, 2 * Math.PI);

    private static List<EventLayer> DrawEvents(int seed)
    {
        var rng = SeedStreams.For(seed, "events");
        var list = new List<EventLayer>();
        foreach (var e in Events)
        {
            var thickness = new Dictionary<string, double>();
            for (int c = 0; c < Cores.Length; c++)
                thickness[Cores[c].Id] = e.Thickness[c] * Uniform(rng, 0.85, 1.15);
            list.Add(new EventLayer(e.Id, e.Kind, e.AgeBP, e.IsMarker, thickness));
        }
        return list;
    }

    /// <summary>
    /// Accumulation rate at each age: the core's mean, raised near the top where the sediment is still
    /// porous (apparent rates fall with compaction), times smooth log-normal wiggles shared by the basin
    /// and the core's own (decades to centuries), so rate ratios between cores change on decimetre scales.
    /// </summary>
    private static double[] Rate(int seed, CorePlan plan, double[] agesBP, double[] commonLogRate)
    {
        double[] own = LogRateWiggles(SeedStreams.For(seed, "rate/" + plan.Id), agesBP, 6, 40, 400, 0.3);
        var rate = new double[agesBP.Length];
        for (int i = 0; i < rate.Length; i++)
        {
            double porosityBoost = 1 + 0.6 * Math.Exp(-(agesBP[i] - CoringAgeBP) / 120);
            rate[i] = plan.MeanRate * porosityBoost * Math.Exp(commonLogRate[i] + own[i]);
        }
        return rate;
    }

    /// <summary>Sum of sinusoids with log-uniform periods in [minPeriod, maxPeriod] and total standard deviation <paramref name="sd"/>.</summary>
    private static double[] LogRateWiggles(Random rng, double[] agesBP, int count, double minPeriod, double maxPeriod, double sd)
    {
        var w = new double[agesBP.Length];
        double amplitude = sd * Math.Sqrt(2.0 / count);
        for (int k = 0; k < count; k++)
        {
            double period = minPeriod * Math.Pow(maxPeriod / minPeriod, rng.NextDouble());
            double phase = Uniform(rng, 0, 2 * Math.PI);
            for (int i = 0; i < w.Length; i++) w[i] += amplitude * Math.Sin(2 * Math.PI * agesBP[i] / period + phase);
        }
        return w;
    }

    /// <summary>Gaps at some section breaks, a few cm wide, moved below any event layer they would hide.</summary>
    private static List<DepthInterval> Gaps(Random rng, CorePlan plan, double length, CoreStratigraphy strat, int eventCount)
    {
        var gaps = new List<DepthInterval>();
        if (plan.GapCount == 0) return gaps;
        var breaks = new List<double>();
        for (double b = plan.SectionLength; b < length - 20; b += plan.SectionLength) breaks.Add(b);
        var layers = Enumerable.Range(0, eventCount).Select(strat.LayerOf).OfType<(double Top, double Base)>().ToList();
        // Partial Fisher-Yates shuffle picks which breaks lost sediment.
        for (int g = 0; g < Math.Min(plan.GapCount, breaks.Count); g++)
        {
            int j = g + rng.Next(breaks.Count - g);
            (breaks[g], breaks[j]) = (breaks[j], breaks[g]);
            double top = breaks[g] + Uniform(rng, -4, 4);
            double width = Uniform(rng, 1.5, 6);
            bool moved = true;
            while (moved)
            {
                moved = false;
                foreach (var (lt, lb) in layers)
                    if (top - 1.5 < lb && top + width + 1.5 > lt)
                    {
                        top = lb + 2;
                        moved = true;
                    }
            }
            if (top + width > length - 10) continue;
            gaps.Add(DepthInterval.FromTopBottom(Math.Round(top, 1), Math.Round(top + width, 1), DepthUnit.Centimetre));
        }
        return gaps.OrderBy(g => g.Top).ToList();
    }

    /// <summary>Every event layer wholly inside the recovered core and clear of its gaps, as logged (to the mm).</summary>
    private static ImmutableList<DepthInterval> EventIntervals(CoreStratigraphy strat, int eventCount, double length, IReadOnlyList<DepthInterval> gaps)
    {
        var list = ImmutableList.CreateBuilder<DepthInterval>();
        for (int e = 0; e < eventCount; e++)
        {
            if (strat.LayerOf(e) is not { } layer || layer.Top < 0 || layer.Base > length) continue;
            double top = Math.Round(layer.Top, 1), bottom = Math.Round(layer.Base, 1);
            if (gaps.Any(g => g.Top.In(DepthUnit.Centimetre) <= bottom && g.Bottom.In(DepthUnit.Centimetre) >= top)) continue;
            if (list.Count > 0 && top < list[^1].Bottom.In(DepthUnit.Centimetre)) continue;
            list.Add(DepthInterval.FromTopBottom(top, bottom, DepthUnit.Centimetre));
        }
        return list.ToImmutable();
    }

    private static double[] SampleDepths(double length, IReadOnlyList<DepthInterval> gaps)
    {
        var depths = new List<double>();
        for (int k = 0; k * SampleStep <= length; k++)
        {
            double z = k * SampleStep;
            if (!gaps.Any(g => g.ContainsValue(z))) depths.Add(z);
        }
        return [.. depths];
    }

    private static Dictionary<string, double[]> Signals(int seed, CorePlan plan, CoreStratigraphy strat, SiteHistory history,
        IReadOnlyList<EventLayer> events, double[] depths, double length, IReadOnlyList<DepthInterval> disturbed)
    {
        var sensor = SeedStreams.For(seed, "sensor/" + plan.Id);
        double msGain = Uniform(sensor, 0.85, 1.15), msOffset = Uniform(sensor, -4, 4);
        double densityOffset = Uniform(sensor, -0.03, 0.03), caTiOffset = Uniform(sensor, -0.15, 0.15);
        // Same stream for every core: an event's strength is a property of the event, not of the core.
        var intensity = SeedStreams.For(seed, "intensity");
        double[] eventIntensity = events.Select(_ => Uniform(intensity, 0.8, 1.2)).ToArray();

        var noise = SeedStreams.For(seed, "noise/" + plan.Id);
        int n = depths.Length;
        double[] ms = new double[n], density = new double[n], caTi = new double[n];
        for (int i = 0; i < n; i++)
        {
            // A sample is a slice of SampleStep centred on its depth: average the column over it.
            double sumMs = 0, sumDensity = 0, sumCaTi = 0;
            int used = 0;
            for (int j = 0; j < SubSamples; j++)
            {
                double z = depths[i] - SampleStep / 2 + (j + 0.5) * SampleStep / SubSamples;
                if (z < 0 || z > length) continue;
                var (age, ev, f) = strat.Locate(z);
                var (m, d, c) = ev >= 0
                    ? EventProxies(events[ev].Kind, f, eventIntensity[ev])
                    : Background(history, age, z + strat.LostTop);
                sumMs += m;
                sumDensity += d;
                sumCaTi += c;
                used++;
            }
            ms[i] = msGain * sumMs / used + msOffset + Normal.Sample(noise, 0, plan.MsNoise);
            density[i] = sumDensity / used + densityOffset + Normal.Sample(noise, 0, plan.DensityNoise);
            caTi[i] = sumCaTi / used + caTiOffset + Normal.Sample(noise, 0, plan.CaTiNoise);
        }
        foreach (var iv in disturbed) Disturb(SeedStreams.For(seed, "disturbed/" + plan.Id), iv, depths, ms, density, caTi);
        return new Dictionary<string, double[]> { ["ms"] = ms, ["density"] = density, ["ca_ti"] = caTi };
    }

    /// <summary>
    /// Proxies of the background sediment. ms (SI x 1e-5) follows detrital input (the climate signal);
    /// dry bulk density (g/cm3) rises with burial depth as porosity falls; ln(Ca/Ti) falls with detrital
    /// input and rises with productivity.
    /// </summary>
    private static (double Ms, double Density, double CaTi) Background(SiteHistory history, double ageBP, double columnDepth)
    {
        double c = history.ClimateAt(ageBP), q = history.ProductivityAt(ageBP);
        return (35 + 8 * c - 3 * q,
            1.28 + 0.16 * (1 - Math.Exp(-columnDepth / 90)) + 0.035 * c + 0.02 * q,
            0.15 - 0.22 * c + 0.28 * q);
    }

    /// <summary>
    /// Proxies inside an event layer at fraction f from its top (0) to its base (1). Turbidites and flood
    /// beds are graded (coarser, denser, more magnetic towards the base) and Ti-rich; tephras are thin,
    /// strongly magnetic glass.
    /// </summary>
    private static (double Ms, double Density, double CaTi) EventProxies(MarkerKind kind, double f, double intensity) => kind switch
    {
        MarkerKind.Turbidite => ((70 + 90 * f) * intensity, 1.62 + 0.28 * f, -0.5 - 0.35 * f),
        MarkerKind.Tephra => (320 * intensity, 1.78, -1.3),
        _ => ((55 + 25 * f) * intensity, 1.55 + 0.12 * f, -0.7 - 0.1 * f),
    };

    /// <summary>A soupy, mixed top: low density, erratic ms and Ca/Ti scattered around the values just below.</summary>
    private static void Disturb(Random rng, DepthInterval interval, double[] depths, double[] ms, double[] density, double[] caTi)
    {
        double bottom = interval.Bottom.In(DepthUnit.Centimetre);
        var below = Enumerable.Range(0, depths.Length).Where(i => depths[i] > bottom && depths[i] <= bottom + 15).ToList();
        double msMean = below.Average(i => ms[i]), caTiMean = below.Average(i => caTi[i]);
        for (int i = 0; i < depths.Length; i++)
        {
            if (!interval.ContainsValue(depths[i])) continue;
            ms[i] = msMean * Uniform(rng, 0.4, 1.6);
            density[i] = 1.08 + Normal.Sample(rng, 0, 0.03);
            caTi[i] = caTiMean + Normal.Sample(rng, 0, 0.35);
        }
    }

    /// <summary>Marker depths as picked (mid-layer, a couple of mm of picking error) in every core whose recovered part holds the whole layer.</summary>
    private static ImmutableList<MarkerSpec> Markers(Random rng, IReadOnlyList<EventLayer> events, Dictionary<string, CoreStratigraphy> strata,
        Dictionary<string, double> lengths, IReadOnlyList<CoreSpec> cores)
    {
        var markers = ImmutableList.CreateBuilder<MarkerSpec>();
        for (int e = 0; e < events.Count; e++)
        {
            if (!events[e].IsMarker) continue;
            var depths = ImmutableList.CreateBuilder<MarkerDepth>();
            foreach (var core in cores)
            {
                if (strata[core.Id].LayerOf(e) is not { } layer) continue;
                if (layer.Top < 0 || layer.Base > lengths[core.Id]) continue;
                if (core.Gaps.Any(g => g.Top.In(DepthUnit.Centimetre) <= layer.Base && g.Bottom.In(DepthUnit.Centimetre) >= layer.Top)) continue;
                double pick = Math.Clamp(0.5 * (layer.Top + layer.Base) + Normal.Sample(rng, 0, 0.15), layer.Top, layer.Base);
                depths.Add(new MarkerDepth(core.Id, CoreDepth.From(Math.Round(pick, 1), DepthUnit.Centimetre)));
            }
            if (depths.Count < 2) continue;
            markers.Add(new MarkerSpec
            {
                Id = events[e].Id,
                Kind = events[e].Kind,
                Depths = depths.ToImmutable(),
                Uncertainty = events[e].Kind == MarkerKind.Tephra ? 0.3 : 0.5,
            });
        }
        return markers.ToImmutable();
    }

    /// <summary>
    /// Every age control of the site, all used: the coring year at the freeze core's top, the published tephra
    /// ages (true age plus an error of their stated sigma), and two varve counts anchored at their intact tops in
    /// the coring year, with the common 2 % miscount rate: the reference piston core's over its whole length and
    /// the freeze core's over its metre.
    /// <para>
    /// Scenario: the inner basin is laminated throughout, so the reference core carries a varve chronology. An
    /// earlier version dated the piston cores by tephras 500-1500 yr apart only; with the accumulation rate free
    /// to wander between them, every age-model member then misplaced samples by tens of years, which smears an
    /// 11-yr line over many frequency bins: no member could find the cycles the site was made with. Annually
    /// resolved chronologies are what make decadal cycles detectable in sediment records (common practice).
    /// The age model carries the ensemble on the longer count and weighs each member by the tephras, the coring
    /// year and the freeze-core count.
    /// </para>
    /// </summary>
    private static ImmutableList<AgeControlSpec> AgeControls(Random rng, IReadOnlyList<EventLayer> events, IReadOnlyList<MarkerSpec> markers)
    {
        var ages = ImmutableList.CreateBuilder<AgeControlSpec>();
        ages.Add(new CalendarAgeControl
        {
            Id = "coring-year", Core = VarveCore, Depth = CoreDepth.From(0, DepthUnit.Centimetre),
            Age = CalendarAge.FromYearsBP(CoringAgeBP), Error = 1,
        });
        for (int e = 0; e < events.Count; e++)
        {
            if (Events[e].AgeError is not double sigma || !markers.Any(m => m.Id == events[e].Id)) continue;
            double published = Math.Round(events[e].AgeBP + Normal.Sample(rng, 0, sigma));
            ages.Add(new CalendarAgeControl
            {
                Id = events[e].Id + "-age", Marker = events[e].Id, Age = CalendarAge.FromYearsBP(published), Error = sigma,
            });
        }
        ages.Add(new VarveCountControl
        {
            Id = "varves", Core = VarveCore, Table = $"cores/{VarveCore}-varves.csv",
            AnchorDepth = CoreDepth.From(0, DepthUnit.Centimetre), AnchorAge = CalendarAge.FromYearsBP(CoringAgeBP),
            MiscountRate = VarveMiscountRate,
        });
        ages.Add(new VarveCountControl
        {
            Id = "varves-p1", Core = ReferenceCore, Table = $"cores/{ReferenceCore}-varves.csv",
            AnchorDepth = CoreDepth.From(0, DepthUnit.Centimetre), AnchorAge = CalendarAge.FromYearsBP(CoringAgeBP),
            MiscountRate = VarveMiscountRate,
        });
        return ages.ToImmutable();
    }

    /// <summary>
    /// One varve per year from the top down to the last whole varve in the core (an event layer lies inside one varve); counting misses about
    /// one boundary in a hundred and splits about one varve in a hundred.
    /// </summary>
    private static (List<VarveLayer> Counted, int TrueCount) Varves(Random rng, CoreStratigraphy strat, double length)
    {
        var boundaries = new List<double> { strat.CoreDepthAtAge(CoringAgeBP) };
        while (strat.CoreDepthAtAge(CoringAgeBP + boundaries.Count) is var next && next <= length) boundaries.Add(next);
        int trueCount = boundaries.Count - 1;
        var counted = new List<VarveLayer>();
        for (int k = 0; k < trueCount; k++)
        {
            double top = boundaries[k], bottom = boundaries[k + 1];
            double u = rng.NextDouble();
            if (u < VarveMiscountRate / 2 && k + 1 < trueCount) bottom = boundaries[++k + 1];
            else if (u < VarveMiscountRate)
            {
                double mid = 0.5 * (top + bottom);
                counted.Add(new VarveLayer(Math.Round(top, 2), Math.Round(mid, 2)));
                top = mid;
            }
            counted.Add(new VarveLayer(Math.Round(top, 2), Math.Round(bottom, 2)));
        }
        return (counted, trueCount);
    }
}
