namespace NightSim.Results;

/// <summary>One discrete state change located during a run.</summary>
/// <param name="Time">Run time, seconds since the run origin.</param>
/// <param name="Device">Device name ("U1.latch", "K1").</param>
/// <param name="PartId">Netlist part id the device belongs to ("U1").</param>
/// <param name="Signal">What changed ("output", "contact", "coil").</param>
/// <param name="From">Old state in plain words.</param>
/// <param name="To">New state in plain words.</param>
/// <param name="Kind">What the change means to the analysis (trigger fired, relay operated, …).</param>
public sealed record DiscreteEvent(double Time, string Device, string PartId, string Signal, string From, string To,
    DeviceEventKind Kind = DeviceEventKind.Other);
