using NightSim.Analysis;
using NightSim.Devices;
using NightSim.Devices.Light;
using NightSim.Devices.Roles;
using NightSim.Netlist;
using NightSim.Results;
using NightSim.Sky;
using NightSim.Sky.Events;

namespace NightSim.Runs;

/// <summary>Reads a finished simulation, its scenario and its netlist into the <see cref="RunFacts"/> the analysers use.</summary>
public static class RunFactsBuilder
{
    /// <summary>Clock origin of a plain transient (no scenario): run time is shown as time of day from midnight UTC.</summary>
    public static readonly DateTimeOffset PlainOrigin = new(2000, 1, 1, 0, 0, 0, TimeSpan.Zero);

    /// <param name="supply">The mains-fed supply watched through the run, or null (an ideal rail).</param>
    public static RunFacts Build(NightRunRequest request, LightProfile? profile, IReadOnlyList<Device> devices, SimulationResult sim, double stop,
        Supply.SupplyWatch? supply = null)
    {
        // The light sensor the circuit switches on: the first one (its channel, not always "sensor").
        LightSensorRole? sensor = devices.Select(d => d.Role).OfType<LightSensorRole>().FirstOrDefault();
        string channelName = sensor?.Channel ?? LightScenario.DefaultChannel;
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
            Timers = TimingNetwork.Extract(devices, node => TimingNetwork.FixedVoltage(devices, node) ?? MeasuredSupply(sim, node)),
            Relays = devices.Select(d => d.Role).OfType<RelayCoilRole>()
                .Select(r => new RelayFacts(r.PartId, r.PullIn, r.DropOut, (from, to) => PeakCoilVoltage(sim, r, from, to))).ToList(),
            Contacts = ContactFactsBuilder.Build(devices),
            Sensor = sensor is null ? null : new SensorFacts(sensor.PartId, profile is null ? null : SwitchingLevel.Find(request.Netlist, request.Options)),
            SkyLux = lux,
            SensorLux = lux,
            LampCouplingLux = profile?.LampCouplings.Sum(c => c.Lux) ?? 0,
            AttributionLag = LagAt(0),
            AttributionLagAt = LagAt,
            Supply = supply?.Facts(supply.RailFrom(sim)),
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
            if (e.Kind is not (DeviceEventKind.LoadOn or DeviceEventKind.LoadOff)) continue;
            ISwitchedLoad? load = byName.GetValueOrDefault(e.Device) as ISwitchedLoad;
            list.Add(new LoadTransition(e.Time, e.Kind == DeviceEventKind.LoadOn, load?.LoadName ?? e.Device, load?.LoadPower ?? 0, e.PartId));
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
            if (e.Kind is DeviceEventKind.CoilPulledIn or DeviceEventKind.CoilReleased)
                list.Add(new LoadTransition(e.Time, e.Kind == DeviceEventKind.CoilPulledIn, e.PartId, 0, e.PartId));
        }
        return list;
    }

    /// <summary>Highest coil voltage that counts against pull-in within [from, to] (run seconds), V: the largest coil
    /// current recorded in the window times the coil resistance (the armature follows the current, so the L/R rise
    /// and a sagging drive are both in it; each trace bucket keeps its true minimum and maximum, so no peak is lost).
    /// NaN when the coil current is not recorded or nothing falls in the window.</summary>
    public static double PeakCoilVoltage(SimulationResult sim, RelayCoilRole coil, double from, double to)
    {
        if (sim.Trace(coil.CoilCurrent) is not Trace current) return double.NaN;
        double peak = double.NaN;
        for (int i = 0; i < current.Times.Count; i++)
        {
            double t = current.Times[i];
            if (t < from || t > to) continue;
            double v = Math.Abs(current.Values[i]) * coil.CoilResistance;
            if (double.IsNaN(peak) || v > peak) peak = v;
        }
        return peak;
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
