namespace NightSim.Sky.Events;

/// <summary>Collects what event definitions generate: light events, lamp couplings, noise pulses.</summary>
public sealed class EventSink
{
    public List<ILightEvent> LightEvents { get; } = [];
    public List<LampCoupling> LampCouplings { get; } = [];
    public List<NoiseInjection> NoiseInjections { get; } = [];
}

/// <summary>A parsed event entry of a scenario; turns into concrete events for a timeline and a random stream.</summary>
public interface IEventDefinition
{
    /// <summary>JSON kind.</summary>
    string Kind { get; }
    /// <summary>Channel name the events act on (validated by the loader), or null when not a light channel.</summary>
    string? Channel { get; }
    /// <summary>Draws all concrete events over the timeline from <paramref name="random"/> (this definition's own stream).</summary>
    void Generate(ScenarioTimeline timeline, DeterministicRandom random, EventSink sink);
    /// <summary>True when the events' times come from the seed (a rate, a storm); false when the scenario gives them.</summary>
    bool DrawnFromSeed => true;
}
