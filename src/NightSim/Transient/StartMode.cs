namespace NightSim.Transient;

/// <summary>How a transient run starts.</summary>
public enum StartMode
{
    /// <summary>Capacitors at 0 V (unless an initial voltage is given), discrete devices in their power-up state,
    /// independent sources ramped from zero over <see cref="TransientOptions.SupplyRamp"/>.</summary>
    PowerUp,
    /// <summary>Start from a DC operating point (Newton, then gmin stepping, then source stepping).</summary>
    OperatingPoint,
}
