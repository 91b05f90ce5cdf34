using NightSim.Devices;
using NightSim.Devices.Roles;
using NightSim.Netlist;

namespace NightSim.Supply;

/// <summary>The DC rail a supply feeds: the node pair the rest of the circuit runs from, and how it was recognised.</summary>
/// <param name="Plus">Positive node.</param>
/// <param name="Minus">Return node (ground, or the bridge's DC minus when the mains neutral is ground).</param>
/// <param name="Reason">How it was recognised, in plain words ("the timer's supply pins").</param>
public sealed record SupplyRail(string Plus, string Minus, string Reason);

/// <summary>
/// The parts of a mains-fed supply, recognised from what the devices state about themselves (their roles), never
/// from kind or parameter names:
/// <list type="bullet">
/// <item>the source: the first sine voltage source (<see cref="SineSourceRole"/>);</item>
/// <item>the dropper: the capacitor (with whatever sits on the same two nodes) that is in series with the source —
/// taken out, nothing connects the source's two pins any more (parts straight across the source do not count);</item>
/// <item>the bleeder: resistors on the dropper's two nodes;</item>
/// <item>series resistors: resistors that are in series with the source in the same sense (a fuse or surge
/// resistor);</item>
/// <item>the rail: the one-shot timer's supply and ground pins; else the node pair of a Zener across the largest
/// capacitor that is not a dropper; else that capacitor's pins;</item>
/// <item>the rail's shunt regulator: a Zener with its cathode on the rail's plus and its anode on its minus.</item>
/// </list>
/// In the connection graph a relay joins only its coil's two nodes (its contacts switch, they are no fixed path) and
/// every other device without a two-terminal role joins all its nodes.
/// </summary>
public sealed record SupplySection
{
    public required SineSourceRole Source { get; init; }
    public IReadOnlyList<CapacitorRole> Droppers { get; init; } = [];
    public IReadOnlyList<ResistorRole> Bleeders { get; init; } = [];
    public IReadOnlyList<ResistorRole> SeriesResistors { get; init; } = [];
    public SupplyRail? Rail { get; init; }
    public IReadOnlyList<JunctionRole> Zeners { get; init; } = [];

    /// <summary>The Zener across the rail (cathode on plus), or null.</summary>
    public JunctionRole? RailZener { get; init; }

    /// <summary>The largest capacitor on the rail's two nodes (the smoothing capacitor), or null.</summary>
    public CapacitorRole? Reservoir { get; init; }

    public IReadOnlyList<ResistorRole> Resistors { get; init; } = [];
    public IReadOnlyList<CapacitorRole> Capacitors { get; init; } = [];
    public IReadOnlyList<RelayCoilRole> Relays { get; init; } = [];
    public OneShotTimerRole? Timer { get; init; }

    /// <summary>Total dropper capacitance (droppers on one node pair are in parallel), F; 0 without a dropper.</summary>
    public double DropperCapacitance => Droppers.Sum(d => d.Capacitance);

    /// <summary>The role a part plays in the supply, in plain words, for budgets and findings.</summary>
    public string PartTitle(string partId)
    {
        if (Droppers.Any(d => d.PartId == partId)) return "dropper capacitor";
        if (Bleeders.Any(b => b.PartId == partId)) return "bleeder";
        if (SeriesResistors.Any(r => r.PartId == partId)) return "series resistor";
        if (RailZener?.PartId == partId) return "rail Zener";
        if (Reservoir?.PartId == partId) return "smoothing capacitor";
        if (Zeners.Any(z => z.PartId == partId)) return "Zener diode";
        if (Capacitors.Any(c => c.PartId == partId)) return "capacitor";
        return "resistor";
    }

