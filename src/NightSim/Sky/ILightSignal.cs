namespace NightSim.Sky;

/// <summary>Illuminance seen by the circuit's light sensors, on named channels, against run time.</summary>
public interface ILightSignal
{
    /// <summary>Run time origin: run time t (seconds) corresponds to <c>Origin + t</c>.</summary>
    DateTimeOffset Origin { get; }

    /// <summary>Channel index for a channel name ("sensor" is the default channel), or -1 if unknown.</summary>
    int ChannelIndex(string name);

    /// <summary>Illuminance in lux on <paramref name="channel"/> at run time <paramref name="time"/> (seconds since
    /// <see cref="Origin"/>). Pure, allocation-free, thread-safe.</summary>
    double Lux(int channel, double time);

    /// <summary>The first known edge (event start, peak or end, recorded-log sample, steady light on/off) strictly
    /// after <paramref name="time"/>, in seconds; +∞ if none. Allocation-free.</summary>
    double NextBreakpoint(double time);

    /// <summary>The longest step from <paramref name="time"/> over which the light on every channel changes by no more
    /// than the factor e^<paramref name="change"/> (|Δ ln lux| ≤ change) through its smooth part (the sky), seconds;
    /// +∞ when the signal does not know (edges are reported by <see cref="NextBreakpoint"/>). Allocation-free.</summary>
    double StepLimit(double time, double change) => double.PositiveInfinity;
}
