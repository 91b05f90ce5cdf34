using NightSim.Devices;
using NightSim.Devices.Roles;

namespace NightSim.Supply;

/// <summary>The mains a supply is judged at, when it differs from the netlist's sine source: RMS voltage and frequency
/// (either may be left as the netlist has it). The source's peak becomes √2 times the RMS.</summary>
/// <param name="Rms">RMS voltage, V, or null to keep the netlist's.</param>
/// <param name="Frequency">Frequency, Hz, or null to keep the netlist's.</param>
public sealed record MainsSetting(double? Rms, double? Frequency)
{
    /// <summary>The devices with the first sine voltage source replaced by one at this mains (same name, nodes, offset,
    /// start and phase; the amplitude keeps its sign). Devices without a sine source come back unchanged.</summary>
    public IReadOnlyList<Device> Apply(IReadOnlyList<Device> devices)
    {
        var list = devices.ToList();
        int i = list.FindIndex(d => d.Role is SineSourceRole);
        if (i < 0 || list[i] is not VoltageSource source) return list;
        Waveform w = source.Waveform;
        double amplitude = Rms is double rms ? Math.CopySign(rms * Math.Sqrt(2.0), w.SineAmplitude == 0 ? 1.0 : w.SineAmplitude) : w.SineAmplitude;
        double frequency = Frequency ?? w.SineFrequency;
        list[i] = new VoltageSource(source.Name, source.PartId, source.Nodes[0], source.Nodes[1], w.WithSine(amplitude, frequency));
        return list;
    }
}
