using System.Globalization;
using System.Text.Json;

namespace NightSim.Sky.Events;

/// <summary>One return stroke of a flash: run time of its start and its peak lux at the sensor.</summary>
public readonly record struct LightningStroke(double Start, double PeakLux);

/// <summary>
/// A multi-stroke lightning flash. Each stroke rises linearly in <see cref="RiseSeconds"/> and decays exponentially
/// with <see cref="DecaySeconds"/>, cut to zero after ten time constants. Defaults: 3–5 strokes ≈ 60 ms
/// apart (CIGRE Technical Brochure 549, Lightning parameters for engineering applications, 2013); 20 µs rise and
/// 300 µs decay of a stroke's light from memory.
/// </summary>
public sealed class LightningFlash : ILightEvent
{
    /// <summary>Stroke rise time, seconds.</summary>
    public const double DefaultRiseSeconds = 20e-6;
    /// <summary>Stroke decay time constant, seconds.</summary>
    public const double DefaultDecaySeconds = 300e-6;
    private const double CutoffTimeConstants = 10.0;

    private readonly LightningStroke[] _strokes;

    public LightningFlash(IReadOnlyList<LightningStroke> strokes, string channel,
        double riseSeconds = DefaultRiseSeconds, double decaySeconds = DefaultDecaySeconds)
    {
        if (strokes.Count == 0) throw new ArgumentException("a flash needs at least one stroke");
        _strokes = [.. strokes.OrderBy(s => s.Start)];
        RiseSeconds = riseSeconds;
        DecaySeconds = decaySeconds;
        Channel = channel;
        Start = _strokes[0].Start;
        End = _strokes[^1].Start + StrokeLength;
        double peak = 0;
        foreach (var s in _strokes) peak = Math.Max(peak, s.PeakLux);
        PeakLux = peak;
    }

    public string Kind => "lightning";
    public string Channel { get; }
    public double Start { get; }
    public double End { get; }
    public double PeakLux { get; }
    public double RiseSeconds { get; }
    public double DecaySeconds { get; }
    public IReadOnlyList<LightningStroke> Strokes => _strokes;
    public LightEffect Effect => LightEffect.AddLux;
    private double StrokeLength => RiseSeconds + CutoffTimeConstants * DecaySeconds;

    public string Description => string.Create(CultureInfo.InvariantCulture,
        $"lightning flash, {_strokes.Length} strokes over {(End - Start) * 1e3:F0} ms, peak {PeakLux:G4} lx");

    public double Value(double time)
    {
        if (time < Start || time > End) return 0.0;
        double sum = 0.0;
        double len = StrokeLength;
        for (int i = 0; i < _strokes.Length; i++)
        {
            double dt = time - _strokes[i].Start;
            if (dt <= 0 || dt >= len) continue;
            sum += dt < RiseSeconds
                ? _strokes[i].PeakLux * dt / RiseSeconds
                : _strokes[i].PeakLux * Math.Exp(-(dt - RiseSeconds) / DecaySeconds);
        }
        return sum;
    }

    public void AddBreakpoints(List<double> into)
    {
        foreach (var s in _strokes)
        {
            into.Add(s.Start);
            into.Add(s.Start + RiseSeconds);
            into.Add(s.Start + StrokeLength);
        }
    }
}

/// <summary>One storm: clock time it starts, length in minutes, mean flashes per minute (Poisson).</summary>
public sealed record LightningStorm(TimeSpan From, double Minutes, double FlashesPerMinute);

/// <summary>
/// JSON kind "lightning": seeded storms of multi-stroke flashes. Each flash has 3–5 strokes (uniform), 40–80 ms apart,
/// each stroke's peak uniform in 30–100 % of "peakLux" (10–10 000 lx at the sensor is plausible: 10⁹ W of light at 100 lm/W,
/// isotropic, gives E = Φ/(4πd²) ≈ 8 000 lx at 1 km and 80 lx at 10 km; an order-of-magnitude estimate).
/// </summary>
public sealed class LightningDefinition : IEventDefinition
{
    private LightningDefinition(IReadOnlyList<LightningStorm> storms, double peakLux, string channel)
    {
        Storms = storms; PeakLux = peakLux; Channel = channel;
    }

    public string Kind => "lightning";
    public string? Channel { get; }
    public IReadOnlyList<LightningStorm> Storms { get; }
    public double PeakLux { get; }

    public static IEventDefinition? Parse(JsonElement e, string path, ScenarioParseContext ctx)
    {
        ctx.CheckProperties(e, path, "kind", "storms", "peakLux", "channel");
        double? peak = ctx.Number(e, path, "peakLux", "lx", required: true, min: 0);
        string channel = ctx.String(e, path, "channel") ?? LightScenario.DefaultChannel;
        var storms = new List<LightningStorm>();
        if (!e.TryGetProperty("storms", out JsonElement arr) || arr.ValueKind != JsonValueKind.Array)
        {
            ctx.Error(path, "missing \"storms\" array", "\"storms\": [{ \"from\": \"22:00\", \"minutes\": 20, \"flashesPerMinute\": 2 }]");
            return null;
        }
        int i = 0;
        bool ok = true;
        foreach (JsonElement s in arr.EnumerateArray())
        {
            string sp = $"{path}.storms[{i++}]";
            if (!ctx.ExpectObject(s, sp)) { ok = false; continue; }
            ctx.CheckProperties(s, sp, "from", "minutes", "flashesPerMinute");
            TimeSpan? from = ctx.Clock(s, sp, "from", required: true);
            double? minutes = ctx.Number(s, sp, "minutes", null, required: true, min: ScenarioLoader.MinEventMinutes, max: 24 * 60);
            double? rate = ctx.Number(s, sp, "flashesPerMinute", null, required: true, min: 0);
            if (from is null || minutes is null || rate is null) { ok = false; continue; }
            if (rate.Value * minutes.Value > InputLimits.MaxEventsPerNight)
            {
                ctx.Error($"{sp}.flashesPerMinute", string.Create(System.Globalization.CultureInfo.InvariantCulture,
                    $"{rate.Value:G4} flashes a minute for {minutes.Value:G4} minutes would be more than the limit of {InputLimits.MaxEventsPerNight} events per night"),
                    "a heavy storm has a few flashes a minute, e.g. \"flashesPerMinute\": 2");
                ok = false;
                continue;
            }
            storms.Add(new LightningStorm(from.Value, minutes.Value, rate.Value));
        }
        if (!ok || peak is null) return null;
        return new LightningDefinition(storms, peak.Value, channel);
    }

    public void Generate(ScenarioTimeline timeline, DeterministicRandom random, EventSink sink)
    {
        for (int night = 0; night < timeline.Nights; night++)
        {
            foreach (LightningStorm storm in Storms)
            {
                double a = timeline.ClockTime(night, storm.From);
                double b = a + storm.Minutes * 60.0;
                foreach (double t in random.PoissonTimes(a, b, storm.FlashesPerMinute / 60.0))
                {
                    int n = random.NextInt(3, 5);
                    var strokes = new List<LightningStroke>(n);
                    double s = t;
                    for (int k = 0; k < n; k++)
                    {
                        strokes.Add(new LightningStroke(s, PeakLux * random.Uniform(0.3, 1.0)));
                        s += random.Uniform(0.040, 0.080);
                    }
                    sink.LightEvents.Add(new LightningFlash(strokes, Channel!));
                }
            }
        }
    }
}
