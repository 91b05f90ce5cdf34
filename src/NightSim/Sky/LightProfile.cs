using NightSim.Sky.Events;

namespace NightSim.Sky;

/// <summary>
/// The illuminance the circuit's light sensors see, composed from a <see cref="LightScenario"/> over its nights:
/// sky (Sun through the USNO Circular 171 model with the weather's sky factor, night floor and Moon, scaled by
/// passing clouds and by each channel's exposure) + light floor + events (headlights, lightning strokes, steady
/// lights) + optional recorded log (replace or add, linear between samples). Every random draw is made when the
/// profile is created, from the scenario seed. Run time 0 is local noon of the start date.
/// </summary>
public sealed class LightProfile : ILightSignal
{
    private const double SunGridSeconds = 30.0;
    /// <summary>Events longer than this go to the linear list instead of the index (steady lights).</summary>
    private const double LongEventSeconds = 600.0;

    private readonly double[] _elevation;
    private readonly double[] _logSunLux;
    private readonly bool[] _exactInterval;
    private readonly double[]? _moonLux;
    private readonly double _gridStep;
    private readonly double _skyFactor;
    private readonly double _nightLux;
    private readonly double _floorLux;
    private readonly double[] _exposure;
    private readonly string[] _channelNames;
    private readonly LightEventIndex _shortEvents;
    private readonly LightEventIndex _clouds;
    private readonly ILightEvent[] _longEvents;
    private readonly int[] _longChannels;
    private readonly double[] _logTimes;
    private readonly double[] _logLux;
    private readonly bool _logReplace;
    private readonly bool _logAtSensor;
    private readonly double[] _breakpoints;
    /// <summary>Per channel: running total of |Δ ln lux| of the sky part (Sun, Moon, night floor, light floor) over the
    /// sun grid, from run time 0; the light-aware step limit reads it.</summary>
    private readonly double[][] _skyVariation;

