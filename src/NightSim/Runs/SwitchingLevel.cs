using NightSim.Devices;
using NightSim.Devices.Roles;
using NightSim.Mna;
using NightSim.Netlist;
using NightSim.Transient;

namespace NightSim.Runs;

/// <summary>
/// The light at the sensor below which the circuit switches on, found from the circuit at rest: resting points
/// (operating points with comparator, latch and relay states settled) at constant light, bisected in log lux. A trigger pin wired to the sensor stage switches when it falls below its
/// level (a third of the supply); a trigger coupled through a capacitor sees the stage's output swing, which counts
/// as switched once it has fallen past half way between its bright and dark levels.
/// </summary>
public static class SwitchingLevel
{
    private const double Darkest = 1e-3, Brightest = 1e4;

    /// <summary>The switching level, lux, or null when the circuit has no timer or sensor or does not switch between
    /// <see cref="Darkest"/> and <see cref="Brightest"/>.</summary>
    public static double? Find(NetlistDefinition net, TransientOptions options)
    {
        // The level belongs to the circuit, not to the night: the nights of a year (one netlist object, one set of
        // options) solve it once. A netlist with other part values is another object and is solved afresh.
        if (s_found.TryGetValue(net, out Found? known) && known.Options == options) return known.Level;
        double? level = Search(net, options);
        s_found.AddOrUpdate(net, new Found(options, level));
        return level;
    }

    private sealed record Found(TransientOptions Options, double? Level);

    private static readonly System.Runtime.CompilerServices.ConditionalWeakTable<NetlistDefinition, Found> s_found = new();

    private static double? Search(NetlistDefinition net, TransientOptions options)
    {
        try
        {
            List<Device> probe = Create(net);
            if (probe.Select(d => d.Role).OfType<OneShotTimerRole>().FirstOrDefault() is not OneShotTimerRole timer) return null;
            if (!probe.Any(d => d.Role is LightSensorRole)) return null;
            double[]? Solve(double lux, out Circuit c)
            {
                c = Circuit.FromDevices(net.Name, Create(net));
                return TransientSolver.TrySolveRestingPoint(c, options with { ConstantLux = lux }, out double[]? x) ? x : null;
            }
            // Levels at rest as fractions of the timer's supply, dark and bright.
            if (Solve(Darkest, out Circuit circuit) is not double[] xDark || Solve(Brightest, out _) is not double[] xBright) return null;
            int supply = circuit.IndexOf(timer.Supply);
            double Fraction(double[] x, string n) => circuit.IndexOf(n) is int m and >= 0 ? x[m] / (supply >= 0 ? Math.Max(x[supply], 1e-9) : 1.0) : 0.0;

            // Wired straight to the sensor stage, the trigger pin itself crosses its level. Otherwise the trigger is
            // coupled through a capacitor: its driving side is the capacitor terminal that falls with darkness while
            // the other terminal stays put (held by the trigger's pull-up), and counts as switched once it has fallen
            // past half way between its bright and dark levels.
            string node = timer.Trigger;
            double limit = timer.TriggerFraction;
            if (!(Fraction(xDark, node) < limit && Fraction(xBright, node) > limit))
            {
                string? drive = null;
                double best = 0.2;
                foreach (Device d in probe)
                {
                    if (d is not Capacitor || d.Nodes.Count != 2) continue;
                    foreach ((string a, string b) in (ReadOnlySpan<(string, string)>)[(d.Nodes[0], d.Nodes[1]), (d.Nodes[1], d.Nodes[0])])
                    {
                        if (Ground.Is(a) || Ground.Is(b) || a == timer.Supply || b == timer.Supply) continue;
                        double fall = Fraction(xBright, a) - Fraction(xDark, a);
                        double still = Math.Abs(Fraction(xBright, b) - Fraction(xDark, b));
                        if (fall > best && still < 0.1) (drive, best) = (a, fall);
                    }
                }
                if (drive is null) return null;
                node = drive;
                limit = 0.5 * (Fraction(xDark, drive) + Fraction(xBright, drive));
            }
            double? Level(double lux) => Solve(lux, out Circuit c) is double[] x && c.IndexOf(node) >= 0
                ? x[c.IndexOf(node)] / (c.IndexOf(timer.Supply) is int j and >= 0 ? Math.Max(x[j], 1e-9) : 1.0)
                : null;
            double lo = Math.Log(Darkest), hi = Math.Log(Brightest);
            for (int k = 0; k < 30 && hi - lo > 1e-3; k++)
            {
                double mid = 0.5 * (lo + hi);
                if (Level(Math.Exp(mid)) is not double v) return null;
                if (v < limit) lo = mid; else hi = mid;
            }
            return Math.Exp(0.5 * (lo + hi));
        }
        catch (ArgumentException)
        {
            return null;
        }
    }

    private static List<Device> Create(NetlistDefinition net)
    {
        var list = new List<Device>();
        foreach (PartDefinition p in net.Parts)
        {
            if (PartCatalog.Find(p.Kind) is PartKind k) list.AddRange(k.Create(p));
        }
        return list;
    }
}
