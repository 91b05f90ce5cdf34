namespace NightSim.Sky.Events;

/// <summary>A concrete event as listed in reports: drawn from the seed before the run.</summary>
/// <param name="Kind">JSON kind.</param>
/// <param name="Start">Local start time with offset.</param>
/// <param name="End">Local end time with offset.</param>
/// <param name="StartSeconds">Run time of the start, seconds.</param>
/// <param name="EndSeconds">Run time of the end, seconds.</param>
/// <param name="PeakLux">Peak lux at the sensor (0 for events that scale the sky or are not light).</param>
/// <param name="Channel">Channel name, node or part the event acts on.</param>
/// <param name="Description">Readable summary.</param>
/// <param name="DrawnFromSeed">True when its time was drawn from the seed; false when the scenario gave it.</param>
public sealed record ScheduledLightEvent(string Kind, DateTimeOffset Start, DateTimeOffset End, double StartSeconds,
    double EndSeconds, double PeakLux, string Channel, string Description, bool DrawnFromSeed = true);