    private LightProfile(LightScenario scenario)
    {
        Scenario = scenario;
        Timeline = scenario.Timeline();
        Site site = scenario.Site;
        Duration = Timeline.Duration;

        // Sun elevation on a 30 s grid; Lux interpolates it linearly (curvature error below 5e-5°).
        int n = Math.Max(1, (int)Math.Ceiling(Duration / SunGridSeconds));
        _gridStep = Duration / n;
        double jd0 = SunPosition.JulianDay(Timeline.Origin);
        // Shared with every profile of the same site and window (the runs of a study): computed once.
        SkyGrid grid = SkyGrid.For(jd0, _gridStep, n + 1, site.Latitude, site.Longitude);
        _elevation = grid.SunElevation;

        Weather w = scenario.Weather;
        _skyFactor = w.SkyFactor;
        // ln of the model's Sun term on the same grid: Lux interpolates it (relative error ≪ 1e-4 over 30 s); the
        // intervals touching the band that joins the day and twilight branches (curved over a third of a degree) are
        // evaluated exactly.
        _logSunLux = new double[n + 1];
        _exactInterval = new bool[n];
        for (int i = 0; i <= n; i++) _logSunLux[i] = Math.Log(Math.Max(IlluminanceModel.SunLux(_elevation[i], _skyFactor), 1e-300));
        for (int i = 0; i < n; i++)
        {
            double lo = Math.Min(_elevation[i], _elevation[i + 1]), hi = Math.Max(_elevation[i], _elevation[i + 1]);
            _exactInterval[i] = hi >= IlluminanceModel.BlendLowElevation && lo <= IlluminanceModel.BlendHighElevation;
        }
        _nightLux = (IlluminanceModel.ClearNightFloorLux + w.MoonLux) / w.SkyFactor;
        if (w.ModeledMoon)
        {
            // Moonlight on the same grid (USNO Circular 171 moonlight formula, Moon from MoonPosition), linear between points.
            _moonLux = new double[n + 1];
            double[] altitude = grid.MoonAltitude, elongation = grid.MoonElongation;
            for (int i = 0; i <= n; i++) _moonLux[i] = IlluminanceModel.MoonLux(altitude[i], elongation[i], w.SkyFactor);
        }
        _floorLux = w.FloorLux;
        _channelNames = [.. scenario.Channels.Select(c => c.Name)];
        _exposure = [.. scenario.Channels.Select(c => c.Exposure)];
        _skyVariation = new double[_exposure.Length][];
        for (int c = 0; c < _exposure.Length; c++)
        {
            var v = new double[n + 1];
            double previous = Math.Log(Math.Max(GridSkyLux(0) * _exposure[c] + _floorLux, 1e-9));
            for (int i = 1; i <= n; i++)
            {
                double current = Math.Log(Math.Max(GridSkyLux(i) * _exposure[c] + _floorLux, 1e-9));
                double increment = Math.Abs(current - previous);
                if (_exactInterval[i - 1])
                {
                    // The joining band is curved within the interval: sum the change over sub-samples of the exact
                    // curve and count it half again, so that a step inside the band keeps to the bound.
                    const int parts = 16;
                    double sum = 0.0, last = previous;
                    for (int k = 1; k <= parts; k++)
                    {
                        double here = Math.Log(Math.Max(SkyLuxBetween(i - 1, (double)k / parts) * _exposure[c] + _floorLux, 1e-9));
                        sum += Math.Abs(here - last);
                        last = here;
                    }
                    increment = 1.5 * Math.Max(sum, increment);
                }
                v[i] = v[i - 1] + increment;
                previous = current;
            }
            _skyVariation[c] = v;
        }

        // Draw every random event now: one stream per definition, named kind#ordinal.
        var sink = new EventSink();
        var given = _given;
        var ordinals = new Dictionary<string, int>(StringComparer.Ordinal);
        var definitions = new List<IEventDefinition>(scenario.Events);
        if (w.Clouds is not null) definitions.Add(w.Clouds);
        foreach (IEventDefinition def in definitions)
        {
            int k = ordinals.GetValueOrDefault(def.Kind);
            ordinals[def.Kind] = k + 1;
            int lights = sink.LightEvents.Count, pulses = sink.NoiseInjections.Count;
            def.Generate(Timeline, DeterministicRandom.ForStream(scenario.Seed, LightEventCatalog.StreamName(def.Kind, k)), sink);
            if (!def.DrawnFromSeed)
            {
                for (int i = lights; i < sink.LightEvents.Count; i++) given.Add(sink.LightEvents[i]);
                for (int i = pulses; i < sink.NoiseInjections.Count; i++) given.Add(sink.NoiseInjections[i]);
            }
        }
        LightEvents = [.. sink.LightEvents.OrderBy(e => e.Start).ThenBy(e => e.Kind, StringComparer.Ordinal)];
        LampCouplings = sink.LampCouplings;
        NoiseInjections = [.. sink.NoiseInjections.OrderBy(p => p.Time)];

        int ChannelOf(ILightEvent e) => e.Effect == LightEffect.ScaleSky ? -1 : Array.IndexOf(_channelNames, e.Channel);
        _clouds = new LightEventIndex(LightEvents.Where(e => e.Effect == LightEffect.ScaleSky), ChannelOf);
        var adds = LightEvents.Where(e => e.Effect == LightEffect.AddLux).ToList();
        _shortEvents = new LightEventIndex(adds.Where(e => e.End - e.Start <= LongEventSeconds), ChannelOf);
        _longEvents = [.. adds.Where(e => e.End - e.Start > LongEventSeconds)];
        _longChannels = [.. _longEvents.Select(ChannelOf)];

        // Recorded log in run time.
        if (scenario.LightLog is RecordedLightLog log)
        {
            _logTimes = [.. log.Times.Select(Timeline.RunTime)];
            _logLux = [.. log.LuxValues];
        }
        else
        {
            _logTimes = [];
            _logLux = [];
        }
        _logReplace = scenario.LightLogMode == LightLogMode.Replace;
        _logAtSensor = scenario.LightLogAtSensor;

        // Breakpoints: event edges, log samples, noise pulses (the sky itself is continuous).
        var bp = new List<double>();
        foreach (ILightEvent e in LightEvents) e.AddBreakpoints(bp);
        bp.AddRange(_logTimes);
        foreach (NoiseInjection p in NoiseInjections) { bp.Add(p.Time); bp.Add(p.Time + p.Width); }
        bp.Sort();
        var unique = new List<double>(bp.Count);
        foreach (double t in bp) if (double.IsFinite(t) && (unique.Count == 0 || t > unique[^1])) unique.Add(t);
        _breakpoints = [.. unique];

        var scheduled = new List<ScheduledLightEvent>();
        foreach (ILightEvent e in LightEvents)
            scheduled.Add(new ScheduledLightEvent(e.Kind, Timeline.Instant(e.Start), Timeline.Instant(e.End), e.Start, e.End, e.PeakLux, e.Channel, e.Description, !given.Contains(e)));
        foreach (NoiseInjection p in NoiseInjections)
            scheduled.Add(new ScheduledLightEvent("noise", p.Instant, Timeline.Instant(p.Time + p.Width), p.Time, p.Time + p.Width, 0.0, p.Node, p.Description, !given.Contains(p)));
        ScheduledEvents = [.. scheduled.OrderBy(s => s.StartSeconds).ThenBy(s => s.Kind, StringComparer.Ordinal)];

        SolarEvents = [.. Enumerable.Range(0, scenario.Nights).Select(k => Twilight.ForNight(site, scenario.Start.AddDays(k)))];
    }

