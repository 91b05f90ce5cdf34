using NightSim.Netlist;

namespace NightSim.Devices;

/// <summary>Reads a part's parameters with the kind's declared defaults, so devices built in code (tests, composites)
/// behave exactly like devices built by the netlist loader, which applies the same defaults.</summary>
public static class ParameterDefaults
{
    /// <summary>The number, or the spec's default; throws if neither exists (a required parameter is missing).</summary>
    public static double NumberOrDefault(this PartParameters parameters, ParameterSpec spec) =>
        parameters.OptionalNumber(spec.Name) ?? spec.Default
        ?? throw new KeyNotFoundException($"parameter '{spec.Name}' is not set and has no default");

    /// <summary>The word, or the spec's default text ("" when none).</summary>
    public static string TextOrDefault(this PartParameters parameters, ParameterSpec spec) =>
        parameters.Text(spec.Name, spec.DefaultText ?? "");

    /// <summary>The node an optional pin connects to, or null when the netlist left it out (the loader then gives it
    /// the private node "&lt;id&gt;.&lt;pin&gt;", which nothing else touches).</summary>
    public static string? ConnectedPin(this PartDefinition part, string pin) =>
        part.Pins.TryGetValue(pin, out string? node) && node != part.Id + "." + pin ? node : null;
}
