using NightSim.Devices;
using NightSim.Mna;

namespace NightSim.Transient;

/// <summary>
/// The power-up ramp: in a run that starts by power-up (<see cref="StartMode.PowerUp"/>) every independent source is
/// multiplied by a factor rising linearly from 0 at t = 0 to 1 at <see cref="TransientOptions.SupplyRamp"/> (1 ms by
/// default), like a supply switched on. A source whose own waveform has a corner inside that window is shaped by the
/// ramp as well (a step at t = 0 becomes a 1 ms ramp); this finds such sources so the caller can say so.
/// </summary>
public static class PowerUpRamp
{
    /// <summary>Independent sources whose waveform jumps before the end of the ramp: (part id, first corner time in
    /// seconds); a corner that only changes the slope (a sine from its zero, a sloped edge) is not reported. Empty when the run starts from the operating point or the ramp is 0.</summary>
    public static IReadOnlyList<(string PartId, double Corner)> SourceCornersInside(Circuit circuit, TransientOptions options)
    {
        ArgumentNullException.ThrowIfNull(circuit);
        ArgumentNullException.ThrowIfNull(options);
        var found = new List<(string, double)>();
        if (options.Start != StartMode.PowerUp || !(options.SupplyRamp > 0)) return found;
        foreach (Device d in circuit.Devices)
        {
            Waveform? w = d switch
            {
                VoltageSource v => v.Waveform,
                CurrentSource c => c.Waveform,
                _ => null,
            };
            if (w is null) continue;
            double corner = w.NextBreakpoint(-1e-12);
            if (!(corner < options.SupplyRamp)) continue;
            // Only a jump or a fast edge is reshaped by the ramp; a source that merely starts to change (a sine from its zero, a pulse's
            // sloped edge) rises under the ramp as it would anyway.
            double at = Math.Max(0.0, corner);
            // Fast against the ramp: more than 1 % of its peak within a hundredth of the ramp (a 50 Hz sine from its zero
            // moves 0.3 %).
            double within = options.SupplyRamp / 100.0;
            if (Math.Abs(w.Value(at + within) - w.Value(at - 1e-9)) > 1e-2 * Math.Max(1e-3, w.PeakMagnitude))
                found.Add((d.PartId, at));
        }
        return found;
    }
}