    /// <summary>The supply section of <paramref name="devices"/>, or null when none of them is a sine voltage source.</summary>
    public static SupplySection? Find(IEnumerable<Device> devices)
    {
        List<Device> all = devices.ToList();
        var roles = all.Select(d => d.Role).OfType<PartRole>().ToList();
        SineSourceRole? source = roles.OfType<SineSourceRole>().FirstOrDefault();
        if (source is null) return null;

        var resistors = roles.OfType<ResistorRole>().ToList();
        var capacitors = roles.OfType<CapacitorRole>().ToList();
        var junctions = roles.OfType<JunctionRole>().ToList();
        var relays = roles.OfType<RelayCoilRole>().ToList();
        OneShotTimerRole? timer = roles.OfType<OneShotTimerRole>().FirstOrDefault();

        // Edges of the connection graph: (owner, a, b) with owner the index of the device.
        var edges = new List<(int Owner, string A, string B)>();
        for (int i = 0; i < all.Count; i++)
        {
            Device d = all[i];
            switch (d.Role)
            {
                case ResistorRole r: edges.Add((i, N(r.A), N(r.B))); break;
                case CapacitorRole c: edges.Add((i, N(c.P), N(c.N))); break;
                case JunctionRole j: edges.Add((i, N(j.Anode), N(j.Cathode))); break;
                case SineSourceRole s: edges.Add((i, N(s.Plus), N(s.Minus))); break;
                case RelayCoilRole k: edges.Add((i, N(k.CoilA), N(k.CoilB))); break;
                default:
                    for (int k = 1; k < d.Nodes.Count; k++) edges.Add((i, N(d.Nodes[0]), N(d.Nodes[k])));
                    break;
            }
        }
        int sourceIndex = all.FindIndex(d => ReferenceEquals(d.Role, source));
        string plus = N(source.Plus), minus = N(source.Minus);

        // Parts grouped by the unordered node pair they sit on: a dropper with its bleeder is one branch.
        static (string, string) Pair(string a, string b) => string.CompareOrdinal(N(a), N(b)) <= 0 ? (N(a), N(b)) : (N(b), N(a));
        bool InSeries((string, string) pair)
        {
            if (pair == Pair(plus, minus) || pair.Item1 == pair.Item2) return false;
            // Parts straight across the source (a suppression capacitor, a mains load) are no path through the supply.
            return !Connected(edges, plus, minus, e => e.Owner == sourceIndex || Pair(e.A, e.B) == pair || Pair(e.A, e.B) == Pair(plus, minus));
        }
        var droppers = capacitors.Where(c => InSeries(Pair(c.P, c.N))).ToList();
        var dropperPairs = droppers.Select(c => Pair(c.P, c.N)).ToHashSet();
        var bleeders = resistors.Where(r => dropperPairs.Contains(Pair(r.A, r.B))).ToList();
        var series = resistors.Where(r => !dropperPairs.Contains(Pair(r.A, r.B)) && InSeries(Pair(r.A, r.B))).ToList();

        var others = capacitors.Where(c => !droppers.Contains(c) && Pair(c.P, c.N) != Pair(plus, minus)).ToList();
        CapacitorRole? largest = others.OrderByDescending(c => c.Capacitance).FirstOrDefault();
        SupplyRail? rail = null;
        if (timer is not null)
        {
            rail = new SupplyRail(timer.Supply, timer.Ground, $"the supply pins of timer {timer.PartId}");
        }
        else if (largest is not null)
        {
            JunctionRole? across = junctions.FirstOrDefault(j => j.IsZener && Pair(j.Anode, j.Cathode) == Pair(largest.P, largest.N));
            rail = across is not null
                ? new SupplyRail(across.Cathode, across.Anode, $"Zener {across.PartId} across capacitor {largest.PartId}")
                : new SupplyRail(largest.P, largest.N, $"the pins of capacitor {largest.PartId}, the largest one on the DC side");
        }
        JunctionRole? railZener = rail is null ? null
            : junctions.FirstOrDefault(j => j.IsZener && N(j.Cathode) == N(rail.Plus) && N(j.Anode) == N(rail.Minus));
        CapacitorRole? reservoir = rail is null ? null
            : others.Where(c => Pair(c.P, c.N) == Pair(rail.Plus, rail.Minus)).OrderByDescending(c => c.Capacitance).FirstOrDefault();

        return new SupplySection
        {
            Source = source,
            Droppers = droppers,
            Bleeders = bleeders,
            SeriesResistors = series,
            Rail = rail,
            Zeners = junctions.Where(j => j.IsZener).ToList(),
            RailZener = railZener,
            Reservoir = reservoir,
            Resistors = resistors,
            Capacitors = capacitors,
            Relays = relays,
            Timer = timer,
        };
    }

    private static string N(string node) => Ground.Normalize(node);

    /// <summary>True when <paramref name="from"/> reaches <paramref name="to"/> over the edges not <paramref name="skip"/>ped.</summary>
    private static bool Connected(List<(int Owner, string A, string B)> edges, string from, string to, Func<(int Owner, string A, string B), bool> skip)
    {
        var adjacent = new Dictionary<string, List<string>>(StringComparer.Ordinal);
        foreach (var e in edges)
        {
            if (skip(e) || e.A == e.B) continue;
            (adjacent.TryGetValue(e.A, out var la) ? la : adjacent[e.A] = []).Add(e.B);
            (adjacent.TryGetValue(e.B, out var lb) ? lb : adjacent[e.B] = []).Add(e.A);
        }
        var seen = new HashSet<string>(StringComparer.Ordinal) { from };
        var queue = new Queue<string>([from]);
        while (queue.Count > 0)
        {
            string n = queue.Dequeue();
            if (n == to) return true;
            if (!adjacent.TryGetValue(n, out var next)) continue;
            foreach (string m in next)
                if (seen.Add(m)) queue.Enqueue(m);
        }
        return false;
    }
}
