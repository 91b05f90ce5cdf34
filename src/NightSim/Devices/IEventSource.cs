namespace NightSim.Devices;

/// <summary>
/// A device with discrete state that switches when a continuous quantity crosses a threshold (comparator, latch,
/// relay, timed transitions). Each event function is continuous in x and t between events; a sign change between two
/// accepted points is an event. Hysteresis is a state-dependent threshold: after <see cref="OnEvent"/> the function
/// must have the sign the new state expects, so it does not fire again at once.
/// </summary>
public interface IEventSource
{
    /// <summary>Number of event functions (fixed for the run).</summary>
    int EventCount { get; }

    /// <summary>Value of event function <paramref name="index"/> at the iterate and time in <paramref name="ctx"/>.
    /// Must not change state. Reads ctx.X, ctx.Time and ctx.Lux only.</summary>
    double EventValue(int index, LoadContext ctx);

    /// <summary>Event function <paramref name="index"/> changed sign at ctx.Time: change the discrete state, record
    /// the change through <paramref name="events"/>, and request breakpoints for any scheduled follow-up (output
    /// transitions, operate delays).</summary>
    void OnEvent(int index, LoadContext ctx, EventSink events);
}
