using System.Globalization;

namespace NightSim.Sky.Events;

/// <summary>
/// A passing cloud: scales the sky (Sun, night floor, Moon) by 1 − depth·sin²(π·(t − start)/length) during its pass,
/// a smooth dip with no breakpoint needed inside it.
/// </summary>
public sealed class CloudPass : ILightEvent
{
    /// <param name="start">Run time, seconds.</param>
    /// <param name="length">Seconds.</param>
    /// <param name="depth">Deepest fraction of sky light removed, 0…1.</param>
    public CloudPass(double start, double length, double depth)
    {
        if (!(length > 0) || depth < 0 || depth > 1) throw new ArgumentException("need length > 0 and depth in 0…1");
        Start = start; End = start + length; Depth = depth;
    }

    public string Kind => "clouds";
    public string Channel => "*";
    public double Start { get; }
    public double End { get; }
    public double Depth { get; }
    public double PeakLux => 0.0;
    public LightEffect Effect => LightEffect.ScaleSky;
    public string Description => string.Create(CultureInfo.InvariantCulture,
        $"passing cloud for {(End - Start) / 60:F1} min, sky down to {(1 - Depth) * 100:F0} %");

    public double Value(double time)
    {
        if (time <= Start || time >= End) return 1.0;
        double s = Math.Sin(Math.PI * (time - Start) / (End - Start));
        return 1.0 - Depth * s * s;
    }

    /// <summary>Start, darkest moment and end: between two of them the cloud's factor is monotone.</summary>
    public void AddBreakpoints(List<double> into) { into.Add(Start); into.Add(0.5 * (Start + End)); into.Add(End); }
}

/// <summary>
/// Seeded passing clouds from the scenario's weather: Poisson arrivals at "perHour" over the whole window, each
/// lasting "minutes" × U(0.5, 1.5) with depth × U(0.5, 1).
/// </summary>
/// <param name="PerHour">Mean clouds per hour.</param>
/// <param name="Depth">Largest fraction of sky light removed, 0…1.</param>
/// <param name="Minutes">Mean pass length, minutes.</param>
public sealed record CloudDefinition(double PerHour, double Depth, double Minutes) : IEventDefinition
{
    public string Kind => "clouds";
    public string? Channel => null;

    public void Generate(ScenarioTimeline timeline, DeterministicRandom random, EventSink sink)
    {
        foreach (double t in random.PoissonTimes(0.0, timeline.Duration, PerHour / 3600.0))
        {
            double length = Minutes * 60.0 * random.Uniform(0.5, 1.5);
            double depth = Depth * random.Uniform(0.5, 1.0);
            sink.LightEvents.Add(new CloudPass(t, length, depth));
        }
    }
}