    private double GridSkyLux(int i) => Math.Exp(_logSunLux[i]) + (_moonLux?[i] ?? 0.0) + _nightLux;

    /// <summary>Open-sky lux (no clouds) a fraction <paramref name="f"/> into grid interval <paramref name="i"/>, with the
    /// Sun term from the exact model.</summary>
    private double SkyLuxBetween(int i, double f)
    {
        double sun = IlluminanceModel.SunLux(_elevation[i] + f * (_elevation[i + 1] - _elevation[i]), _skyFactor);
        double moon = _moonLux is null ? 0.0 : _moonLux[i] + f * (_moonLux[i + 1] - _moonLux[i]);
        return sun + moon + _nightLux;
    }

    /// <inheritdoc />
    /// <remarks>From the running total of |Δ ln lux| of the sky on the sun grid (linear within a grid interval): the step
    /// ends where that total has grown by <paramref name="change"/> on the channel that changes fastest. Event edges,
    /// and log samples are breakpoints and are landed on separately; the band joining the day and twilight branches is
    /// counted from sub-samples of the exact curve.</remarks>
    public double StepLimit(double time, double change)
    {
        if (!(time >= 0) || time >= Duration) return double.PositiveInfinity;
        double limit = double.PositiveInfinity;
        foreach (double[] v in _skyVariation)
        {
            double target = Variation(v, time) + change;
            if (target >= v[^1]) continue;
            // First grid point at or beyond the target, then linear within the interval before it.
            int lo = 0, hi = v.Length - 1;
            while (lo < hi)
            {
                int mid = (lo + hi) >>> 1;
                if (v[mid] < target) lo = mid + 1; else hi = mid;
            }
            int k = Math.Max(lo, 1);
            double span = v[k] - v[k - 1];
            double at = (k - 1 + (span > 0 ? (target - v[k - 1]) / span : 1.0)) * _gridStep;
            limit = Math.Min(limit, Math.Max(at - time, 0.0));
        }
        return limit;
    }

    private double Variation(double[] v, double time)
    {
        double x = time / _gridStep;
        int i = Math.Min((int)x, v.Length - 2);
        return v[i] + (x - i) * (v[i + 1] - v[i]);
    }

    /// <summary>Builds the profile (all random draws happen here).</summary>
    public static LightProfile Create(LightScenario scenario)
    {
        ArgumentNullException.ThrowIfNull(scenario);
        return new LightProfile(scenario);
    }

    public LightScenario Scenario { get; }
    public ScenarioTimeline Timeline { get; }
    /// <inheritdoc />
    public DateTimeOffset Origin => Timeline.Origin;
    /// <summary>Window length, seconds (23 h or 25 h nights included).</summary>
    public double Duration { get; }
    /// <summary>Seed every draw came from.</summary>
    public ulong Seed => Scenario.Seed;
    /// <summary>Channel names in index order ("sensor" first).</summary>
    public IReadOnlyList<string> ChannelNames => _channelNames;
    /// <summary>Concrete light events (sorted by start).</summary>
    public IReadOnlyList<ILightEvent> LightEvents { get; }
    /// <summary>Everything drawn for the run, for reports: light events and noise pulses, by start.</summary>
    public IReadOnlyList<ScheduledLightEvent> ScheduledEvents { get; }

    // Light events and noise pulses at times the scenario gives (the rest were drawn from the seed).
    private readonly HashSet<object> _given = new(ReferenceEqualityComparer.Instance);

