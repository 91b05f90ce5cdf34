namespace NightSim.Devices;

/// <summary>A device that switches a named load (a lamp) with a power rating, for energy reports, for the light the
/// circuit adds to its own sensor and for the contacts that carry it. The state is per run; every change is also
/// recorded as a discrete event with signal "load &lt;name&gt;" ("off" → "on").</summary>
public interface ISwitchedLoad
{
    /// <summary>Name of the load ("lamp"), or null when the device switches no named load.</summary>
    string? LoadName { get; }

    /// <summary>Rated power of the load when on, W (0 when none).</summary>
    double LoadPower { get; }

    /// <summary>True while the load is switched on.</summary>
    bool LoadOn { get; }

    /// <summary>What the load is (resistive, filament lamp, LED driver, fluorescent), or null when not stated.</summary>
    LoadKind? LoadKind { get; }

    /// <summary>RMS voltage the load runs on, V (the mains, or a low-voltage lamp supply).</summary>
    double LoadVoltage { get; }

    /// <summary>The load's power factor when stated on the part, or null (then its kind's typical value).</summary>
    double? LoadPowerFactor { get; }

    /// <summary>What the switching contacts are rated for.</summary>
    ContactRating ContactRating { get; }
}
