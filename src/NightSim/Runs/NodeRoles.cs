using NightSim.Devices;
using NightSim.Netlist;

namespace NightSim.Runs;

/// <summary>Which netlist nodes play which part in a dusk timer, read from the parts: the light sensor's node, the
/// timer's trigger pin, its timing capacitor (threshold pin) and supply. Used to choose what the plots show.</summary>
public sealed record NodeRoles(IReadOnlyList<string> Sensor, string? Trigger, string? Timing, string? Supply)
{
    private static readonly string[] s_sensorKinds = ["photoresistor", "phototransistor", "photodiode"];

    public static NodeRoles Of(NetlistDefinition net)
    {
        PartDefinition? timer = net.Parts.FirstOrDefault(p => p.Kind == "timer-555");
        string? supply = timer?.Pins.GetValueOrDefault("vcc")
            ?? net.Parts.Where(p => p.Kind == "voltage-source").Select(p => Pin(p, 0)).FirstOrDefault(n => n is not null && !NetlistLoader.IsGround(n));
        var supplies = new HashSet<string>(net.Parts.Where(p => p.Kind == "voltage-source").Select(p => Pin(p, 0) ?? ""), StringComparer.Ordinal);
        if (supply is not null) supplies.Add(supply);
        var sensors = new List<string>();
        foreach (PartDefinition p in net.Parts.Where(p => s_sensorKinds.Contains(p.Kind)))
        {
            foreach (string node in p.Pins.Values)
            {
                if (!NetlistLoader.IsGround(node) && !supplies.Contains(node) && !sensors.Contains(node)) sensors.Add(node);
            }
        }
        return new NodeRoles(sensors, timer?.Pins.GetValueOrDefault("trigger"), timer?.Pins.GetValueOrDefault("threshold"), supply);
    }

    private static string? Pin(PartDefinition p, int index)
    {
        PartKind? kind = PartCatalog.Find(p.Kind);
        return kind is null || kind.Pins.Count <= index ? null : p.Pins.GetValueOrDefault(kind.Pins[index]);
    }
}
