namespace NightSim.Devices.Roles;

/// <summary>A one-shot timer (555 class): its pins as circuit nodes, the fractions of its supply at which the
/// trigger and threshold act, and its family. Its drains at the timing node (threshold input current, discharge
/// leakage) are devices of their own that state themselves to a DC network (<see cref="IDcElement"/>).</summary>
/// <param name="PartId">Netlist part id.</param>
/// <param name="Supply">Supply pin node.</param>
/// <param name="Ground">Ground pin node.</param>
/// <param name="Trigger">Trigger pin node.</param>
/// <param name="Threshold">Threshold pin node (the timing node of a one-shot).</param>
/// <param name="Discharge">Discharge pin node.</param>
/// <param name="Output">Output pin node.</param>
/// <param name="Family">Bipolar or CMOS.</param>
/// <param name="TriggerFraction">Trigger level as a fraction of the supply (1/3 with the internal divider).</param>
/// <param name="ThresholdFraction">Threshold level as a fraction of the supply (2/3 with the internal divider).</param>
public sealed record OneShotTimerRole(
    string PartId,
    string Supply,
    string Ground,
    string Trigger,
    string Threshold,
    string Discharge,
    string Output,
    TimerFamily Family,
    double TriggerFraction = 1.0 / 3.0,
    double ThresholdFraction = 2.0 / 3.0) : PartRole(PartId)
{
    public override string Title => "one-shot timer";
}
