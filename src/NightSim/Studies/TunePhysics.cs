using NightSim.Analysis;
using NightSim.Devices;
using NightSim.Devices.Roles;
using NightSim.Mna;
using NightSim.Netlist;
using NightSim.Runs;
using NightSim.Sky;
using NightSim.Sky.Events;
using NightSim.Transient;

namespace NightSim.Studies;

/// <summary>
/// The closed forms a tune uses to narrow the search before any night is simulated, each computed from the parts
/// (no transient run):
/// <list type="bullet">
/// <item>on-time: the timing network reduced to R, C and its drains (<see cref="TimingNetwork"/>), then the 555
/// monostable relation t = R·C·ln(V∞/(V∞ − 2V/3)) with the drains (ln 3·R·C without them);</item>
/// <item>switching level: the light at which the circuit at rest switches (<see cref="SwitchingLevel"/>, operating
/// points bisected in lux), or where the sensor feeds a comparator, the light at which its inputs cross the edge of
/// its hysteresis band;</item>
/// <item>the trigger pin's RC against a pulse: a current pulse I of width w into the filter capacitor C behind the
/// series resistor R dips the pin by I·R·(1 − e^(−w/RC)) (first-order RC step response); the dusk edge, a supply-high
/// step through the coupling capacitor C₁ with its pull-up R₁ (τ₁ = R₁C₁), reaches the pin through the RS·CF
/// low-pass (τ₂), and dips it by the peak of (τ₁/(τ₁ − τ₂))(e^(−t/τ₁) − e^(−t/τ₂)), which is r^(r/(1−r)) with
/// r = τ₂/τ₁ (loading of the coupling node by the filter is left out).</item>
/// </list>
/// </summary>
public static class TunePhysics
{
    /// <summary>Quantity names, in a fixed order.</summary>
    public const string OnTime = "on-time", SwitchLux = "switch-on lux", NoiseLow = "trigger pin lowest in noise", DuskLow = "trigger pin lowest at dusk";

    /// <summary>Which quantities the targets need and the circuit allows, in a fixed order.</summary>
    public static IReadOnlyList<string> Quantities(DesignTargets targets, NetlistDefinition net, LightScenario scenario)
    {
        var list = new List<string>();
        if (targets.OnTimeMin is not null || targets.OnTimeMax is not null)
        {
            if (Evaluate(net, scenario, OnTime) is not null) list.Add(OnTime);
        }
        if (targets.SwitchOnLuxMin is not null || targets.SwitchOnLuxMax is not null)
        {
            if (Evaluate(net, scenario, SwitchLux) is not null) list.Add(SwitchLux);
        }
        // The trigger filter trades noise against the dusk edge: both bear on the targets only when the scenario
        // pulls pulses out of the trigger pin.
        if (targets.NoFalseTrigger && Evaluate(net, scenario, NoiseLow) is not null)
        {
            list.Add(NoiseLow);
            if (Evaluate(net, scenario, DuskLow) is not null) list.Add(DuskLow);
        }
        return list;
    }

    /// <summary>The value of one quantity for <paramref name="net"/> (s, lx or V), or null when it has no closed form here.</summary>
    public static double? Evaluate(NetlistDefinition net, LightScenario scenario, string quantity)
    {
        try
        {
            List<Device> devices = NightRun.CreateDevices(net);
            return quantity switch
            {
                OnTime => TimerOf(devices) is TimerFacts f && double.IsFinite(f.ClosedFormWidth) ? f.ClosedFormWidth : null,
                SwitchLux => SwitchingLevel.Find(net, TransientOptions.Default) ?? ComparatorSwitchLevel(net, devices),
                NoiseLow => Trigger(devices) is TriggerNetwork t ? NoiseLowest(t, scenario) : null,
                DuskLow => Trigger(devices) is TriggerNetwork t ? DuskLowest(t) : null,
                _ => null,
            };
        }
        catch (ArgumentException)
        {
            return null;
        }
    }

