using System.Reflection;

namespace NightSim.Cli.Commands;

/// <summary>The starting designs `nightsim init` writes: a commented netlist per arrangement and one commented
/// scenario text with the site filled in. The files live in src/NightSim.Cli/Templates and are embedded.</summary>
internal static class StarterTemplates
{
    /// <summary>One starting design: its name on the command line, what it is, and the node noise examples point at.</summary>
    public sealed record Template(string Name, string Summary, string NoiseNode);

    /// <summary>Every template, the default first.</summary>
    public static readonly IReadOnlyList<Template> All =
    [
        new("one-shot", "light-dependent resistor and comparator, RC-coupled trigger into a 555 one-shot (about 4 h), relay", "trig"),
        new("one-shot-latched", "the one-shot with a re-arm latch: one switch-on a night, headlights after time-out ignored", "trig"),
        new("ldr-comparator", "light-dependent resistor with a comparator and a relay: on from dusk to dawn", "sense"),
        new("phototransistor", "phototransistor with a two-transistor trigger and a relay: on from dusk to dawn", "sense"),
    ];

    /// <summary>The invented site used when the user gives none.</summary>
    public static readonly (string Name, double Latitude, double Longitude, string TimeZone) DefaultSite =
        ("Invented Allotment, Quittenweg 3", 51.3, 9.5, "Europe/Berlin");

    /// <summary>First night when none is given.</summary>
    public const string DefaultDate = "2026-11-20";

    /// <summary>The template's netlist text.</summary>
    public static string Netlist(Template t) => Resource(t.Name + ".json");

    /// <summary>The scenario text for a template at a site.</summary>
    public static string Scenario(Template t, string siteName, double latitude, double longitude, string timeZone, string date) =>
        Resource("scenario.json")
            .Replace("{{NAME}}", t.Name + "-nights", StringComparison.Ordinal)
            .Replace("{{SITE}}", siteName.Replace("\"", "'", StringComparison.Ordinal), StringComparison.Ordinal)
            .Replace("{{LAT}}", latitude.ToString("0.####", System.Globalization.CultureInfo.InvariantCulture), StringComparison.Ordinal)
            .Replace("{{LON}}", longitude.ToString("0.####", System.Globalization.CultureInfo.InvariantCulture), StringComparison.Ordinal)
            .Replace("{{TZ}}", timeZone, StringComparison.Ordinal)
            .Replace("{{DATE}}", date, StringComparison.Ordinal)
            .Replace("{{NOISE_NODE}}", t.NoiseNode, StringComparison.Ordinal);

    /// <summary>The scenario JSON Schema (the same file as netlists/scenario.schema.json).</summary>
    public static string ScenarioSchema() => Resource("scenario.schema.json");

    private static string Resource(string name)
    {
        Assembly a = typeof(StarterTemplates).Assembly;
        using Stream s = a.GetManifestResourceStream("NightSim.Cli.Templates." + name)
            ?? throw new InvalidOperationException($"template resource {name} missing from the build");
        using var r = new StreamReader(s);
        return r.ReadToEnd();
    }
}
