namespace NightSim.Devices;

/// <summary>
/// The part kinds a netlist may use. Adding a kind: write one file with a <c>public static PartKind Kind</c>, add one
/// line to <see cref="s_kinds"/>, add one test file.
/// </summary>
public static class PartCatalog
{
    // One line per kind. Keep the order stable (help and schema list kinds in this order).
    private static readonly PartKind[] s_kinds =
    [
        Resistor.Kind,
        Capacitor.Kind,
        Inductor.Kind,
        VoltageSource.Kind,
        CurrentSource.Kind,
        Switch.Kind,
        Potentiometer.Kind,
        Diode.Kind,
        Zener.Kind,
        Bjt.NpnKind,
        Bjt.PnpKind,
        Comparator.Kind,
        SrLatch.Kind,
        Composite.Timer555.Kind,
        Relay.Kind,
        Light.Photoresistor.Kind,
        Light.Photodiode.Kind,
        Light.Phototransistor.Kind,
        Light.LightCurrentSensor.Kind,
    ];

    private static readonly Dictionary<string, PartKind> s_byName = s_kinds.ToDictionary(k => k.Name, StringComparer.Ordinal);

    /// <summary>Every registered kind, in registration order.</summary>
    public static IReadOnlyList<PartKind> All => s_kinds;

    /// <summary>The kind with this JSON name, or null.</summary>
    public static PartKind? Find(string name) => s_byName.GetValueOrDefault(name);
}