    /// <summary>
    /// The margin of a predicted quantity against the targets, relative to the target's size as the night check
    /// scales it (positive inside, negative outside); null when no target bears on it.
    /// </summary>
    public static double? Margin(string quantity, double value, DesignTargets targets, NetlistDefinition net)
    {
        switch (quantity)
        {
            case OnTime:
            {
                double lo = targets.OnTimeMin ?? 0, hi = targets.OnTimeMax ?? double.PositiveInfinity;
                double scale = double.IsInfinity(hi) ? Math.Max(lo, 60) : Math.Max((hi - lo) / 2, 60);
                return Math.Min(value - lo, hi - value) / scale;
            }
            case SwitchLux:
            {
                double lo = targets.SwitchOnLuxMin ?? 0, hi = targets.SwitchOnLuxMax ?? double.PositiveInfinity;
                double scale = double.IsInfinity(hi) ? Math.Max(lo, 1e-3) : Math.Max((hi - lo) / 2, 1e-3);
                return Math.Min(value - lo, hi - value) / scale;
            }
            case NoiseLow:
            case DuskLow:
            {
                if (Trigger(NightRun.CreateDevices(net)) is not TriggerNetwork t) return null;
                double level = t.Supply * t.TriggerFraction;
                // Noise must leave the pin above its level; the dusk edge must take it below.
                return quantity == NoiseLow ? (value - level) / (t.Supply - level) : (level - value) / level;
            }
            default:
                return null;
        }
    }

    /// <summary>The timing network of the first one-shot, with supplies at their fixed voltages.</summary>
    public static TimerFacts? TimerOf(IReadOnlyList<Device> devices) =>
        TimingNetwork.Extract(devices, node => TimingNetwork.FixedVoltage(devices, node)).FirstOrDefault();

    /// <summary>The trigger pin's network: filter capacitor to ground, series resistor, coupling node with its pull-up
    /// and coupling capacitor.</summary>
    /// <param name="Supply">Timer supply, V.</param>
    /// <param name="TriggerFraction">Trigger level as a fraction of the supply.</param>
    /// <param name="Node">Trigger pin node.</param>
    /// <param name="Filter">Capacitance from the pin to ground, F (0 when none).</param>
    /// <param name="Series">Resistance from the pin to the coupling node, Ω.</param>
    /// <param name="PullUp">Pull-up at the coupling node, Ω, or null.</param>
    /// <param name="Coupling">Coupling capacitance into the coupling node, F, or null.</param>
    /// <param name="Drive">The node that drives the coupling capacitor (the sensor stage's output), or null.</param>
    public sealed record TriggerNetwork(double Supply, double TriggerFraction, string Node, double Filter, double Series, double? PullUp, double? Coupling, string? Drive = null);

    /// <summary>Finds the trigger network, or null when the pin is not fed through a resistor from a held node.</summary>
    public static TriggerNetwork? Trigger(IReadOnlyList<Device> devices)
    {
        if (devices.Select(d => d.Role).OfType<OneShotTimerRole>().FirstOrDefault() is not OneShotTimerRole timer) return null;
        if (TimingNetwork.FixedVoltage(devices, timer.Supply) is not double vs || vs <= 0) return null;
        string pin = timer.Trigger;
        double filter = devices.OfType<Capacitor>().Where(c => c.Nodes.Count >= 2 && Pair(c, pin) is string o && Ground.Is(o)).Sum(c => c.Capacitance);
        var series = devices.OfType<Resistor>().Where(r => Pair(r, pin) is string o && !Ground.Is(o) && o != timer.Supply).ToList();
        if (series.Count != 1) return null;
        string line = Pair(series[0], pin)!;
        double? pull = null, coupling = null;
        string? drive = null;
        foreach (Resistor r in devices.OfType<Resistor>())
        {
            if (r != series[0] && Pair(r, line) is string o && TimingNetwork.FixedVoltage(devices, o) is double v && v > 0) pull = r.Resistance;
        }
        foreach (Capacitor c in devices.OfType<Capacitor>())
        {
            if (c.Nodes.Count >= 2 && Pair(c, line) is string o && !Ground.Is(o) && o != timer.Supply && o != pin)
            {
                coupling = c.Capacitance;
                drive = o;
            }
        }
        return new TriggerNetwork(vs, timer.TriggerFraction, pin, filter, series[0].Resistance, pull, coupling, drive);
    }

