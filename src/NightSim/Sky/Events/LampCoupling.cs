using System.Text.Json;

namespace NightSim.Sky.Events;

/// <summary>
/// The controller's own lamp lighting its sensor: <see cref="Lux"/> is added on <see cref="Channel"/> while the named
/// relay contact or load <see cref="Part"/> is on. Data only — the circuit run evaluates it from the circuit's state.
/// A level control cycles unless this lux is below (OFF/ON − 1)·E_on (common practice: the lamp's
/// own light must not lift the sensor from the ON level E_on to the OFF level (OFF/ON)·E_on).
/// </summary>
/// <param name="Part">Netlist part id of the relay or load ("K1", "LAMP").</param>
/// <param name="Contact">Contact name of the relay ("NO"), or null for the part's own on-state.</param>
/// <param name="Lux">Lux added at the sensor when on.</param>
/// <param name="Channel">Light channel name.</param>
public sealed record LampCoupling(string Part, string? Contact, double Lux, string Channel) : IEventDefinition
{
    public string Kind => "lamp-coupling";
    string? IEventDefinition.Channel => Channel;

    public static IEventDefinition? Parse(JsonElement e, string path, ScenarioParseContext ctx)
    {
        ctx.CheckProperties(e, path, "kind", "part", "contact", "lux", "channel");
        string? part = ctx.String(e, path, "part", required: true);
        string? contact = ctx.String(e, path, "contact");
        double? lux = ctx.Number(e, path, "lux", "lx", required: true, min: 0);
        string channel = ctx.String(e, path, "channel") ?? LightScenario.DefaultChannel;
        if (part is not null && string.IsNullOrWhiteSpace(part)) { ctx.Error($"{path}.part", "part id is empty", "the relay or lamp id from the netlist, e.g. \"K1\""); return null; }
        if (part is null || lux is null) return null;
        return new LampCoupling(part, contact, lux.Value, channel);
    }

    public void Generate(ScenarioTimeline timeline, DeterministicRandom random, EventSink sink) => sink.LampCouplings.Add(this);
}
