using NightSim.Analysis;
using NightSim.Devices;
using NightSim.Netlist;

namespace NightSim.Runs;

/// <summary>
/// Reads the static facts of each 555-class one-shot from the netlist: the timing resistance from the timer's supply
/// to its threshold node, the timing capacitance from that node to ground, the capacitor's leakage and the timer's
/// threshold input current. Used for the closed-form on-time and the leakage-margin check.
/// </summary>
public static class TimerFactsExtractor
{
    /// <summary>Timer facts for every timer-555 part whose timing network is a plain R to supply and C to ground.</summary>
    /// <param name="netlist">The validated netlist.</param>
    /// <param name="supplyVoltage">Supply voltage at a node, volts, or null when unknown (e.g. from a DC source).</param>
    public static IReadOnlyList<TimerFacts> Extract(NetlistDefinition netlist, Func<string, double?> supplyVoltage)
    {
        var result = new List<TimerFacts>();
        foreach (PartDefinition timer in netlist.Parts.Where(p => p.Kind == "timer-555"))
        {
            if (!timer.Pins.TryGetValue("threshold", out string? th) || !timer.Pins.TryGetValue("vcc", out string? vcc)) continue;
            double conductance = 0, capacitance = 0, leakCurrent = 0, leakConductance = 0, limit = double.NaN;
            string? capacitorId = null;
            foreach (PartDefinition p in netlist.Parts)
            {
                if (!TwoNodes(p, out string a, out string b)) continue;
                bool toSupply = (a == th && b == vcc) || (a == vcc && b == th);
                bool toGround = (a == th && NetlistLoader.IsGround(b)) || (NetlistLoader.IsGround(a) && b == th);
                if (p.Kind == "resistor" && toSupply) conductance += 1.0 / p.Parameters.Number("value");
                if (p.Kind == "capacitor" && toGround)
                {
                    capacitance += p.Parameters.Number("value");
                    leakCurrent += Capacitor.EffectiveLeakageCurrent(p);
                    double lim = Capacitor.LeakageLimit(p);
                    if (!double.IsNaN(lim)) limit = double.IsNaN(limit) ? lim : limit + lim;
                    capacitorId ??= p.Id;
                    double rl = p.Parameters.Number("leakageResistance", double.PositiveInfinity);
                    if (!double.IsInfinity(rl)) leakConductance += 1.0 / rl;
                }
                if (p.Kind == "resistor" && toGround) leakConductance += 1.0 / p.Parameters.Number("value");
            }
            double? v = supplyVoltage(vcc);
            if (conductance <= 0 || capacitance <= 0 || v is null) continue;
            double inputCurrent = Devices.Composite.Timer555.EffectiveNumber(timer, "thresholdCurrent");
            result.Add(new TimerFacts(timer.Id, 1.0 / conductance, capacitance, v.Value, leakCurrent + inputCurrent,
                leakConductance > 0 ? 1.0 / leakConductance : double.PositiveInfinity, limit, capacitorId));
        }
        return result;
    }

    /// <summary>The DC value of a voltage source from <paramref name="node"/> to ground, or null.</summary>
    public static double? DcSupply(NetlistDefinition netlist, string node)
    {
        foreach (PartDefinition p in netlist.Parts.Where(p => p.Kind == "voltage-source"))
        {
            if (TwoNodes(p, out string a, out string b) && a == node && NetlistLoader.IsGround(b) && p.Parameters.OptionalNumber("constant") is double dc) return dc;
        }
        return null;
    }

    /// <summary>The two nodes of a two-terminal part in its kind's pin order.</summary>
    private static bool TwoNodes(PartDefinition p, out string a, out string b)
    {
        a = b = "";
        PartKind? kind = PartCatalog.Find(p.Kind);
        if (kind is null || kind.Pins.Count != 2) return false;
        return p.Pins.TryGetValue(kind.Pins[0], out a!) && p.Pins.TryGetValue(kind.Pins[1], out b!);
    }
}
