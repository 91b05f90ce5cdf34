namespace NightSim.Results;

/// <summary>What a discrete state change means to the analysis. Devices state it when they record the change, so
/// the analysis never has to recognise a device by its name.</summary>
public enum DeviceEventKind
{
    /// <summary>A change with no meaning for the analysis (a general-purpose comparator or latch).</summary>
    Other,
    /// <summary>A one-shot's trigger input went below its level (a third of the supply): the timing starts.</summary>
    TriggerFired,
    /// <summary>The trigger input came back above its level.</summary>
    TriggerReleased,
    /// <summary>The timing node reached the threshold level (two thirds of the supply): the timing period is over.</summary>
    ThresholdReached,
    /// <summary>The timing node fell back below the threshold level (discharged).</summary>
    ThresholdLeft,
    /// <summary>The reset input went active (holds the output low).</summary>
    ResetHeld,
    /// <summary>The reset input was released.</summary>
    ResetReleased,
    /// <summary>The timer's output went high (its on-period began).</summary>
    TimerOutputHigh,
    /// <summary>The timer's output went low (its on-period ended).</summary>
    TimerOutputLow,
    /// <summary>A relay coil's current reached pull-in.</summary>
    CoilPulledIn,
    /// <summary>A relay coil's current fell to drop-out.</summary>
    CoilReleased,
    /// <summary>A relay's armature moved to the operated position (its contacts changed over).</summary>
    RelayOperated,
    /// <summary>A relay's armature moved back.</summary>
    RelayReleased,
    /// <summary>A named load switched on.</summary>
    LoadOn,
    /// <summary>A named load switched off.</summary>
    LoadOff,
}
