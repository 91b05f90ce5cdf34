using NightSim.Devices;
using NightSim.Mna;
using NightSim.Netlist;
using NightSim.Tests.Fixtures;
using NightSim.Transient;

namespace NightSim.Tests.Transient;

/// <summary>
/// Kirchhoff's current law at every accepted step of random nonlinear circuits: reloading every device at the accepted
/// solution, the currents leaving each node plus the rate of charge the integration formula produced must sum to
/// zero within the Newton tolerance (the residual a Newton correction at tolerance would leave, Σ_j |G_ij|·tol_j).
/// </summary>
public sealed class KclTests
{
    private static Circuit RandomCircuit(SeededRandom rng, int nodes)
    {
        var devices = new List<Device>
        {
            new VoltageSource("VCC", "VCC", "n0", "gnd", Waveform.Dc(12)),
            new VoltageSource("VIN", "VIN", "vin", "gnd", Waveform.Sine(0, 5, 50, 0, 0)),
            new Resistor("RIN", "RIN", "vin", "n1", 1e3),
        };
        string Node(int i) => i < 0 ? "gnd" : $"n{i}";
        string Pick() => Node((int)rng.NextInt(nodes + 1) - 1);
        // Every node gets a resistor to an earlier node (DC path) and a capacitor to ground.
        for (int i = 1; i < nodes; i++)
        {
            devices.Add(new Resistor($"R{i}", $"R{i}", Node(i), Node((int)rng.NextInt(i)), Math.Pow(10, 2 + 3 * rng.NextDouble())));
            devices.Add(new Capacitor($"C{i}", $"C{i}", Node(i), "gnd", Math.Pow(10, -9 + 3 * rng.NextDouble())));
        }
        for (int k = 0; k < 3; k++)
        {
            string a = Pick(), b = Pick();
            if (a != b) devices.Add(new Diode($"D{k}", $"D{k}", a, b, junctionCapacitance: 5e-12, transitTime: 1e-8));
        }
        for (int k = 0; k < 2; k++)
        {
            string c = Pick(), b = Pick(), e = Pick();
            if (c != b && b != e && c != e)
                devices.Add(new Bjt($"Q{k}", $"Q{k}", c, b, e, pnp: k == 1, earlyVoltage: 75, cje: 10e-12, cjc: 4e-12, tf: 1e-9));
        }
        devices.Add(Zener.Create("Z1", "Z1", "gnd", Node(nodes - 1), 5.1));
        return Circuit.FromDevices("random", devices);
    }

    [Theory]
    [InlineData(11UL)]
    [InlineData(12UL)]
    [InlineData(13UL)]
    public void Kcl_Holds_At_Every_Accepted_Step(ulong seed)
    {
        var rng = new SeededRandom(seed); // reported seed: the theory data
        Circuit circuit = RandomCircuit(rng, 8);
        var options = TransientOptions.Default;
        var check = new LoadContext(circuit.Size, circuit.Pattern.Count) { Gmin = options.Gmin };
        int checkedSteps = 0;
        double worstRatio = 0;
        var solver = new TransientSolver(circuit, options)
        {
            Accepted = s =>
            {
                // Devices are reloaded at the accepted point (limiting state is already at that point).
                Array.Clear(check.J); Array.Clear(check.Q); Array.Clear(check.G); Array.Clear(check.C);
                s.Solution.CopyTo(check.X);
                check.Time = s.Time;
                check.SourceScale = s.Time < options.SupplyRamp ? s.Time / options.SupplyRamp : 1.0;
                foreach (Device d in circuit.Devices) d.Load(check);
                ReadOnlySpan<double> x = s.Solution, qd = s.ChargeDerivative;
                var tol = new double[circuit.Size];
                for (int j = 0; j < circuit.Size; j++)
                    tol[j] = 0.1 * options.RelativeTolerance * Math.Abs(x[j]) +
                             0.1 * (circuit.Kinds[j] == UnknownKind.Branch ? options.CurrentTolerance : options.VoltageTolerance);
                var allowed = new double[circuit.Size];
                for (int slot = 0; slot < circuit.Pattern.Count; slot++)
                    allowed[circuit.Pattern.Rows[slot]] += Math.Abs(check.G[slot]) * tol[circuit.Pattern.Cols[slot]];
                for (int i = 0; i < circuit.Size; i++)
                {
                    if (circuit.Kinds[i] == UnknownKind.Branch) continue;
                    double residual = Math.Abs(check.J[i] + qd[i]);
                    double limit = 2 * allowed[i] + 1e-12;
                    worstRatio = Math.Max(worstRatio, residual / limit);
                }
                checkedSteps++;
            },
        };
        var result = solver.Run(0.06);
        Assert.True(result.Succeeded, result.Failure?.ToString());
        Assert.True(checkedSteps > 50);
        Assert.True(worstRatio <= 1.0, $"KCL residual reached {worstRatio:F2} × its tolerance");
    }
}