    /// <summary>True when this noise pulse's time was drawn from the seed; false when the scenario gave it.</summary>
    public bool IsDrawnFromSeed(NoiseInjection pulse) => !_given.Contains(pulse);
    /// <summary>Lamp self-illumination couplings, for the circuit run to apply.</summary>
    public IReadOnlyList<LampCoupling> LampCouplings { get; }
    /// <summary>Noise pulses with concrete times, for the circuit run to apply.</summary>
    public IReadOnlyList<NoiseInjection> NoiseInjections { get; }
    /// <summary>Sun events of each night.</summary>
    public IReadOnlyList<SolarEvents> SolarEvents { get; }
    /// <summary>All breakpoints, increasing, seconds.</summary>
    public IReadOnlyList<double> Breakpoints => _breakpoints;

    /// <inheritdoc />
    public int ChannelIndex(string name) => Array.IndexOf(_channelNames, name);

    /// <summary>Geometric solar elevation at run time <paramref name="time"/>, degrees.</summary>
    public double SunElevation(double time)
    {
        if (time < 0 || time > Duration)
            return SunPosition.Elevation(SunPosition.JulianDay(Timeline.Origin) + time / 86400.0, Scenario.Site.Latitude, Scenario.Site.Longitude);
        double x = time / _gridStep;
        int i = Math.Min((int)x, _elevation.Length - 2);
        double f = x - i;
        return _elevation[i] + f * (_elevation[i + 1] - _elevation[i]);
    }

    /// <summary>Open-sky illuminance from the synthetic sky at <paramref name="time"/> (Sun, night floor, Moon, weather, clouds), lux.</summary>
    public double SkyLux(double time)
    {
        double sun;
        if (time < 0 || time > Duration) sun = IlluminanceModel.SunLux(SunElevation(time), _skyFactor);
        else
        {
            double x = time / _gridStep;
            int i = Math.Min((int)x, _elevation.Length - 2);
            double f = x - i;
            sun = _exactInterval[i]
                ? IlluminanceModel.SunLux(_elevation[i] + f * (_elevation[i + 1] - _elevation[i]), _skyFactor)
                : Math.Exp(_logSunLux[i] + f * (_logSunLux[i + 1] - _logSunLux[i]));
        }
        double moon = 0.0;
        if (_moonLux is not null)
        {
            double x = Math.Clamp(time, 0.0, Duration) / _gridStep;
            int i = Math.Min((int)x, _moonLux.Length - 2);
            moon = _moonLux[i] + (x - i) * (_moonLux[i + 1] - _moonLux[i]);
        }
        double clouds = _clouds.Count == 0 ? 1.0 : _clouds.Product(time);
        return (sun + moon + _nightLux) * clouds;
    }

    /// <inheritdoc />
    public double Lux(int channel, double time)
    {
        if ((uint)channel >= (uint)_exposure.Length) throw new ArgumentOutOfRangeException(nameof(channel));
        double open = SkyLux(time);
        double atSensor = _floorLux;
        if (_logTimes.Length > 0 && time >= _logTimes[0] && time <= _logTimes[^1])
        {
            double v = LogValue(time);
            if (_logReplace) open = 0.0;
            if (_logAtSensor) atSensor += v; else open += v;
        }
        double lux = open * _exposure[channel] + atSensor + _shortEvents.Sum(time, channel);
        for (int i = 0; i < _longEvents.Length; i++)
        {
            if (_longChannels[i] == channel) lux += _longEvents[i].Value(time);
        }
        return lux;
    }

    private double LogValue(double time)
    {
        int lo = 0, hi = _logTimes.Length;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (_logTimes[mid] <= time) lo = mid + 1; else hi = mid;
        }
        int i = lo - 1;
        if (i >= _logTimes.Length - 1) return _logLux[^1];
        double f = (time - _logTimes[i]) / (_logTimes[i + 1] - _logTimes[i]);
        return _logLux[i] + f * (_logLux[i + 1] - _logLux[i]);
    }

    /// <inheritdoc />
    public double NextBreakpoint(double time)
    {
        int lo = 0, hi = _breakpoints.Length;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (_breakpoints[mid] <= time) lo = mid + 1; else hi = mid;
        }
        return lo < _breakpoints.Length ? _breakpoints[lo] : double.PositiveInfinity;
    }
}
