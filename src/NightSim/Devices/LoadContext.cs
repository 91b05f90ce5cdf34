using NightSim.Sky;

namespace NightSim.Devices;

/// <summary>
/// What a device sees and writes while it is loaded. One instance per run, reused every iteration (no allocation).
/// Arrays are indexed by unknown (X, J, Q) or by matrix slot (G, C). The solver clears J, Q, G and C before each load.
/// </summary>
public sealed class LoadContext
{
    public LoadContext(int unknowns, int slots)
    {
        X = new double[unknowns];
        J = new double[unknowns];
        Q = new double[unknowns];
        G = new double[slots];
        C = new double[slots];
    }

    /// <summary>Current iterate: node voltages (V) and branch currents (A).</summary>
    public double[] X { get; }

    /// <summary>Per row: currents leaving the node (A), or branch-equation residual.</summary>
    public double[] J { get; }

    /// <summary>Per row: charge (C) on node rows, flux-like quantity on branch rows.</summary>
    public double[] Q { get; }

    /// <summary>∂J/∂x per matrix slot (S, or dimensionless on constraint rows).</summary>
    public double[] G { get; }

    /// <summary>∂Q/∂x per matrix slot (F, or H on inductor rows).</summary>
    public double[] C { get; }

    /// <summary>Run time, seconds since the run origin.</summary>
    public double Time { get; set; }

    /// <summary>Scale on independent sources, 0…1 (source stepping, power-up ramp). 1 in normal running.</summary>
    public double SourceScale { get; set; } = 1.0;

    /// <summary>Conductance added across every junction (S); a convergence aid, normally 1e-12.</summary>
    public double Gmin { get; set; } = 1e-12;

    /// <summary>True on the first Newton iteration of a fresh start: junction devices use their own initial guess.</summary>
    public bool InitJunctions { get; set; }

    /// <summary>True when no charge terms are needed (operating point); devices may still write Q.</summary>
    public bool IsOperatingPoint { get; set; }

    /// <summary>Set by a device that limited a junction voltage in this iteration: the iteration is then not converged.</summary>
    public bool Limited { get; set; }

    /// <summary>Ambient temperature, kelvin (default 300.15 K = 27 °C).</summary>
    public double Temperature { get; set; } = 300.15;

    /// <summary>Light on the sensor channels; null when the run has no light (sensors then see <see cref="ConstantLux"/>).</summary>
    public ILightSignal? Light { get; set; }

    /// <summary>Illuminance when no light signal is attached, lux.</summary>
    public double ConstantLux { get; set; }

    /// <summary>Illuminance on <paramref name="channel"/> at <see cref="Time"/>, lux.</summary>
    public double Lux(int channel) => channel < 0 ? ConstantLux : (Light?.Lux(channel, Time) ?? ConstantLux);

    /// <summary>Voltage of unknown <paramref name="index"/>, 0 for ground (-1).</summary>
    public double V(int index) => index < 0 ? 0.0 : X[index];

    /// <summary>Add current i leaving node a and entering node b (either may be ground).</summary>
    public void AddCurrent(int a, int b, double i)
    {
        if (a >= 0) J[a] += i;
        if (b >= 0) J[b] -= i;
    }

    /// <summary>Add charge q on node a and −q on node b.</summary>
    public void AddCharge(int a, int b, double q)
    {
        if (a >= 0) Q[a] += q;
        if (b >= 0) Q[b] -= q;
    }

    /// <summary>Add <paramref name="value"/> at a matrix slot of G (skips -1).</summary>
    public void AddG(int slot, double value)
    {
        if (slot >= 0) G[slot] += value;
    }

    /// <summary>Add <paramref name="value"/> at a matrix slot of C (skips -1).</summary>
    public void AddC(int slot, double value)
    {
        if (slot >= 0) C[slot] += value;
    }
}
