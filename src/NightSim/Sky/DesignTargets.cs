namespace NightSim.Sky;

/// <summary>
/// What a design must do, stated in its scenario under "targets". Every field is optional; an absent field is not
/// checked. Times are seconds; clock times are local times of the site.
/// </summary>
public sealed record DesignTargets
{
    /// <summary>Lowest acceptable light level at the sensor at the dusk switch-on, lux, or null.</summary>
    public double? SwitchOnLuxMin { get; init; }

    /// <summary>Highest acceptable light level at the sensor at the dusk switch-on, lux, or null.</summary>
    public double? SwitchOnLuxMax { get; init; }

    /// <summary>The dusk switch-on must come no later than this many minutes after sunset, or null.</summary>
    public double? SwitchOnMinutesAfterSunset { get; init; }

    /// <summary>Shortest acceptable on-time of the dusk switch-on, seconds, or null.</summary>
    public double? OnTimeMin { get; init; }

    /// <summary>Longest acceptable on-time of the dusk switch-on, seconds, or null.</summary>
    public double? OnTimeMax { get; init; }

    /// <summary>The dusk switch-on must end by this local clock time (after noon: the same evening; before noon: the
    /// next morning), or null.</summary>
    public TimeSpan? OffBy { get; init; }

    /// <summary>No switch-on other than the dusk one (power-up excepted).</summary>
    public bool NoFalseTrigger { get; init; }

    /// <summary>The dusk on-time is not cut short before the timer runs out.</summary>
    public bool NoEarlyOff { get; init; }

    /// <summary>No burst of relay operations (chatter).</summary>
    public bool NoChatter { get; init; }

    /// <summary>The load is off at sunrise.</summary>
    public bool OffAtSunrise { get; init; }

    /// <summary>True when nothing is stated.</summary>
    public bool IsEmpty => this == new DesignTargets();
}
