using NightSim.Analysis;
using NightSim.Devices;
using NightSim.Devices.Roles;
using NightSim.Netlist;

namespace NightSim.Runs;

/// <summary>
/// The charging network a one-shot's timing node sees, from the devices' own DC statements (<see cref="IDcElement"/>):
/// the linear network around the timing node (any series, parallel or trimmer resistors, capacitor leakage, the
/// timer's input current and discharge leakage) is reduced by nodal analysis, with the discharge off, to a Thevenin
/// source and resistance — once with the drains, once without. Nodes where something other than a linear element
/// connects (the supply, ground, a transistor) are held at their known voltages.
/// </summary>
public static class TimingNetwork
{
    /// <summary>Timer facts for every one-shot timer whose timing network reduces to a linear one.</summary>
    /// <param name="devices">The run's devices.</param>
    /// <param name="nodeVoltage">Voltage of a node against ground, V, or null when unknown (ground is 0).</param>
    public static IReadOnlyList<TimerFacts> Extract(IReadOnlyList<Device> devices, Func<string, double?> nodeVoltage)
    {
        var result = new List<TimerFacts>();
        foreach (Device d in devices)
        {
            if (d.Role is OneShotTimerRole timer && Reduce(devices, timer, nodeVoltage) is TimerFacts f) result.Add(f);
        }
        return result;
    }

    /// <summary>The DC voltage a fixed supply holds <paramref name="node"/> at, or null.</summary>
    public static double? FixedVoltage(IReadOnlyList<Device> devices, string node)
    {
        if (Ground.Is(node)) return 0.0;
        foreach (Device d in devices)
        {
            if (d.Role is FixedSupplyRole s && s.Node == node) return s.Volts;
        }
        return null;
    }

    private static TimerFacts? Reduce(IReadOnlyList<Device> devices, OneShotTimerRole timer, Func<string, double?> nodeVoltage)
    {
        if (nodeVoltage(timer.Supply) is not double vs || vs <= 0) return null;
        var collector = new Collector();
        var touching = new Dictionary<string, List<Device>>(StringComparer.Ordinal);
        foreach (Device d in devices)
        {
            foreach (string n in d.Nodes)
            {
                if (!touching.TryGetValue(n, out List<Device>? list)) touching[n] = list = [];
                list.Add(d);
            }
        }
        bool Boundary(string n) =>
            Ground.Is(n) || n == timer.Supply ||
            touching.GetValueOrDefault(n, []).Any(d => d is not IDcElement && d.PartId != timer.PartId);

        if (Boundary(timer.Threshold)) return null;
        // Interior nodes: reachable from the timing node through linear elements without crossing a boundary node.
        var interior = new List<string> { timer.Threshold };
        var index = new Dictionary<string, int>(StringComparer.Ordinal) { [timer.Threshold] = 0 };
        var elements = new HashSet<Device>();
        for (int k = 0; k < interior.Count; k++)
        {
            foreach (Device d in touching.GetValueOrDefault(interior[k], []))
            {
                if (d is not IDcElement || !elements.Add(d)) continue;
                foreach (string n in d.Nodes)
                {
                    if (index.ContainsKey(n) || Boundary(n)) continue;
                    index[n] = interior.Count;
                    interior.Add(n);
                }
            }
        }
        foreach (Device d in elements) ((IDcElement)d).StampDc(collector);

        double capacitance = 0;
        foreach ((string a, string b, double c) in collector.Capacitors)
        {
            if (a == timer.Threshold ^ b == timer.Threshold) capacitance += c;
        }
        if (capacitance <= 0) return null;

        (double V, double R)? with = Thevenin(collector, index, nodeVoltage, includeDrains: true);
        (double V, double R)? without = Thevenin(collector, index, nodeVoltage, includeDrains: false);
        if (with is not (double vTh, double rTh) || without is not (double v0, double r0)) return null;

        // The drains as a resistance across the capacitor and a constant current: same Thevenin equivalent.
        double gLeak = 1.0 / rTh - 1.0 / r0;
        double leakage = gLeak > 1e-18 * (1.0 / r0) ? 1.0 / gLeak : double.PositiveInfinity;
        double drain = v0 / r0 - vTh / rTh;
        // The timing electrolytics' catalogue leakage limits (parts as bought), for the worst-case check.
        var timingCaps = elements.OfType<Capacitor>().Where(c => c.Nodes.Contains(timer.Threshold)).ToList();
        var limits = timingCaps.Select(c => c.CatalogueLeakageLimit).Where(l => !double.IsNaN(l)).ToList();
        return new TimerFacts(timer.PartId, r0, capacitance, vs, drain, leakage)
        {
            LeakageLimit = limits.Count > 0 ? limits.Sum() : double.NaN,
            CapacitorId = timingCaps.FirstOrDefault()?.PartId,
            OpenVoltage = v0,
            IsCmos = timer.Family == TimerFamily.Cmos,
        };
    }