    /// <summary>Lowest trigger-pin voltage during the scenario's current pulses at the pin, V; null without such pulses.
    /// The pin rests at the supply (pulled up); each pulse I of width w dips it by |I|·R·(1 − e^(−w/RC)).</summary>
    public static double? NoiseLowest(TriggerNetwork t, LightScenario scenario)
    {
        var pulses = scenario.Events.OfType<NoiseDefinition>().Where(n => n.Quantity == NoiseQuantity.Current && n.Node == t.Node && n.Amplitude < 0).ToList();
        if (pulses.Count == 0) return null;
        double worst = pulses.Max(p => PulseDip(-p.Amplitude, p.Width, t.Series, t.Filter));
        return t.Supply - worst;
    }

    /// <summary>Dip of an RC node under a current pulse, V: I·R·(1 − e^(−w/(R·C))); I·R without a capacitor.</summary>
    public static double PulseDip(double amps, double width, double ohms, double farads) =>
        farads <= 0 ? amps * ohms : amps * ohms * (1 - Math.Exp(-width / (ohms * farads)));

    /// <summary>Lowest trigger-pin voltage after the dusk edge, V (a supply-high fall coupled in); null without a
    /// coupling capacitor and pull-up.</summary>
    public static double? DuskLowest(TriggerNetwork t)
    {
        if (t.PullUp is not double r1 || t.Coupling is not double c1) return null;
        return t.Supply * (1 - CoupledPeak(r1 * c1, t.Series * t.Filter));
    }

    /// <summary>Peak of the RC low-pass (τ₂) response to a unit step that decays with τ₁: r^(r/(1−r)), r = τ₂/τ₁
    /// (1 without a filter, 1/e when equal).</summary>
    public static double CoupledPeak(double tau1, double tau2)
    {
        if (tau2 <= 0) return 1.0;
        double r = tau2 / tau1;
        if (Math.Abs(r - 1) < 1e-9) return Math.Exp(-1);
        return Math.Pow(r, r / (1 - r));
    }

    /// <summary>
    /// The switching level where the sensor feeds a comparator (whose output state an operating point does not
    /// change): operating points of the circuit at constant light, bisected in log lux for the light at which the
    /// comparator's input difference, going from bright to dark, reaches the far edge of its hysteresis band
    /// (offset ± hysteresis/2); lux, or null without such a comparator or when it does not cross between 1 mlx and 10 klx.
    /// </summary>
    public static double? ComparatorSwitchLevel(NetlistDefinition net, IReadOnlyList<Device> devices)
    {
        var sensorNodes = devices.Select(d => d.Role).OfType<LightSensorRole>().SelectMany(r => r.Nodes).Where(n => !Ground.Is(n)).ToHashSet();
        if (devices.OfType<Comparator>().FirstOrDefault(c => c.Nodes.Count >= 2 && (sensorNodes.Contains(c.Nodes[0]) || sensorNodes.Contains(c.Nodes[1])))
            is not Comparator comp) return null;
        string plus = comp.Nodes[0], minus = comp.Nodes[1];
        double? Difference(double lux)
        {
            Circuit c = Circuit.FromDevices(net.Name, NightRun.CreateDevices(net));
            if (!TransientSolver.TrySolveOperatingPoint(c, TransientOptions.Default with { ConstantLux = lux }, out double[]? x) || x is null) return null;
            double V(string n) => Ground.Is(n) ? 0 : c.IndexOf(n) is int i && i >= 0 ? x[i] : double.NaN;
            return V(plus) - V(minus) - comp.Settings.Offset;
        }
        const double darkest = 1e-3, brightest = 1e4;
        if (Difference(darkest) is not double dark || Difference(brightest) is not double bright) return null;
        double edge = (dark > bright ? 0.5 : -0.5) * comp.Settings.Hysteresis;
        if (!((dark - edge) * (bright - edge) < 0)) return null;
        double lo = Math.Log(darkest), hi = Math.Log(brightest);
        for (int k = 0; k < 40 && hi - lo > 1e-4; k++)
        {
            double mid = 0.5 * (lo + hi);
            if (Difference(Math.Exp(mid)) is not double v) return null;
            // Still on the dark side of the edge: the level is brighter.
            if ((v - edge) * (dark - edge) > 0) lo = mid; else hi = mid;
        }
        return Math.Exp(0.5 * (lo + hi));
    }

    private static string? Pair(Device d, string node)
    {
        if (d.Nodes.Count < 2) return null;
        if (d.Nodes[0] == node) return d.Nodes[1];
        if (d.Nodes[1] == node) return d.Nodes[0];
        return null;
    }
}
