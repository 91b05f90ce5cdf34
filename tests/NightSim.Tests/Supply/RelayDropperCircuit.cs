using NightSim.Devices;

namespace NightSim.Tests.Supply;

/// <summary>The circuit both the averaged and the envelope runs are checked on against full mains detail.</summary>
internal static class RelayDropperCircuit
{
    private const double Peak = 230 * 1.4142135623730951, Hz = 50, Dropper = 470e-9;

    /// <summary>A 230 V / 50 Hz bridge dropper (47 Ω, 470 nF with 1 MΩ bleeder), 470 µF, 12 V Zener, 1 kΩ standby load
    /// and a 400 Ω relay coil switched onto the rail at <paramref name="switchAt"/>; DC minus as ground.</summary>
    public static List<Device> Devices(double switchAt) =>
    [
        new VoltageSource("VM", "VM", "line", "neutral", Waveform.Sine(0, Peak, Hz, 0, 0)),
        new Resistor("RF", "RF", "line", "l1", 47),
        new Capacitor("CX", "CX", "l1", "ac1", Dropper),
        new Resistor("RBL", "RBL", "l1", "ac1", 1e6),
        new Diode("D1", "D1", "ac1", "dcp"),
        new Diode("D2", "D2", "neutral", "dcp"),
        new Diode("D3", "D3", "gnd", "ac1"),
        new Diode("D4", "D4", "gnd", "neutral"),
        new Capacitor("CS", "CS", "dcp", "gnd", 470e-6),
        Zener.Create("DZ", "DZ", "gnd", "dcp", 12, 5e-3, 10),
        new Resistor("RL", "RL", "dcp", "gnd", 1000),
        new Switch("S1", "S1", "coil", "gnd", 0.1, 1e9, false, [(switchAt, 1.0)]),
        new Relay("K1", "K1", "dcp", "coil", [], new RelaySettings()),
        new Diode("DF", "DF", "coil", "dcp"),
    ];
}
