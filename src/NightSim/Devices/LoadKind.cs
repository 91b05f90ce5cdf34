namespace NightSim.Devices;

/// <summary>What a switched load is electrically: it sets the current the contacts see at switch-on (the inrush) and
/// the load's power factor. The typical values are in <see cref="LoadInrushTable"/>.</summary>
public enum LoadKind
{
    /// <summary>A heater or other plain resistance: the steady current from the first instant.</summary>
    Resistive,

    /// <summary>A tungsten or halogen filament lamp: a cold filament draws many times its working current.</summary>
    Incandescent,

    /// <summary>An LED lamp or floodlight behind an electronic driver: its input capacitor charges at switch-on (a very
    /// high, very short peak).</summary>
    LedDriver,

    /// <summary>A fluorescent lamp on a magnetic ballast (choke and starter).</summary>
    Fluorescent,
}
