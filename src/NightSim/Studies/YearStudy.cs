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

    public YearNight Run(int index)
    {
        DateOnly date = DateOf(index);
        LightScenario sc = _base.Scenario!;
        string sky = SkyOf(date);
        double factor = Weather.NamedSkyFactor(sky);
        ulong seed = DeterministicRandom.ForStream(sc.Seed, "year#" + date.DayNumber.ToString(CultureInfo.InvariantCulture)).NextUInt64() >> 11;
        LightScenario night = sc with
        {
            Start = date,
            Nights = 1,
            Seed = seed,
            Weather = double.IsNaN(factor) ? sc.Weather : sc.Weather with { SkyFactor = factor },
        };
        NightRunResult r = NightRun.Run(_buffers.ForThisThread(_base with { Scenario = night }));
        NightSummary? n = r.Report.Nights.Count > 0 ? r.Report.Nights[0] : null;
        return new YearNight(index, date, sky,
            n?.Sunset is DateTimeOffset ss ? ReportText.Iso(ss) : null,
            n?.Sunrise is DateTimeOffset sr ? ReportText.Iso(sr) : null,
            StudyOutcome.From(r));
    }
}
