using System.Text.Json;

namespace NightSim.Sky.Events;

/// <summary>Parses one scenario "events" entry into a definition; null when it had errors (already recorded).</summary>
public delegate IEventDefinition? EventParser(JsonElement element, string path, ScenarioParseContext context);

/// <summary>
/// JSON "kind" → parser. Each definition draws from its own stream, named "kind#n" (n = its order among entries of
/// the same kind) and derived from the scenario seed by a stable hash, so adding a kind or an entry of another kind
/// never shifts the draws of the others.
/// </summary>
public sealed class LightEventCatalog
{
    private readonly Dictionary<string, EventParser> _parsers = new(StringComparer.Ordinal);

    /// <summary>The built-in kinds.</summary>
    public static LightEventCatalog Default { get; } = CreateDefault();

    private static LightEventCatalog CreateDefault()
    {
        var c = new LightEventCatalog();
        c.Register("headlights", HeadlightDefinition.Parse);
        c.Register("lightning", LightningDefinition.Parse);
        c.Register("steady-light", SteadyLightDefinition.Parse);
        c.Register("lamp-coupling", LampCoupling.Parse);
        c.Register("noise", NoiseDefinition.Parse);
        return c;
    }

    /// <summary>Registers <paramref name="parser"/> under <paramref name="kind"/>.</summary>
    public void Register(string kind, EventParser parser)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(kind);
        ArgumentNullException.ThrowIfNull(parser);
        if (!_parsers.TryAdd(kind, parser)) throw new InvalidOperationException($"event kind \"{kind}\" is already registered");
    }

    /// <summary>Registered kinds, sorted.</summary>
    public IReadOnlyList<string> Kinds => [.. _parsers.Keys.Order(StringComparer.Ordinal)];

    /// <summary>The parser for <paramref name="kind"/>, or null.</summary>
    public EventParser? Find(string kind) => _parsers.GetValueOrDefault(kind);

    /// <summary>Stream name of the <paramref name="ordinal"/>-th definition of <paramref name="kind"/>.</summary>
    public static string StreamName(string kind, int ordinal) => $"{kind}#{ordinal}";
}
