using NightSim.Sky;
using NightSim.Sky.Events;

namespace NightSim.Studies;

/// <summary>
/// The busy night's extra events, made in code rather than read from a file: <see cref="HeadlightCount"/> headlight
/// passes spread evenly from 17:30 to 02:00, one lightning storm of exactly <see cref="FlashCount"/> flashes at
/// 21:00 (one every 30 s), and a small voltage pulse on the timer's trigger node once a minute through the whole run
/// window. The pulses are too small to fire the timer; they exist to make the solver land on and recover from
/// thousands of edges. Deterministic: draws nothing from the random stream.
/// </summary>
public sealed class BusyNightEvents : IEventDefinition
{
    /// <summary>Headlight passes per night.</summary>
    public const int HeadlightCount = 30;

    /// <summary>Lightning flashes per night.</summary>
    public const int FlashCount = 20;

    /// <summary>Noise pulse amplitude at the trigger node, volts (a tenth of a 12 V supply's trigger margin).</summary>
    public const double NoiseAmplitude = 0.4;

    /// <summary>Noise pulse width, seconds.</summary>
    public const double NoiseWidth = 2e-6;

    /// <param name="triggerNode">The node that receives the noise pulses (the timer's trigger pin).</param>
    public BusyNightEvents(string triggerNode)
    {
        TriggerNode = triggerNode;
    }

    public string Kind => "busy-night";
    public string? Channel => LightScenario.DefaultChannel;
    public string TriggerNode { get; }

    public void Generate(ScenarioTimeline timeline, DeterministicRandom random, EventSink sink)
    {
        for (int night = 0; night < timeline.Nights; night++)
        {
            double from = timeline.ClockTime(night, new TimeSpan(17, 30, 0));
            double to = timeline.ClockTime(night, new TimeSpan(2, 0, 0));
            for (int k = 0; k < HeadlightCount; k++)
            {
                double start = from + (to - from) * k / (HeadlightCount - 1);
                sink.LightEvents.Add(new HeadlightPass(start, 3.0, 0.5, 0.5, 8.0 + 2.0 * (k % 5), LightScenario.DefaultChannel));
            }

            double storm = timeline.ClockTime(night, new TimeSpan(21, 0, 0));
            for (int f = 0; f < FlashCount; f++)
            {
                double t = storm + 30.0 * f;
                var strokes = new List<LightningStroke>();
                for (int s = 0; s < 3 + f % 3; s++) strokes.Add(new LightningStroke(t + 0.06 * s, 200.0 + 50.0 * ((f + s) % 4)));
                sink.LightEvents.Add(new LightningFlash(strokes, LightScenario.DefaultChannel));
            }

            var (nightStart, nightEnd) = timeline.NightSpan(night);
            for (double t = nightStart + 30.0; t < nightEnd; t += 60.0)
                sink.NoiseInjections.Add(new NoiseInjection(TriggerNode, t, timeline.Instant(t), NoiseAmplitude, NoiseWidth, NoiseQuantity.Voltage));
        }
    }
}