    /// <summary>Thevenin equivalent at the timing node (index 0): open-circuit voltage and resistance, or null when a
    /// boundary voltage is unknown or no resistive path reaches the node.</summary>
    private static (double, double)? Thevenin(Collector net, Dictionary<string, int> index, Func<string, double?> nodeVoltage, bool includeDrains)
    {
        int n = index.Count;
        var g = new double[n, n];
        var rhs = new double[n];
        foreach ((string a, string b, double s, bool drain) in net.Conductances)
        {
            if (drain && !includeDrains) continue;
            int ia = index.GetValueOrDefault(a, -1), ib = index.GetValueOrDefault(b, -1);
            if (ia < 0 && ib < 0) continue;
            if (ia >= 0) g[ia, ia] += s;
            if (ib >= 0) g[ib, ib] += s;
            if (ia >= 0 && ib >= 0)
            {
                g[ia, ib] -= s;
                g[ib, ia] -= s;
            }
            else
            {
                string boundary = ia < 0 ? a : b;
                if (nodeVoltage(boundary) is not double vb) return null;
                rhs[ia >= 0 ? ia : ib] += s * vb;
            }
        }
        foreach ((string from, string to, double amps, bool drain) in net.Currents)
        {
            if (drain && !includeDrains) continue;
            if (index.TryGetValue(from, out int i)) rhs[i] -= amps;
            if (index.TryGetValue(to, out int j)) rhs[j] += amps;
        }
        double[]? v = Solve((double[,])g.Clone(), rhs);
        var unit = new double[n];
        unit[0] = 1.0;
        double[]? r = Solve(g, unit);
        if (v is null || r is null || !(r[0] > 0) || !double.IsFinite(r[0])) return null;
        return (v[0], r[0]);
    }

    /// <summary>Gaussian elimination with partial pivoting; null when singular.</summary>
    private static double[]? Solve(double[,] a, double[] b)
    {
        int n = b.Length;
        var x = (double[])b.Clone();
        double scale = 0;
        for (int i = 0; i < n; i++) scale = Math.Max(scale, Math.Abs(a[i, i]));
        for (int k = 0; k < n; k++)
        {
            int p = k;
            for (int i = k + 1; i < n; i++) if (Math.Abs(a[i, k]) > Math.Abs(a[p, k])) p = i;
            if (Math.Abs(a[p, k]) <= 1e-15 * scale || a[p, k] == 0) return null;
            if (p != k)
            {
                for (int j = 0; j < n; j++) (a[k, j], a[p, j]) = (a[p, j], a[k, j]);
                (x[k], x[p]) = (x[p], x[k]);
            }
            for (int i = k + 1; i < n; i++)
            {
                double f = a[i, k] / a[k, k];
                if (f == 0) continue;
                for (int j = k; j < n; j++) a[i, j] -= f * a[k, j];
                x[i] -= f * x[k];
            }
        }
        for (int i = n - 1; i >= 0; i--)
        {
            double s = x[i];
            for (int j = i + 1; j < n; j++) s -= a[i, j] * x[j];
            x[i] = s / a[i, i];
        }
        return x;
    }

    private sealed class Collector : DcNetwork
    {
        public List<(string, string, double, bool)> Conductances { get; } = [];
        public List<(string, string, double, bool)> Currents { get; } = [];
        public List<(string, string, double)> Capacitors { get; } = [];

        public override void Conductance(string a, string b, double siemens, bool drain = false) => Conductances.Add((a, b, siemens, drain));

        public override void Current(string from, string to, double amperes, bool drain = false) => Currents.Add((from, to, amperes, drain));

        public override void Capacitance(string a, string b, double farads) => Capacitors.Add((a, b, farads));
    }
}
