using NightSim.Devices;
using NightSim.Mna;
using NightSim.Netlist;
using NightSim.Results;
using NightSim.Transient;

namespace NightSim.Tests.Transient;

/// <summary>Every trace row is a state the solver computed at that row's time.</summary>
public sealed class TraceRowTests
{
    [Fact]
    public void Rows_Lie_On_The_Accepted_Points_And_Keep_Every_Corner()
    {
        // Two hours with two 1 V triangles right after the hour (peaks at 3600.1 s and 3600.4 s, back to 0 V at
        // 3600.2 s and 3600.5 s) into an RC of τ = 100 s: a night-length run decimated to rows every ~0.36 s.
        var points = new List<(double, double)> { (0, 0), (3600, 0), (3600.1, 1), (3600.2, 0), (3600.3, 0), (3600.4, 1), (3600.5, 0) };
        Circuit circuit = Circuit.FromDevices("rows",
        [
            new VoltageSource("V1", "V1", "in", "gnd", Waveform.PiecewiseLinear(points)),
            new Resistor("R1", "R1", "in", "out", 100e3),
            new Capacitor("C1", "C1", "out", "gnd", 1e-3),
        ]);
        var solver = new TransientSolver(circuit, TransientOptions.Default);
        var accepted = new Dictionary<double, (double In, double Out)>();
        int iIn = circuit.IndexOf("in"), iOut = circuit.IndexOf("out");
        accepted[0.0] = (0, 0);
        solver.Accepted = s => accepted[s.Time] = (s.Solution[iIn], s.Solution[iOut]);
        SimulationResult r = solver.Run(7200);
        Assert.True(r.Succeeded, r.Failure?.ToString());
        Trace vin = r.Trace("in")!, vout = r.Trace("out")!;
        Assert.Equal(vin.Times, vout.Times);
        Assert.True(vin.Times.Count < accepted.Count, "the run is decimated");
        for (int k = 0; k < vin.Times.Count; k++)
        {
            // No row off the solution: each row is an accepted point, exactly.
            Assert.True(accepted.TryGetValue(vin.Times[k], out var x), $"row at {vin.Times[k]} s is not an accepted point");
            Assert.Equal(x.In, vin.Values[k]);
            Assert.Equal(x.Out, vout.Values[k]);
            // The source is 0 V after 3600.5 s and between the triangles: every such row shows 0.
            double t = vin.Times[k];
            if (t >= 3600.5 || (t >= 3600.2 && t <= 3600.3) || t <= 3600) Assert.Equal(0.0, vin.Values[k], 12);
        }
        // Both peaks are rows (landed corners are kept).
        foreach (double peak in new[] { 3600.1, 3600.4 })
        {
            int k = vin.Times.ToList().FindIndex(t => Math.Abs(t - peak) < 1e-9);
            Assert.True(k >= 0, $"no row at the {peak} s peak");
            Assert.Equal(1.0, vin.Values[k], 9);
        }
        Assert.Equal(7200, vin.Times[^1], 9);
    }
}
