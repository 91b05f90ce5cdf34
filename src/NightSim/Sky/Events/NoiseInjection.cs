using System.Globalization;
using System.Text.Json;
using NightSim.Units;

namespace NightSim.Sky.Events;

/// <summary>Whether an injected pulse is a voltage or a current.</summary>
public enum NoiseQuantity
{
    /// <summary>A voltage pulse in series with the node (volts).</summary>
    Voltage,
    /// <summary>A current pulse into the node (amperes).</summary>
    Current,
}

/// <summary>
/// One electrical noise pulse injected at a netlist node: rectangular, <see cref="Width"/> seconds long from
/// <see cref="Time"/>. Data only — the circuit run applies it. Reference shapes: IEC 61000-4-4 bursts (5/50 ns),
/// IEC 61000-4-5 surges (1.2/50 µs).
/// </summary>
/// <param name="Node">Node name.</param>
/// <param name="Time">Run time of the pulse start, seconds.</param>
/// <param name="Instant">The same as a local time.</param>
/// <param name="Amplitude">Volts or amperes.</param>
/// <param name="Width">Seconds.</param>
/// <param name="Quantity">Voltage or current.</param>
public sealed record NoiseInjection(string Node, double Time, DateTimeOffset Instant, double Amplitude, double Width, NoiseQuantity Quantity)
{
    public string Description => string.Create(CultureInfo.InvariantCulture,
        $"{(Quantity == NoiseQuantity.Voltage ? "voltage" : "current")} pulse {EngineeringValue.Format(Amplitude, Quantity == NoiseQuantity.Voltage ? "V" : "A")} for {EngineeringValue.Format(Width, "s")} at node {Node}");
}

/// <summary>JSON kind "noise": pulses at a node at explicit times or at a seeded rate per hour.</summary>
public sealed class NoiseDefinition : IEventDefinition
{
    private NoiseDefinition(string node, EventTiming timing, double amplitude, double width, NoiseQuantity q)
    {
        Node = node; Timing = timing; Amplitude = amplitude; Width = width; Quantity = q;
    }

    public string Kind => "noise";
    public string? Channel => null;
    public string Node { get; }
    public EventTiming Timing { get; }
    public double Amplitude { get; }
    public double Width { get; }
    public NoiseQuantity Quantity { get; }

    public static IEventDefinition? Parse(JsonElement e, string path, ScenarioParseContext ctx)
    {
        ctx.CheckProperties(e, path, "kind", "node", "times", "perHour", "from", "to", "amplitude", "width", "as");
        string? node = ctx.String(e, path, "node", required: true);
        string? kind = ctx.String(e, path, "as") ?? "voltage";
        NoiseQuantity q = NoiseQuantity.Voltage;
        if (kind == "current") q = NoiseQuantity.Current;
        else if (kind != "voltage") { ctx.Error($"{path}.as", $"\"{kind}\" is not a pulse type", "write \"voltage\" or \"current\""); return null; }
        var timing = EventTiming.Parse(e, path, ctx);
        double? amp = ctx.Number(e, path, "amplitude", q == NoiseQuantity.Voltage ? "V" : "A", required: true);
        double? width = ctx.Number(e, path, "width", "s", required: true, min: 0, minExclusive: true, max: ScenarioLoader.MaxPulseSeconds);
        if (node is null || timing is null || amp is null || width is null) return null;
        return new NoiseDefinition(node, timing, amp.Value, width.Value, q);
    }

    public bool DrawnFromSeed => Timing.Times is null;

    public void Generate(ScenarioTimeline timeline, DeterministicRandom random, EventSink sink)
    {
        foreach (double t in Timing.Draw(timeline, random))
            sink.NoiseInjections.Add(new NoiseInjection(Node, t, timeline.Instant(t), Amplitude, Width, Quantity));
    }
}
