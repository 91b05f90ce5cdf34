namespace NightSim.Devices;

/// <summary>
/// The typical switch-on (inrush) current and power factor of each kind of lamp load. Every value here is common
/// practice of the trade, recalled from memory rather than measured, and is marked so in every report that uses it;
/// a builder with the lamp's or driver's own data should trust those (and state <c>loadPowerFactor</c> and the relay's
/// <c>contactInrush</c>). This is the one place these numbers live.
/// </summary>
public static class LoadInrushTable
{
    /// <summary>Words the netlist accepts for <c>loadKind</c>, in table order.</summary>
    public static IReadOnlyList<string> Words => [.. Rows.Select(r => r.Word)];

    /// <summary>The rows, one per <see cref="LoadKind"/>.</summary>
    public static IReadOnlyList<LoadInrush> Rows { get; } =
    [
        new(LoadKind.Resistive, "resistive", "resistive load, e.g. a heater", 1.0, 1.0, 0.0, "none", 1.0,
            "Ohm's law: a resistance draws its working current from the first instant (a heater's resistance changes " +
            "little with temperature); power factor 1."),
        new(LoadKind.Incandescent, "incandescent", "incandescent (filament) lamp", 10.0, 15.0, 5e-3,
            "a few milliseconds (the first half-cycle)", 1.0,
            "Common practice, from memory: a tungsten filament's resistance when cold is about a tenth to a fifteenth " +
            "of its resistance at working temperature, so the first half-cycle draws 10–15× the working current " +
            "(halogen lamps alike); a filament is a resistance, power factor 1."),
        new(LoadKind.LedDriver, "led-driver", "LED lamp with an electronic driver", 40.0, 100.0, 2e-4,
            "well under a millisecond", 0.9,
            "Common practice, from memory: the driver's rectifier charges its input capacitor straight from the mains " +
            "at switch-on, a peak of about 40–100× the working current (more for small drivers without an inrush " +
            "limiter) lasting some hundreds of microseconds; power factor about 0.9 for drivers with power-factor " +
            "correction, as low as 0.5 for small drivers without (state loadPowerFactor from the driver's data)."),
        new(LoadKind.Fluorescent, "fluorescent", "fluorescent lamp on a magnetic ballast", 5.0, 10.0, 1e-2,
            "the first mains cycles", 0.5,
            "Common practice, from memory: a fluorescent lamp with a magnetic ballast draws about 5–10× its working " +
            "current in the first cycles (higher and shorter with a parallel correction capacitor); an uncorrected " +
            "magnetic ballast runs at a power factor of about 0.5."),
    ];

    /// <summary>The row of <paramref name="kind"/>.</summary>
    public static LoadInrush For(LoadKind kind) => Rows.First(r => r.Kind == kind);

    /// <summary>The row whose netlist word is <paramref name="word"/>, or null.</summary>
    public static LoadInrush? ForWord(string word) => Rows.FirstOrDefault(r => r.Word == word);
}
