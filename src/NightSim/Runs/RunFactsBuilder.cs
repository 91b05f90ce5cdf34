using NightSim.Analysis;
using NightSim.Devices;
using NightSim.Devices.Light;
using NightSim.Netlist;
using NightSim.Reporting;
using NightSim.Results;
using NightSim.Sky;
using NightSim.Sky.Events;

namespace NightSim.Runs;

/// <summary>Reads a finished simulation, its scenario and its netlist into the <see cref="RunFacts"/> the analysers use.</summary>
public static class RunFactsBuilder
{
    /// <summary>Clock origin of a plain transient (no scenario): run time is shown as time of day from midnight UTC.</summary>
    public static readonly DateTimeOffset PlainOrigin = new(2000, 1, 1, 0, 0, 0, TimeSpan.Zero);

    public static RunFacts Build(NightRunRequest request, LightProfile? profile, IReadOnlyList<Device> devices, SimulationResult sim, double stop)
    {
        NetlistDefinition net = request.Netlist;
        // The channel the circuit's light sensor reads (the first sensor part's), not always "sensor".
        string channelName = net.Parts.FirstOrDefault(p => p.Kind is "photoresistor" or "phototransistor" or "photodiode")
            ?.Parameters.Text("channel", LightScenario.DefaultChannel) ?? LightScenario.DefaultChannel;
        int channel = profile is null ? -1 : Math.Max(0, profile.ChannelIndex(channelName));
        Func<double, double>? lux = profile is null ? null : t => profile.Lux(channel, t);

        var nights = new List<NightWindow>();
        if (profile is not null)
        {
            for (int k = 0; k < profile.Timeline.Nights; k++)
            {
                (double from, double to) = profile.Timeline.NightSpan(k);
                SolarEvents s = profile.SolarEvents[k];
                nights.Add(new NightWindow(s.Date, from, to, s.Sunset, s.CivilDusk, s.CivilDawn, s.Sunrise));
            }
        }

        // A switch-on is blamed on a darkening edge up to five of the sensor's fall time constants after it, at the
        // light level after the edge (a slow cell in the dark can take minutes to see the new dusk), and never less
        // than 30 s (the trigger network).
        var sensors = devices.OfType<ILightSensor>().ToList();
        double LagAt(double t)
        {
            double slowest = 0;
            foreach (ILightSensor s in sensors)
                slowest = Math.Max(slowest, s.FallTimeConstant((lux?.Invoke(t) ?? 0) * s.Light.Gain));
            return Math.Max(30.0, 5 * slowest);
        }
        return new RunFacts
        {
            Origin = profile?.Origin ?? PlainOrigin,
            TimeZone = profile?.Scenario.Site.TimeZone ?? TimeZoneInfo.Utc,
            Duration = sim.Succeeded ? stop : sim.StopTime,
            Nights = nights,
            LoadTransitions = LoadTransitions(devices, sim),
            HasSwitchedLoad = devices.OfType<ISwitchedLoad>().Any(),
            Events = profile is null ? [] : Events(profile),
            DeviceEvents = sim.Events,
            Timers = TimerFactsExtractor.Extract(net, node => TimerFactsExtractor.DcSupply(net, node) ?? MeasuredSupply(sim, node)),
            SkyLux = lux,
            SensorLux = lux,
            LampCouplingLux = profile?.LampCouplings.Sum(c => c.Lux) ?? 0,
            AttributionLag = LagAt(0),
            AttributionLagAt = LagAt,
        };
    }

    /// <summary>Load on/off transitions: named loads first; a design without a named load falls back to its relays'
    /// coil (pulled in = on).</summary>
    public static IReadOnlyList<LoadTransition> LoadTransitions(IReadOnlyList<Device> devices, SimulationResult sim)
    {
        var byName = devices.ToDictionary(d => d.Name, StringComparer.Ordinal);
        var list = new List<LoadTransition>();
        foreach (DiscreteEvent e in sim.Events)
        {
            if (!e.Signal.StartsWith("load ", StringComparison.Ordinal)) continue;
            double power = byName.TryGetValue(e.Device, out Device? d) && d is ISwitchedLoad l ? l.LoadPower : 0;
            list.Add(new LoadTransition(e.Time, e.To == "on", e.Signal[5..], power, e.PartId));
        }
        // One load is analysed: the first named one (a design with several lamps would need one timeline each).
        if (list.Count > 0)
        {
            (string part, string load) = (list[0].PartId, list[0].Load);
            return list.Where(t => t.PartId == part && t.Load == load).ToList();
        }
        if (devices.OfType<ISwitchedLoad>().Any(l => l.LoadName is not null)) return list;
        foreach (DiscreteEvent e in sim.Events)
        {
            if (e.Signal == "coil") list.Add(new LoadTransition(e.Time, e.To == "pulled in", e.Device, 0, e.PartId));
        }
        return list;
    }

    /// <summary>The scenario's events as causes. A dusk trigger fires on a darkening edge: for a steady light that is
    /// its switch-off, for a short flash or a passing car its whole window.</summary>
    public static IReadOnlyList<EventFact> Events(LightProfile profile)
    {
        var list = new List<EventFact>();
        foreach (ScheduledLightEvent e in profile.ScheduledEvents)
        {
            LoadCause? cause = e.Kind switch
            {
                "headlights" => LoadCause.Headlight,
                "lightning" => LoadCause.Lightning,
                "steady-light" => LoadCause.SteadyLight,
                _ => null,
            };
            if (cause is null) continue;
            double start = cause == LoadCause.SteadyLight ? e.EndSeconds - 1.0 : e.StartSeconds;
            list.Add(new EventFact(cause.Value, e.Kind, start, e.EndSeconds, e.PeakLux, e.Description));
        }
        foreach (NoiseInjection n in profile.NoiseInjections)
        {
            list.Add(new EventFact(LoadCause.Noise, "noise", n.Time, n.Time + n.Width, n.Amplitude, n.Description));
        }
        return list;
    }

    /// <summary>Mean of a node's trace over the second half of the run (a supply without a DC source), or null.</summary>
    private static double? MeasuredSupply(SimulationResult sim, string node)
    {
        Trace? t = sim.Trace(node);
        if (t is null || t.Values.Count == 0) return null;
        double half = sim.StopTime / 2, sum = 0;
        int n = 0;
        for (int i = 0; i < t.Times.Count; i++)
        {
            if (t.Times[i] < half) continue;
            sum += t.Values[i];
            n++;
        }
        return n > 0 ? sum / n : null;
    }
}
