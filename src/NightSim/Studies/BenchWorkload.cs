using NightSim.Netlist;
using NightSim.Runs;
using NightSim.Sky;

namespace NightSim.Studies;

/// <summary>One fixed reference workload of <c>nightsim bench</c>: a demo netlist through a scenario built from the
/// demo's own scenario file, changed only in code (nights, extra events).</summary>
/// <param name="Name">Short name used in tables and JSON.</param>
/// <param name="Description">What it exercises, in plain words.</param>
/// <param name="Build">Builds the run request from the demo folder.</param>
/// <param name="SpreadRuns">For a study workload: the number of spread runs (each a night run with drawn part values),
/// run on every core; 0 for a single night run.</param>
public sealed record BenchWorkload(string Name, string Description, Func<string, NightRunRequest> Build, int SpreadRuns = 0)
{
    /// <summary>The reference set. <paramref name="quick"/> shortens the long workload (a month of nights instead of a
    /// year) so the whole set fits a CI run.</summary>
    public static IReadOnlyList<BenchWorkload> Reference(bool quick) =>
    [
        new("quiet-night", "garden-path demo: one clear November night, no events", dir => Demo(dir, "garden-path")),
        new("busy-night", $"driveway demo plus {BusyNightEvents.HeadlightCount} headlight passes, a {BusyNightEvents.FlashCount}-flash storm and a noise pulse per minute on the trigger node",
            dir => Busy(dir)),
        new("chatter-night", "self-lit demo: the lamp lights its own sensor and the relay chatters at dusk and dawn", dir => Demo(dir, "dusk-switch-self-lit")),
        new("dropper-night", "the garden-path timer on its own 230 V / 50 Hz capacitive dropper: one clear November night, the supply cycle-averaged with windows of full mains detail (compare quiet-night: the same stage on an ideal rail)",
            dir => Demo(dir, "garden-path-dropper-230")),
        new("dropper-night-120", "the same on a 120 V / 60 Hz dropper", dir => Demo(dir, "garden-path-dropper-120")),
        quick
            ? new("quiet-month", "garden-path demo through 30 nights", dir => Demo(dir, "garden-path", 30))
            : new("quiet-year", "garden-path demo through 365 nights", dir => Demo(dir, "garden-path", 365)),
        quick
            ? new("spread-20", "nightsim spread of the garden-path demo, 20 runs on every core", dir => Demo(dir, "garden-path"), 20)
            : new("spread-1000", "nightsim spread of the garden-path demo, 1000 runs on every core", dir => Demo(dir, "garden-path"), 1000),
    ];

    /// <summary>A demo netlist with the scenario beside it, optionally through another number of nights.</summary>
    public static NightRunRequest Demo(string demoDir, string name, int? nights = null)
    {
        string netlistPath = Path.Combine(demoDir, name + ".json");
        string scenarioPath = Path.Combine(demoDir, name + ".scenario.json");
        NetlistDefinition net = NetlistLoader.Load(netlistPath);
        LightScenario scenario = ScenarioLoader.LoadOrThrow(scenarioPath);
        if (nights is int n) scenario = scenario with { Nights = n };
        return new NightRunRequest { Netlist = net, NetlistPath = netlistPath, Scenario = scenario, ScenarioPath = scenarioPath, Tool = "nightsim bench" };
    }

    /// <summary>The driveway demo with the busy night's events added in code (<see cref="BusyNightEvents"/>).</summary>
    public static NightRunRequest Busy(string demoDir)
    {
        NightRunRequest request = Demo(demoDir, "garden-path-driveway");
        string trigger = NodeRoles.Of(request.Netlist).Trigger
            ?? throw new InvalidOperationException("the driveway demo has no timer trigger node");
        LightScenario scenario = request.Scenario!;
        scenario = scenario with { Events = [.. scenario.Events, new BusyNightEvents(trigger)] };
        return request with { Scenario = scenario };
    }
}
