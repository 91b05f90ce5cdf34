using NightSim.Devices;
using NightSim.Results;

namespace NightSim.Transient;

/// <summary>The solver's <see cref="EventSink"/>: collects discrete events and forwards breakpoint requests. Events are
/// kept as values in a list made up front, so firing an event allocates nothing; <see cref="ToResult"/> makes the
/// <see cref="DiscreteEvent"/> records once the run is over.</summary>
internal sealed class EventLog : EventSink
{
    /// <summary>Events the log holds before its list has to grow.</summary>
    public const int InitialCapacity = 1024;

    private readonly BreakpointQueue _breakpoints;

    public EventLog(BreakpointQueue breakpoints) => _breakpoints = breakpoints;

    /// <summary>Time of the event being fired, seconds.</summary>
    public double Time { get; set; }

    public List<LoggedEvent> Events { get; } = new(InitialCapacity);

    public override void Record(Device device, string signal, string from, string to, DeviceEventKind kind) =>
        Events.Add(new LoggedEvent(Time, device.Name, device.PartId, signal, from, to, kind));

    public override void RequestBreakpoint(double time)
    {
        if (time > Time) _breakpoints.Add(time);
    }

    /// <summary>The events as the result's records.</summary>
    public List<DiscreteEvent> ToResult()
    {
        var list = new List<DiscreteEvent>(Events.Count);
        foreach (LoggedEvent e in Events) list.Add(new DiscreteEvent(e.Time, e.Device, e.PartId, e.Signal, e.From, e.To, e.Kind));
        return list;
    }
}
