using System.Collections.Concurrent;
using NightSim.Netlist;
using NightSim.Runs;
using NightSim.Sky;

namespace NightSim.Tests.Demos;

/// <summary>Runs each demo netlist with its companion scenario once per test run and shares the result.</summary>
internal static class DemoRuns
{
    private static readonly ConcurrentDictionary<string, Lazy<NightRunResult>> s_runs = new();

    public static string Netlist(string name) => Path.Combine(RepoPaths.Netlists, name + ".json");

    public static string Scenario(string name) => Path.Combine(RepoPaths.Netlists, name + ".scenario.json");

    public static NightRunResult Run(string name) => s_runs.GetOrAdd(name, n => new Lazy<NightRunResult>(() => Fresh(n))).Value;

    /// <summary>A new run, not shared (determinism tests).</summary>
    public static NightRunResult Fresh(string name) => NightRun.Run(new NightRunRequest
    {
        Netlist = NetlistLoader.Load(Netlist(name)),
        NetlistPath = name + ".json",
        Scenario = ScenarioLoader.LoadOrThrow(Scenario(name)),
        ScenarioPath = name + ".scenario.json",
    });
}
