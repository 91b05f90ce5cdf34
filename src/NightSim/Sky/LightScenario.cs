using NightSim.Sky.Events;

namespace NightSim.Sky;

/// <summary>
/// An immutable light scenario: site, nights, sensor channels, weather, events and an optional recorded log.
/// Load with <see cref="ScenarioLoader"/>; turn into the sensor signal with <see cref="CreateProfile"/>.
/// </summary>
public sealed record LightScenario
{
    /// <summary>Name of the default light channel.</summary>
    public const string DefaultChannel = "sensor";
    /// <summary>Seed used when the scenario gives none.</summary>
    public const ulong DefaultSeed = 1;

    public required string Name { get; init; }
    public string Description { get; init; } = "";
    public required Site Site { get; init; }
    /// <summary>Date of the first night (local noon of this date is run time 0).</summary>
    public required DateOnly Start { get; init; }
    /// <summary>Number of nights, ≥ 1.</summary>
    public int Nights { get; init; } = 1;
    /// <summary>Seed of every random draw.</summary>
    public ulong Seed { get; init; } = DefaultSeed;
    /// <summary>True when the file gave the seed; false when <see cref="DefaultSeed"/> was used.</summary>
    public bool SeedGiven { get; init; }
    /// <summary>Light channels; the first is "sensor".</summary>
    public IReadOnlyList<LightChannel> Channels { get; init; } = [new LightChannel(DefaultChannel, 1.0)];
    public Weather Weather { get; init; } = Weather.Clear;
    /// <summary>Event definitions in file order.</summary>
    public IReadOnlyList<IEventDefinition> Events { get; init; } = [];
    /// <summary>Recorded light log, or null.</summary>
    public RecordedLightLog? LightLog { get; init; }
    public LightLogMode LightLogMode { get; init; } = LightLogMode.Replace;
    /// <summary>True when log values are lux at the sensor; false when open-sky lux scaled by each channel's exposure.</summary>
    public bool LightLogAtSensor { get; init; }
    /// <summary>File the scenario came from, or null.</summary>
    public string? SourceFile { get; init; }
    /// <summary>What the design must do ("targets"), or null when the scenario states none.</summary>
    public DesignTargets? Targets { get; init; }
    /// <summary>Sky mix per month for studies over many dates ("weatherMix"), or null.</summary>
    public WeatherMix? WeatherMix { get; init; }
    /// <summary>Non-fatal notes (e.g. gaps in the light log).</summary>
    public IReadOnlyList<ScenarioError> Warnings { get; init; } = [];

    /// <summary>Night-to-run-time mapping of this scenario.</summary>
    public ScenarioTimeline Timeline() => new(Site, Start, Nights);

    /// <summary>The sensor signal over all nights, with every random draw made now from <see cref="Seed"/>.</summary>
    public LightProfile CreateProfile() => LightProfile.Create(this);
}
