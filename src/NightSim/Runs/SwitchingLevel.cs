using NightSim.Devices;
using NightSim.Devices.Roles;
using NightSim.Mna;
using NightSim.Netlist;
using NightSim.Transient;

namespace NightSim.Runs;

/// <summary>
/// The light at the sensor below which the circuit switches on, found from the circuit at rest: operating points at
/// constant light, bisected in log lux. A trigger pin wired to the sensor stage switches when it falls below its
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
        try
        {
            List<Device> probe = Create(net);
            if (probe.Select(d => d.Role).OfType<OneShotTimerRole>().FirstOrDefault() is not OneShotTimerRole timer) return null;
            if (!probe.Any(d => d.Role is LightSensorRole)) return null;
            // A capacitor from the trigger pin to another node that is not ground: the trigger is coupled from there.
            string? drive = null;
            foreach (Device d in probe)
            {
                if (d is not Capacitor || d.Nodes.Count != 2 || !d.Nodes.Contains(timer.Trigger)) continue;
                string other = d.Nodes[0] == timer.Trigger ? d.Nodes[1] : d.Nodes[0];
                if (!Ground.Is(other) && other != timer.Supply) drive = other;
            }
            string node = drive ?? timer.Trigger;
            double? Level(double lux)
            {
                Circuit c = Circuit.FromDevices(net.Name, Create(net));
                if (!TransientSolver.TrySolveOperatingPoint(c, options with { ConstantLux = lux }, out double[]? x) || x is null) return null;
                int i = c.IndexOf(node), s = c.IndexOf(timer.Supply);
                return i < 0 ? null : x[i] / (s >= 0 ? Math.Max(x[s], 1e-9) : 1.0);
            }
            if (Level(Darkest) is not double dark || Level(Brightest) is not double bright) return null;
            double limit = drive is null ? timer.TriggerFraction : 0.5 * (dark + bright);
            if (!(dark < limit && bright > limit)) return null;
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
