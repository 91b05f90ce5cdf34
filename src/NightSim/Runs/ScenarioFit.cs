using NightSim.Devices;
using NightSim.Devices.Roles;
using NightSim.Netlist;
using NightSim.Sky;
using NightSim.Sky.Events;

namespace NightSim.Runs;

/// <summary>
/// Do a netlist and a scenario fit together? Noise must be injected at a node the netlist has; a lamp coupling must
/// name a relay of the netlist and a light channel of the scenario; the netlist's light sensors must read channels
/// the scenario defines. Each problem is one line naming the file, the part and a hint.
/// </summary>
public static class ScenarioFit
{
    public static IReadOnlyList<string> Problems(NetlistDefinition net, LightScenario scenario, string netlistPath, string scenarioPath)
    {
        var problems = new List<string>();
        JsonLocator? locator = null;
        try
        {
            if (File.Exists(scenarioPath)) locator = new JsonLocator(Text.Utf8Check.ReadAllBounded(scenarioPath, InputLimits.MaxInputBytes));
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            locator = null; // positions are a courtesy; the problems are reported without them
        }
        string At(string jsonPath)
        {
            (int line, int column) = locator?.Find(jsonPath) ?? (0, 0);
            return line > 0 ? $"{scenarioPath}:{line}:{column}" : scenarioPath;
        }
        List<string> nodes = NightRun.NetlistNodes(net);
        var channels = scenario.Channels.Select(c => c.Name).ToList();
        List<Device> devices = NightRun.CreateDevices(net);
        var relays = devices.Where(d => d.Role is RelayCoilRole).Select(d => d.PartId).Distinct().ToList();
        for (int i = 0; i < scenario.Events.Count; i++)
        {
            string path = $"$.events[{i}]";
            switch (scenario.Events[i])
            {
                case NoiseDefinition noise when !nodes.Contains(noise.Node):
                    problems.Add($"{At(path + ".node")}: error at {path}.node: noise at node '{noise.Node}', which netlist {netlistPath} does not have. hint: nodes are {string.Join(", ", nodes.Take(16))}");
                    break;
                case LampCoupling c:
                    if (!relays.Contains(c.Part))
                        problems.Add($"{At(path + ".part")}: error at {path}.part: lamp-coupling names part '{c.Part}', which is not a relay in {netlistPath}. hint: relays: {(relays.Count > 0 ? string.Join(", ", relays) : "none")}");
                    if (!channels.Contains(c.Channel))
                        problems.Add($"{At(path + ".channel")}: error at {path}.channel: light channel '{c.Channel}' is not defined. hint: channels: {string.Join(", ", channels)}");
                    break;
            }
        }
        // Every light sensor, whatever its kind, states the channel it reads.
        foreach (LightSensorRole sensor in devices.Select(d => d.Role).OfType<LightSensorRole>())
        {
            if (!channels.Contains(sensor.Channel))
            {
                string where = net.Part(sensor.PartId)?.Location is { Line: > 0 } loc
                    ? $"{netlistPath}:{loc.Line}:{loc.Column}: error at {loc.JsonPath}"
                    : $"{netlistPath}: error at part {sensor.PartId}";
                problems.Add($"{where} (part {sensor.PartId}): reads light channel '{sensor.Channel}', which scenario {scenarioPath} does not define. hint: channels: {string.Join(", ", channels)}");
            }
        }
        return problems;
    }
}
