using NightSim.Devices;
using NightSim.Devices.Roles;
using NightSim.Mna;

namespace NightSim.Supply;

/// <summary>
/// The quantities a supply budget measures at every accepted point, read from the solution vector (allocation-free):
/// the rail, the mains current, the voltage across every resistor and capacitor, each Zener's reverse current and
/// dissipation, and each relay coil's voltage as it counts against pull-in (coil current times coil resistance).
/// Layout: [0] rail (V), [1] mains current (A), then one voltage per resistor, one per capacitor, two per Zener
/// (reverse current cathode → anode, A; dissipation, W) and one per coil.
/// </summary>
public sealed class SupplyProbes
{
    private readonly int _railPlus, _railMinus, _line;
    private readonly int[] _resA, _resB, _capP, _capN, _zenA, _zenK, _coil;
    private readonly ITerminalCurrent[] _zenDevice;
    private readonly double[] _coilResistance;

    /// <summary>Index of the rail quantity.</summary>
    public const int Rail = 0;

    /// <summary>Index of the mains-current quantity.</summary>
    public const int Line = 1;

    public SupplyProbes(Circuit circuit, SupplySection section)
    {
        Section = section;
        int Ix(string node) => Netlist.Ground.Is(node) ? -1 : circuit.IndexOf(node);
        _railPlus = section.Rail is null ? -1 : Ix(section.Rail.Plus);
        _railMinus = section.Rail is null ? -1 : Ix(section.Rail.Minus);
        _line = circuit.IndexOf(section.Source.CurrentLabel);
        _resA = [.. section.Resistors.Select(r => Ix(r.A))];
        _resB = [.. section.Resistors.Select(r => Ix(r.B))];
        _capP = [.. section.Capacitors.Select(c => Ix(c.P))];
        _capN = [.. section.Capacitors.Select(c => Ix(c.N))];
        _zenA = [.. section.Zeners.Select(z => Ix(z.Anode))];
        _zenK = [.. section.Zeners.Select(z => Ix(z.Cathode))];
        _zenDevice = [.. section.Zeners.Select(z => circuit.Devices.First(d => ReferenceEquals(d.Role, z)) as ITerminalCurrent
            ?? throw new InvalidOperationException($"Zener {z.PartId} cannot state its current"))];
        _coil = [.. section.Relays.Select(r => circuit.IndexOf(r.CoilCurrent))];
        _coilResistance = [.. section.Relays.Select(r => r.CoilResistance)];
        Count = 2 + _resA.Length + _capP.Length + 2 * _zenA.Length + _coil.Length;
    }

    /// <summary>The section these probes read.</summary>
    public SupplySection Section { get; }

    /// <summary>Number of quantities.</summary>
    public int Count { get; }

    /// <summary>Index of the voltage across resistor <paramref name="k"/> (in <see cref="SupplySection.Resistors"/> order).</summary>
    public int Resistor(int k) => 2 + k;

    /// <summary>Index of the voltage across capacitor <paramref name="k"/>.</summary>
    public int Capacitor(int k) => 2 + _resA.Length + k;

    /// <summary>Index of the reverse current of Zener <paramref name="k"/>.</summary>
    public int ZenerCurrent(int k) => 2 + _resA.Length + _capP.Length + 2 * k;

    /// <summary>Index of the dissipation of Zener <paramref name="k"/>.</summary>
    public int ZenerPower(int k) => ZenerCurrent(k) + 1;

    /// <summary>Index of the coil voltage of relay <paramref name="k"/>.</summary>
    public int Coil(int k) => 2 + _resA.Length + _capP.Length + 2 * _zenA.Length + k;

    private static double V(ReadOnlySpan<double> x, int i) => i >= 0 ? x[i] : 0.0;

    /// <summary>Writes every quantity at solution <paramref name="x"/> into <paramref name="values"/>.</summary>
    public void Sample(ReadOnlySpan<double> x, Span<double> values)
    {
        values[Rail] = V(x, _railPlus) - V(x, _railMinus);
        // The branch current flows from + through the source to −: the current the mains delivers is its negative.
        values[Line] = _line >= 0 ? -x[_line] : 0.0;
        int q = 2;
        for (int k = 0; k < _resA.Length; k++) values[q++] = V(x, _resA[k]) - V(x, _resB[k]);
        for (int k = 0; k < _capP.Length; k++) values[q++] = V(x, _capP[k]) - V(x, _capN[k]);
        for (int k = 0; k < _zenA.Length; k++)
        {
            double forward = _zenDevice[k].TerminalCurrent(x);
            values[q++] = -forward;
            values[q++] = (V(x, _zenA[k]) - V(x, _zenK[k])) * forward;
        }
        for (int k = 0; k < _coil.Length; k++) values[q++] = _coil[k] >= 0 ? Math.Abs(x[_coil[k]]) * _coilResistance[k] : 0.0;
    }
}
