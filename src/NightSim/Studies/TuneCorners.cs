using NightSim.Netlist;
using NightSim.Sky;

namespace NightSim.Studies;

/// <summary>One set of part values as bought: every tolerance variation at the end that pushes a quantity one way.</summary>
/// <param name="Label">"nominal" or e.g. "on-time low".</param>
/// <param name="Ends">"PART.parameter" → −1 (low end) or +1 (high end); parts not listed stay nominal.</param>
public sealed record TuneCorner(string Label, IReadOnlyList<KeyValuePair<string, int>> Ends)
{
    public static TuneCorner Nominal { get; } = new("nominal", []);

    /// <summary>The values of this corner for a netlist's own tolerance bands.</summary>
    public List<KeyValuePair<string, double>> Values(IReadOnlyList<Variation> variations)
    {
        var list = new List<KeyValuePair<string, double>>();
        foreach ((string key, int end) in Ends)
        {
            if (variations.FirstOrDefault(v => v.Key == key) is Variation v) list.Add(new(key, end < 0 ? v.Low : v.High));
        }
        return list;
    }
}

/// <summary>
/// The worst-case corners of a design: for each closed-form quantity, the sign of its change across each tolerance
/// band is found from the closed form (one band at a time, the rest nominal); the "low" corner puts every band at the
/// end that lowers the quantity, the "high" corner at the end that raises it. Bands that leave it unchanged stay
/// nominal. Signs are taken on the design as given and reused for every candidate (the relations are monotonic).
/// </summary>
public static class TuneCorners
{
    public static IReadOnlyList<TuneCorner> For(NetlistDefinition net, LightScenario scenario, IReadOnlyList<string> quantities)
    {
        var corners = new List<TuneCorner> { TuneCorner.Nominal };
        IReadOnlyList<Variation> variations = ToleranceModel.For(net);
        foreach (string q in quantities)
        {
            double? nominal = TunePhysics.Evaluate(net, scenario, q);
            if (nominal is not double q0) continue;
            var low = new List<KeyValuePair<string, int>>();
            foreach (Variation v in variations)
            {
                double? a = TunePhysics.Evaluate(ToleranceModel.Apply(net, [new(v.Key, v.Low)]), scenario, q);
                double? b = TunePhysics.Evaluate(ToleranceModel.Apply(net, [new(v.Key, v.High)]), scenario, q);
                if (a is not double lo || b is not double hi) continue;
                if (Math.Abs(hi - lo) <= 1e-6 * Math.Max(Math.Abs(q0), 1e-12)) continue;
                low.Add(new(v.Key, hi > lo ? -1 : +1));
            }
            if (low.Count == 0) continue;
            var high = low.Select(e => new KeyValuePair<string, int>(e.Key, -e.Value)).ToList();
            foreach (TuneCorner c in (TuneCorner[])[new(q + " low", low), new(q + " high", high)])
            {
                if (!corners.Any(x => Same(x, c))) corners.Add(c);
            }
        }
        return corners;
    }

    private static bool Same(TuneCorner a, TuneCorner b) =>
        a.Ends.Count == b.Ends.Count && a.Ends.OrderBy(e => e.Key, StringComparer.Ordinal).SequenceEqual(b.Ends.OrderBy(e => e.Key, StringComparer.Ordinal));
}
