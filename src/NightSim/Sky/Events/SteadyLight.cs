using System.Globalization;
using System.Text.Json;

namespace NightSim.Sky.Events;

/// <summary>
/// A porch or street light: constant lux at the sensor between switch-on and switch-off. Typical: 800 lm isotropic
/// gives 2.5 lx at 5 m (E = Φ/(4πd²)); a residential street ≈ 4.3 lx (0.4 fc, the order of the residential values
/// of ANSI/IES RP-8, Roadway Lighting, read in a secondary table).
/// </summary>
public sealed class SteadyLight : ILightEvent
{
    public SteadyLight(double on, double off, double lux, string channel)
    {
        if (!(off > on)) throw new ArgumentException("off must be after on");
        Start = on; End = off; PeakLux = lux; Channel = channel;
    }

    public string Kind => "steady-light";
    public string Channel { get; }
    public double Start { get; }
    public double End { get; }
    public double PeakLux { get; }
    public LightEffect Effect => LightEffect.AddLux;
    public string Description => string.Create(CultureInfo.InvariantCulture, $"steady light {PeakLux:G4} lx");
    public double Value(double time) => time >= Start && time < End ? PeakLux : 0.0;
    public void AddBreakpoints(List<double> into) { into.Add(Start); into.Add(End); }
}

/// <summary>JSON kind "steady-light": "on" and "off" clock times each night, "lux" at the sensor.</summary>
public sealed class SteadyLightDefinition : IEventDefinition
{
    private SteadyLightDefinition(TimeSpan on, TimeSpan off, double lux, string channel) { On = on; Off = off; Lux = lux; Channel = channel; }

    public string Kind => "steady-light";
    public string? Channel { get; }
    public TimeSpan On { get; }
    public TimeSpan Off { get; }
    public double Lux { get; }

    public static IEventDefinition? Parse(JsonElement e, string path, ScenarioParseContext ctx)
    {
        ctx.CheckProperties(e, path, "kind", "on", "off", "lux", "channel");
        TimeSpan? on = ctx.Clock(e, path, "on", required: true);
        TimeSpan? off = ctx.Clock(e, path, "off", required: true);
        double? lux = ctx.Number(e, path, "lux", "lx", required: true, min: 0);
        string channel = ctx.String(e, path, "channel") ?? LightScenario.DefaultChannel;
        if (on is null || off is null || lux is null) return null;
        if (EventTiming.NightOrder(off.Value) <= EventTiming.NightOrder(on.Value))
        {
            ctx.Error($"{path}.off", "\"off\" must come after \"on\" within the night (noon to noon)", "e.g. on \"19:00\", off \"06:30\"");
            return null;
        }
        return new SteadyLightDefinition(on.Value, off.Value, lux.Value, channel);
    }

    public bool DrawnFromSeed => false;

    public void Generate(ScenarioTimeline timeline, DeterministicRandom random, EventSink sink)
    {
        for (int night = 0; night < timeline.Nights; night++)
        {
            var (a, b) = timeline.ClockSpan(night, On, Off);
            if (b > a) sink.LightEvents.Add(new SteadyLight(a, b, Lux, Channel!));
        }
    }
}
