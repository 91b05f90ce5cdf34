using NightSim.Devices;
using NightSim.Devices.Composite;
using NightSim.Netlist;

namespace NightSim.Studies;

/// <summary>
/// The parts as bought: which parameters of a netlist vary between parts and by how much. Per-kind defaults come from
/// each kind's tolerance parameters (resistor 5 %, potentiometer track 20 %, capacitor by construction, photoresistor
/// r10 30 % and gamma 10 %, timer offsets and input currents, relay pull-in and drop-out), each overridable on the part.
/// </summary>
public static class ToleranceModel
{
    /// <summary>Default relative tolerance of a capacitor by construction (common practice: electrolytics ±20 %,
    /// film ±10 %, class-2 ceramics ±10 %; not stated ±20 %).</summary>
    public static double CapacitorTolerance(string construction) => construction switch
    {
        "film" => 0.10,
        "ceramic" => 0.10,
        _ => 0.20,
    };

    /// <summary>Every parameter with a non-zero band, in netlist part order.</summary>
    public static IReadOnlyList<Variation> For(NetlistDefinition net)
    {
        var list = new List<Variation>();
        foreach (PartDefinition p in net.Parts)
        {
            PartParameters q = p.Parameters;
            switch (p.Kind)
            {
                case "resistor":
                case "potentiometer":
                    Relative(list, p, "value", q.Number("value"), q.Number("tolerance", 0), q.Number("tolerance", 0), $"tolerance {q.Number("tolerance", 0) * 100:0.#} %", "Ω");
                    break;
                case "capacitor":
                {
                    string construction = q.Text("construction");
                    double below = q.OptionalNumber("tolerance") ?? CapacitorTolerance(construction);
                    double above = q.OptionalNumber("toleranceAbove") ?? below;
                    Relative(list, p, "value", q.Number("value"), below, above, $"tolerance −{below * 100:0.#}/+{above * 100:0.#} %", "F");
                    if (construction == "electrolytic" && !q.Has("leakageResistance"))
                    {
                        double nominal = Capacitor.EffectiveLeakageCurrent(p);
                        double limit = Capacitor.LeakageLimit(p);
                        double high = double.IsNaN(limit) ? 2 * nominal : Math.Max(limit, nominal);
                        if (nominal > 0 && high > nominal)
                            list.Add(new Variation(p.Id, "leakageCurrent", nominal, nominal / 2, high, true,
                                double.IsNaN(limit) ? "leakage ½× to 2× stated" : "leakage drawn ½× to 4× typical; worst case the IEC 60384-4 limit", "A")
                            { DrawHigh = Math.Min(high, 4 * nominal) });
                    }
                    break;
                }
                case "photoresistor":
                    Relative(list, p, "r10", q.Number("r10"), q.Number("r10Tolerance", 0), q.Number("r10Tolerance", 0), $"r10 ±{q.Number("r10Tolerance", 0) * 100:0.#} %", "Ω");
                    Relative(list, p, "gamma", q.Number("gamma"), q.Number("gammaTolerance", 0), q.Number("gammaTolerance", 0), $"gamma ±{q.Number("gammaTolerance", 0) * 100:0.#} %");
                    break;
                case "timer-555":
                {
                    double spread = q.Number("offsetTolerance", 0);
                    foreach (string name in (string[])["thresholdOffset", "triggerOffset"])
                    {
                        double v = q.Number(name, 0);
                        if (spread > 0) list.Add(new Variation(p.Id, name, v, v - spread, v + spread, false, $"offset ±{spread * 1000:0.#} mV", "V"));
                    }
                    double rel = q.Number("inputCurrentTolerance", 0);
                    foreach (string name in (string[])["thresholdCurrent", "triggerCurrent"])
                        Relative(list, p, name, Timer555.EffectiveNumber(p, name), rel, rel, $"input current ±{rel * 100:0.#} %", "A");
                    break;
                }
                case "relay":
                {
                    double rel = q.Number("thresholdTolerance", 0);
                    foreach (string name in (string[])["pullIn", "dropOut"])
                    {
                        if (q.OptionalNumber(name) is double v) Relative(list, p, name, v, rel, rel, $"±{rel * 100:0.#} %", "V");
                    }
                    break;
                }
            }
        }
        return list;
    }

    /// <summary>A copy of <paramref name="net"/> with the given "PART.parameter" values set.</summary>
    public static NetlistDefinition Apply(NetlistDefinition net, IReadOnlyList<KeyValuePair<string, double>> values)
    {
        if (values.Count == 0) return net;
        var byPart = new Dictionary<string, PartParameters>(StringComparer.Ordinal);
        foreach ((string key, double value) in values)
        {
            int dot = key.IndexOf('.', StringComparison.Ordinal);
            string id = key[..dot], name = key[(dot + 1)..];
            PartParameters current = byPart.TryGetValue(id, out PartParameters? c) ? c : net.Part(id)!.Parameters;
            byPart[id] = current.WithNumber(name, value);
        }
        var parts = net.Parts.Select(p => byPart.TryGetValue(p.Id, out PartParameters? q) ? p with { Parameters = q } : p).ToList();
        return net with { Parts = parts };
    }

    private static void Relative(List<Variation> list, PartDefinition p, string name, double nominal, double below, double above, string source, string unit = "")
    {
        if (below <= 0 && above <= 0) return;
        if (nominal == 0) return;
        double a = nominal * (1 - below), b = nominal * (1 + above);
        list.Add(new Variation(p.Id, name, nominal, Math.Min(a, b), Math.Max(a, b), false, source, unit));
    }
}
