using NightSim.Devices;
using NightSim.Devices.Roles;
using NightSim.Netlist;

namespace NightSim.Runs;

/// <summary>Which netlist nodes play which part in a dusk timer, read from the parts: the light sensor's node, the
/// timer's trigger pin, its timing capacitor (threshold pin) and supply, as the devices state their roles. Used to
/// choose what the plots show.</summary>
public sealed record NodeRoles(IReadOnlyList<string> Sensor, string? Trigger, string? Timing, string? Supply)
{
    public static NodeRoles Of(NetlistDefinition net)
    {
        List<Device> devices = NightRun.CreateDevices(net);
        var roles = devices.Select(d => d.Role).OfType<PartRole>().ToList();
        OneShotTimerRole? timer = roles.OfType<OneShotTimerRole>().FirstOrDefault();
        var supplies = new HashSet<string>(roles.OfType<FixedSupplyRole>().Select(s => s.Node), StringComparer.Ordinal);
        string? supply = timer?.Supply ?? roles.OfType<FixedSupplyRole>().Select(s => s.Node).FirstOrDefault();
        if (supply is not null) supplies.Add(supply);
        var sensors = new List<string>();
        foreach (LightSensorRole sensor in roles.OfType<LightSensorRole>())
        {
            foreach (string node in sensor.Nodes)
            {
                if (!Ground.Is(node) && !supplies.Contains(node) && !sensors.Contains(node)) sensors.Add(node);
            }
        }
        return new NodeRoles(sensors, timer?.Trigger, timer?.Threshold, supply);
    }
}
