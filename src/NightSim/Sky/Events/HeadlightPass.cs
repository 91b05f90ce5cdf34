using System.Globalization;
using System.Text.Json;

namespace NightSim.Sky.Events;

/// <summary>
/// A passing car's headlights at the sensor: a trapezoid in time (linear rise, hold at peak, linear fall). Typical
/// values (common practice): a low beam gives ≈ 0.1–10 lx at a sensor 2–3 m up (E = I/d² with the 125–1 000 cd a low
/// beam may send above the horizon under SAE J1383 / FMVSS No. 108); a pass lasts t = y/(v·tan θ) ≈ 1–3.3 s (30 km/h,
/// 10 m, 20° → 3.3 s); a car turning in sweeps in 0.5–2 s and may stay lit 30–90 s.
/// </summary>
public sealed class HeadlightPass : ILightEvent
{
    /// <param name="start">Run time the light begins to rise, seconds.</param>
    /// <param name="duration">Total length, seconds.</param>
    /// <param name="rise">Rise time, seconds.</param>
    /// <param name="fall">Fall time, seconds.</param>
    /// <param name="peakLux">Lux at the sensor at full light.</param>
    /// <param name="channel">Channel name.</param>
    public HeadlightPass(double start, double duration, double rise, double fall, double peakLux, string channel)
    {
        if (!(duration > 0) || rise < 0 || fall < 0 || rise + fall > duration)
            throw new ArgumentException("need duration > 0 and rise + fall ≤ duration");
        Start = start;
        End = start + duration;
        RiseSeconds = rise;
        FallSeconds = fall;
        PeakLux = peakLux;
        Channel = channel;
    }

    public string Kind => "headlights";
    public string Channel { get; }
    public double Start { get; }
    public double End { get; }
    public double PeakLux { get; }
    public double RiseSeconds { get; }
    public double FallSeconds { get; }
    public LightEffect Effect => LightEffect.AddLux;
    public string Description => string.Create(CultureInfo.InvariantCulture,
        $"headlight pass {PeakLux:G4} lx for {End - Start:G4} s (rise {RiseSeconds:G3} s, fall {FallSeconds:G3} s)");

    public double Value(double time)
    {
        if (time <= Start || time >= End) return 0.0;
        double up = Start + RiseSeconds, down = End - FallSeconds;
        if (time < up) return PeakLux * (time - Start) / RiseSeconds;
        if (time > down) return PeakLux * (End - time) / FallSeconds;
        return PeakLux;
    }

    public void AddBreakpoints(List<double> into)
    {
        into.Add(Start);
        into.Add(Start + RiseSeconds);
        into.Add(End - FallSeconds);
        into.Add(End);
    }
}

/// <summary>JSON kind "headlights": explicit clock times or a seeded rate per hour.</summary>
public sealed class HeadlightDefinition : IEventDefinition
{
    private HeadlightDefinition(EventTiming timing, double peakLux, double seconds, double rise, double fall, string channel)
    {
        Timing = timing; PeakLux = peakLux; Seconds = seconds; RiseSeconds = rise; FallSeconds = fall; Channel = channel;
    }

    public string Kind => "headlights";
    public string? Channel { get; }
    public EventTiming Timing { get; }
    public double PeakLux { get; }
    public double Seconds { get; }
    public double RiseSeconds { get; }
    public double FallSeconds { get; }

    /// <summary>Parses one "headlights" entry.</summary>
    public static IEventDefinition? Parse(JsonElement e, string path, ScenarioParseContext ctx)
    {
        ctx.CheckProperties(e, path, "kind", "times", "perHour", "from", "to", "peakLux", "seconds", "riseSeconds", "fallSeconds", "channel");
        var timing = EventTiming.Parse(e, path, ctx);
        double? peak = ctx.Number(e, path, "peakLux", "lx", required: true, min: 0);
        double seconds = ctx.Number(e, path, "seconds", "s", min: 0, minExclusive: true, max: ScenarioLoader.MaxPulseSeconds) ?? 4.0;
        double rise = ctx.Number(e, path, "riseSeconds", "s", min: 0, max: ScenarioLoader.MaxPulseSeconds) ?? Math.Min(0.5, seconds / 4);
        double fall = ctx.Number(e, path, "fallSeconds", "s", min: 0, max: ScenarioLoader.MaxPulseSeconds) ?? rise;
        string channel = ctx.String(e, path, "channel") ?? LightScenario.DefaultChannel;
        if (rise + fall > seconds)
        {
            ctx.Error($"{path}.seconds", "riseSeconds + fallSeconds is longer than the pass", "make \"seconds\" at least the sum of rise and fall");
            return null;
        }
        if (timing is null || peak is null) return null;
        return new HeadlightDefinition(timing, peak.Value, seconds, rise, fall, channel);
    }

    public bool DrawnFromSeed => Timing.Times is null;

    public void Generate(ScenarioTimeline timeline, DeterministicRandom random, EventSink sink)
    {
        foreach (double t in Timing.Draw(timeline, random))
            sink.LightEvents.Add(new HeadlightPass(t, Seconds, RiseSeconds, FallSeconds, PeakLux, Channel!));
    }
}
