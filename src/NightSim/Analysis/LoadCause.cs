namespace NightSim.Analysis;

/// <summary>What made the load switch on (attributed from the circuit's trigger timing and the concrete event list).</summary>
public enum LoadCause
{
    /// <summary>Falling daylight crossed the circuit's switching level: the intended switch-on.</summary>
    Dusk,
    /// <summary>A passing or turning car's headlights.</summary>
    Headlight,
    /// <summary>A lightning flash.</summary>
    Lightning,
    /// <summary>A porch or street light switching on or off.</summary>
    SteadyLight,
    /// <summary>The lamp's own light reaching the sensor.</summary>
    SelfIllumination,
    /// <summary>An electrical noise pulse.</summary>
    Noise,
    /// <summary>Supply sag or interruption.</summary>
    Supply,
    /// <summary>The circuit powering up.</summary>
    PowerUp,
    /// <summary>Nothing in the event list explains it.</summary>
    Unexplained,
}
