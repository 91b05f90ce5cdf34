namespace NightSim.Sky.Events;

/// <summary>How a light event acts on a channel.</summary>
public enum LightEffect
{
    /// <summary><see cref="ILightEvent.Value"/> is lux added at the sensor.</summary>
    AddLux,
    /// <summary><see cref="ILightEvent.Value"/> multiplies the sky illuminance (1 = no change).</summary>
    ScaleSky,
}

/// <summary>One concrete light event in run time (seconds since the profile origin).</summary>
public interface ILightEvent
{
    /// <summary>JSON kind that produced it ("headlights", "lightning", …).</summary>
    string Kind { get; }
    /// <summary>Channel name the event acts on ("sensor" by default; sky-scaling events act on every channel).</summary>
    string Channel { get; }
    /// <summary>First instant with an effect, seconds.</summary>
    double Start { get; }
    /// <summary>Last instant with an effect, seconds.</summary>
    double End { get; }
    /// <summary>Largest lux added at the sensor (for <see cref="LightEffect.ScaleSky"/>: 0).</summary>
    double PeakLux { get; }
    /// <summary>How <see cref="Value"/> is applied.</summary>
    LightEffect Effect { get; }
    /// <summary>Readable summary for reports.</summary>
    string Description { get; }
    /// <summary>Lux added (or sky factor) at run time <paramref name="time"/>; 0 (or 1) outside [Start, End]. Allocation-free.</summary>
    double Value(double time);
    /// <summary>Adds the event's edges (start, peaks, end), seconds.</summary>
    void AddBreakpoints(List<double> into);
}
