using System.Collections.Concurrent;
using NightSim.Netlist;
using NightSim.Supply;

namespace NightSim.Tests.Supply;

/// <summary>The supply budgets of the test netlists in data/supply/, each measured once per test run and shared.</summary>
internal static class SupplyBudgets
{
    private static readonly ConcurrentDictionary<string, Lazy<SupplyBudget>> s_budgets = new();

    /// <summary>Path of data/supply/<paramref name="name"/>.json beside the test binaries.</summary>
    public static string Netlist(string name) => Path.Combine(AppContext.BaseDirectory, "data", "supply", name + ".json");

    /// <summary>The budget of data/supply/<paramref name="name"/>.json at <paramref name="mains"/> (the netlist's when null).</summary>
    public static SupplyBudget Of(string name, MainsSetting? mains = null) =>
        s_budgets.GetOrAdd(name + (mains is null ? "" : $"@{mains.Rms}V{mains.Frequency}Hz"),
            _ => new Lazy<SupplyBudget>(() => SupplyRun.Measure(NetlistLoader.Load(Netlist(name)), mains))).Value;
}
