using NightSim.Devices;
using NightSim.Results;

namespace NightSim.Transient;

/// <summary>The solver's <see cref="EventSink"/>: collects discrete events and forwards breakpoint requests.</summary>
internal sealed class EventLog : EventSink
{
    private readonly BreakpointQueue _breakpoints;

    public EventLog(BreakpointQueue breakpoints) => _breakpoints = breakpoints;

    /// <summary>Time of the event being fired, seconds.</summary>
    public double Time { get; set; }

    public List<DiscreteEvent> Events { get; } = [];

    public override void Record(Device device, string signal, string from, string to, DeviceEventKind kind) =>
        Events.Add(new DiscreteEvent(Time, device.Name, device.PartId, signal, from, to, kind));

    public override void RequestBreakpoint(double time)
    {
        if (time > Time) _breakpoints.Add(time);
    }
}
