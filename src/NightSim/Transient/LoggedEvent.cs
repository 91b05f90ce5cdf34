using NightSim.Results;

namespace NightSim.Transient;

/// <summary>One discrete event as the solver logs it (the fields of <see cref="DiscreteEvent"/>, as a value).</summary>
internal readonly record struct LoggedEvent(double Time, string Device, string PartId, string Signal, string From, string To,
    DeviceEventKind Kind);
