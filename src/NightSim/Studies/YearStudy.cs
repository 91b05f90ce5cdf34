using NightSim.Analysis;
using System.Globalization;
using NightSim.Reporting;
using NightSim.Runs;
using NightSim.Sky;

namespace NightSim.Studies;

/// <summary>
/// Every night of a date range at the scenario's site: each date is its own one-night run (local noon to noon, from
/// power-up) with the scenario's events seeded from the scenario seed and the date, and the sky drawn from the
/// scenario's monthly weather mix (or its fixed weather when it states no mix). Dates are independent, so they run in
/// parallel and in shards.
/// </summary>
public sealed class YearStudy
{
    private readonly NightRunRequest _base;
    private readonly StudyRunBuffers _buffers = new();

    public YearStudy(NightRunRequest request, DateOnly from, DateOnly to, int step = 1)
    {
        ArgumentNullException.ThrowIfNull(request.Scenario);
        if (to < from) throw new ArgumentException("to before from", nameof(to));
        _base = request;
        From = from;
        To = to;
        Step = Math.Max(1, step);
        Total = (to.DayNumber - from.DayNumber) / Step + 1;
    }

    public DateOnly From { get; }
    public DateOnly To { get; }
    public int Step { get; }
    public int Total { get; }

    public StudyHeader Header(string tool) => new()
    {
        Kind = "year",
        Tool = tool,
        Netlist = _base.NetlistPath,
        Scenario = _base.ScenarioPath,
        Seed = _base.Scenario!.Seed,
        Total = Total,
        Settings =
        [
            new("from", From.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture)),
            new("to", To.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture)),
            new("step", Step.ToString(CultureInfo.InvariantCulture)),
            new("weather", _base.Scenario!.WeatherMix is null ? "fixed" : "monthly mix"),
        ],
    };

    public DateOnly DateOf(int index) => From.AddDays(index * Step);

    /// <summary>The sky name of <paramref name="date"/>: drawn from the mix, or the scenario's own weather.</summary>
    public string SkyOf(DateOnly date)
    {
        LightScenario sc = _base.Scenario!;
        if (sc.WeatherMix is WeatherMix mix) return mix.Draw(date, sc.Seed);
        return WeatherMix.SkyNames.FirstOrDefault(n => Weather.NamedSkyFactor(n) == sc.Weather.SkyFactor)
            ?? sc.Weather.SkyFactor.ToString("0.##", CultureInfo.InvariantCulture);
    }

    /// <summary>The one-night scenario of a date: the scenario moved to that evening, its sky and its seed.</summary>
    private LightScenario NightOf(DateOnly date)
    {
        LightScenario sc = _base.Scenario!;
        double factor = Weather.NamedSkyFactor(SkyOf(date));
        ulong seed = DeterministicRandom.ForStream(sc.Seed, "year#" + date.DayNumber.ToString(CultureInfo.InvariantCulture)).NextUInt64() >> 11;
        return sc with
        {
            Start = date,
            Nights = 1,
            Seed = seed,
            Weather = double.IsNaN(factor) ? sc.Weather : sc.Weather with { SkyFactor = factor },
        };
    }

    /// <summary>The night run of one date again, this time with its plot data (the same run as the study's, so the
    /// same outcome).</summary>
    public NightRunResult RunWithPlots(DateOnly date) => NightRun.Run(_base with { Scenario = NightOf(date) });

    /// <summary>The dates whose nights get their own plots (the rule of <see cref="PlottedNights"/>).</summary>
    public static IReadOnlyList<DateOnly> PlottedDates(IReadOnlyList<YearNight> nights) =>
        PlottedNights.Select([.. nights.OrderBy(n => n.Date).Select(n => (n.Date, PlottedNights.TroubleOf(
            n.Outcome.Missed || n.Outcome.NeverEnds || n.Outcome.Failure is not null, n.Outcome.TargetsFailed > 0,
            n.Outcome.ChatterBursts, n.Outcome.FalseTriggers, n.Outcome.EarlyOffs, n.Outcome.WorstMargin ?? 0)))]);

    public YearNight Run(int index)
    {
        DateOnly date = DateOf(index);
        string sky = SkyOf(date);
        NightRunResult r = NightRun.Run(_buffers.ForThisThread(_base with { Scenario = NightOf(date) }));
        NightSummary? n = r.Report.Nights.Count > 0 ? r.Report.Nights[0] : null;
        return new YearNight(index, date, sky,
            n?.Sunset is DateTimeOffset ss ? ReportText.Iso(ss) : null,
            n?.Sunrise is DateTimeOffset sr ? ReportText.Iso(sr) : null,
            StudyOutcome.From(r));
    }
}
