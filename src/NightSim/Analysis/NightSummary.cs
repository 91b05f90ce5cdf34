namespace NightSim.Analysis;

/// <summary>What happened in one night (local noon to local noon).</summary>
public sealed record NightSummary
{
    /// <summary>Calendar date of the evening.</summary>
    public required DateOnly Date { get; init; }
    public DateTimeOffset? Sunset { get; init; }
    public DateTimeOffset? CivilDusk { get; init; }
    public DateTimeOffset? CivilDawn { get; init; }
    public DateTimeOffset? Sunrise { get; init; }

    /// <summary>Clock time the sensor's light fell through the circuit's effective switching level, or null.</summary>
    public DateTimeOffset? SwitchLevelCrossing { get; init; }

    /// <summary>The circuit's effective switching level at the sensor, lux (measured at the dusk switch-on), or null.</summary>
    public double? SwitchLevelLux { get; init; }

    public IReadOnlyList<LoadInterval> LoadOn { get; init; } = [];

    /// <summary>Switch-ons not caused by dusk.</summary>
    public int FalseTriggers { get; init; }

    /// <summary>On-times cut short (reset by a light event, supply sag) before the timer ran out.</summary>
    public int EarlyOffs { get; init; }

    /// <summary>Bursts of many relay operations within seconds.</summary>
    public int ChatterBursts { get; init; }

    /// <summary>Relay contact transitions (closing and opening each count one).</summary>
    public int RelayOperations { get; init; }

    /// <summary>It got dark but the load never came on.</summary>
    public bool Missed { get; init; }

    /// <summary>The load was still on at sunrise.</summary>
    public bool OnAfterSunrise { get; init; }

    /// <summary>Energy delivered to the named loads, watt-hours.</summary>
    public double LoadEnergyWh { get; init; }
}
