using MathNet.Numerics.LinearAlgebra;
using NightSim.Devices;
using NightSim.Netlist;

namespace NightSim.Tests.Devices;

/// <summary>
/// Cross-checks the linear devices together: the example netlists are assembled from their stamps into
/// dense MNA matrices and solved with a plain backward-Euler loop (test-only; the engine's solver is separate).
/// </summary>
public sealed class LinearCircuitTests
{
    private static (StampHarness Harness, List<Device> Devices) Build(string netlist)
    {
        NetlistDefinition def = NetlistLoader.Load(Path.Combine(RepoPaths.Netlists, netlist));
        List<Device> devices = def.Parts.SelectMany(p => PartCatalog.Find(p.Kind)!.Create(p)).ToList();
        string[] nodes = def.Parts.SelectMany(p => p.Pins.Values).Where(n => n != "gnd").Distinct().ToArray();
        var harness = new StampHarness(nodes);
        foreach (Device d in devices) d.Setup(harness);
        foreach (Device d in devices) d.PowerUp();
        return (harness, devices);
    }

    private static LoadContext LoadAll(StampHarness h, List<Device> devices, double[] x, double time)
    {
        var ctx = new LoadContext(h.Unknowns, h.SlotCount) { Time = time };
        x.CopyTo(ctx.X, 0);
        foreach (Device d in devices) d.Load(ctx);
        return ctx;
    }

    private static Matrix<double> Dense(StampHarness h, double[] slots, double scale = 1.0)
    {
        Matrix<double> m = Matrix<double>.Build.Dense(h.Unknowns, h.Unknowns);
        for (int r = 0; r < h.Unknowns; r++)
        {
            for (int c = 0; c < h.Unknowns; c++) m[r, c] = scale * h.At(slots, r, c);
        }
        return m;
    }

    [Fact]
    public void Divider_Operating_Point_Matches_The_Divider_Rule()
    {
        // Voltage divider rule and parallel resistances (any circuit textbook): mid sees 10k ∥ 10k = 5k below 4k7,
        // v_mid = 12·5/(4.7 + 5) = 6.1856 V; the unloaded wiper at mid travel gives half of it.
        (StampHarness h, List<Device> devices) = Build("divider.json");
        var x = new double[h.Unknowns];
        LoadContext ctx = LoadAll(h, devices, x, 0);
        Vector<double> dx = Dense(h, ctx.G).Solve(Vector<double>.Build.DenseOfArray(ctx.J).Negate());
        int mid = h.Node("mid"), set = h.Node("set"), vcc = h.Node("vcc");
        Assert.Equal(12.0, dx[vcc], 9);
        Assert.Equal(12.0 * 5.0 / 9.7, dx[mid], 6);
        Assert.Equal(6.0 * 5.0 / 9.7, dx[set], 6);
        // Supply current 12 V / 9.7 kΩ flows out of + through the circuit, so the branch current (+ → − inside) is negative.
        Assert.Equal(-12.0 / 9.7e3, dx[h.Unknowns - 1], 9);
    }

    [Fact]
    public void Rc_Step_Reaches_63_Percent_After_One_Time_Constant()
    {
        // First-order step response v = V·(1 − e^(−t/RC)) (any circuit textbook): 10 kΩ · 100 µF = 1 s, so one second
        // after the step at 0.1 s the capacitor is at 12·(1 − e^−1) = 7.5854 V. Backward Euler with h = 1 ms is within 5 mV.
        (StampHarness h, List<Device> devices) = Build("rc-step.json");
        const double step = 1e-3;
        var x = new double[h.Unknowns];
        double[] qPrev = LoadAll(h, devices, x, 0).Q.ToArray();
        int output = h.Node("out");
        for (int k = 1; k <= 1100; k++)
        {
            double t = k * step;
            // One Newton step is exact for a linear circuit: (C/h + G)·dx = −F, F = (Q − Q_prev)/h + J.
            LoadContext ctx = LoadAll(h, devices, x, t);
            Matrix<double> jacobian = Dense(h, ctx.C, 1.0 / step) + Dense(h, ctx.G);
            var f = new double[h.Unknowns];
            for (int i = 0; i < f.Length; i++) f[i] = (ctx.Q[i] - qPrev[i]) / step + ctx.J[i];
            Vector<double> dx = jacobian.Solve(Vector<double>.Build.DenseOfArray(f).Negate());
            for (int i = 0; i < x.Length; i++) x[i] += dx[i];
            qPrev = LoadAll(h, devices, x, t).Q.ToArray();
        }
        Assert.Equal(12.0 * (1 - Math.Exp(-1.0)), x[output], 0.005);
    }
}
