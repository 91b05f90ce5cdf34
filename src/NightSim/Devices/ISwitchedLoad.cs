namespace NightSim.Devices;

/// <summary>A device that switches a named load (a lamp) with a power rating, for energy reports and for the light the
/// circuit adds to its own sensor. The state is per run; every change is also recorded as a discrete event with signal
/// "load &lt;name&gt;" ("off" → "on").</summary>
public interface ISwitchedLoad
{
    /// <summary>Name of the load ("lamp"), or null when the device switches no named load.</summary>
    string? LoadName { get; }

    /// <summary>Rated power of the load when on, W (0 when none).</summary>
    double LoadPower { get; }

    /// <summary>True while the load is switched on.</summary>
    bool LoadOn { get; }
}
