using NightSim.Results;

namespace NightSim.Devices;

/// <summary>Where devices report discrete state changes and ask for follow-up breakpoints during an event.</summary>
public abstract class EventSink
{
    /// <summary>Record a state change of <paramref name="device"/> at the current event time.</summary>
    /// <param name="signal">What changed, e.g. "output", "contact", "latch".</param>
    /// <param name="from">Old state in plain words ("low", "open").</param>
    /// <param name="to">New state ("high", "closed").</param>
    public void Record(Device device, string signal, string from, string to) => Record(device, signal, from, to, DeviceEventKind.Other);

    /// <summary>Record a state change and what it means to the analysis.</summary>
    public abstract void Record(Device device, string signal, string from, string to, DeviceEventKind kind);

    /// <summary>Ask the solver to land exactly on <paramref name="time"/> (seconds), e.g. the end of an output ramp.</summary>
    public abstract void RequestBreakpoint(double time);
}
