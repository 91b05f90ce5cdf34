using NightSim.Results;

namespace NightSim.Analysis;

/// <summary>One night's window and its sky times (site local clock).</summary>
/// <param name="Date">Calendar date of the evening.</param>
/// <param name="From">Run time the night window starts (local noon), seconds.</param>
/// <param name="To">Run time it ends (next local noon), seconds.</param>
public sealed record NightWindow(
    DateOnly Date,
    double From,
    double To,
    DateTimeOffset? Sunset,
    DateTimeOffset? CivilDusk,
    DateTimeOffset? CivilDawn,
    DateTimeOffset? Sunrise);

/// <summary>A switched load going on or off (relay contact into a named load).</summary>
/// <param name="Time">Run time, seconds.</param>
/// <param name="On">True when it switched on.</param>
/// <param name="Load">Load name ("lamp").</param>
/// <param name="PowerWatts">Rated load power, W (0 if unknown).</param>
/// <param name="PartId">Relay part id.</param>
public sealed record LoadTransition(double Time, bool On, string Load, double PowerWatts, string PartId);

/// <summary>A light or noise event of the scenario as the analysis sees it.</summary>
/// <param name="Cause">The cause it stands for (headlight, lightning, steady light, noise, …).</param>
/// <param name="Kind">Scenario kind name.</param>
/// <param name="Start">Run time it starts, seconds.</param>
/// <param name="End">Run time it ends, seconds.</param>
/// <param name="Peak">Peak lux (or amplitude for noise).</param>
/// <param name="Description">Plain words.</param>
/// <param name="Darkening">True when its end makes the sensor darker than before (the edge that can fire a dusk trigger).</param>
public sealed record EventFact(LoadCause Cause, string Kind, double Start, double End, double Peak, string Description, bool Darkening = true);

/// <summary>Static facts about one 555-class one-shot, for the on-time and leakage checks: the charging network the
/// timing node sees, reduced to a source <see cref="ChargeVoltage"/> behind <see cref="Resistance"/> (the network
/// without its drains), plus the drains as a constant current and a resistance across the capacitor.</summary>
/// <param name="PartId">Timer part id.</param>
/// <param name="Resistance">Charging resistance seen by the timing node without the drains (Thevenin), Ω.</param>
/// <param name="Capacitance">Timing capacitance, F.</param>
/// <param name="SupplyVoltage">Timer supply, V (the threshold is 2/3 of it).</param>
/// <param name="DrainCurrent">Constant drain at the timing node (capacitor leakage current + threshold input current), A.</param>
/// <param name="LeakageResistance">Drains that act as a resistance to ground across the capacitor, Ω (∞ if none).</param>
public sealed record TimerFacts(string PartId, double Resistance, double Capacitance, double SupplyVoltage, double DrainCurrent, double LeakageResistance)
{
    /// <summary>Open-circuit voltage of the charging network without drains (Thevenin source), V; the supply for a
    /// plain R from the supply.</summary>
    public double? OpenVoltage { get; init; }

    /// <summary>Catalogue leakage limit of the timing electrolytic(s) (IEC 60384-4), A; NaN when none is an
    /// electrolytic with a rated voltage.</summary>
    public double LeakageLimit { get; init; } = double.NaN;

    /// <summary>Part id of the timing capacitor (the first, when several are in parallel), or null.</summary>
    public string? CapacitorId { get; init; }

    /// <summary>True for a CMOS timer (its input current is already negligible).</summary>
    public bool IsCmos { get; init; }

    /// <summary>The timing capacitor's dump through the discharge transistor when the one-shot ends, or null when the
    /// discharge pin's network is not a linear one.</summary>
    public DischargeFacts? Discharge { get; init; }

    /// <summary>The voltage the capacitor charges toward without drains, V.</summary>
    public double ChargeVoltage => OpenVoltage ?? SupplyVoltage;

    /// <summary>The threshold: 2/3 of the supply, V.</summary>
    public double ThresholdVoltage => 2.0 * SupplyVoltage / 3.0;

    /// <summary>Charging current at the threshold without drains, A: (V₀ − 2V_CC/3)/R; (V_CC/3)/R for R from the supply.</summary>
    public double AvailableCurrent => (ChargeVoltage - ThresholdVoltage) / Resistance;

    /// <summary>Charging current available at the 2/3 threshold minus the drains, A (negative: never ends).
    /// (V₀ − 2V_CC/3)/R − I_drain − (2V_CC/3)/R_L; textbook RC charging with a constant drain.</summary>
    public double MarginCurrent =>
        AvailableCurrent - DrainCurrent - (double.IsInfinity(LeakageResistance) ? 0.0 : ThresholdVoltage / LeakageResistance);

    /// <summary>One-shot width without drains, s: R·C·ln(V₀/(V₀ − 2V_CC/3)) = ln 3·R·C for R from the supply.</summary>
    public double IdealWidth => ChargeVoltage <= ThresholdVoltage
        ? double.PositiveInfinity
        : Resistance * Capacitance * Math.Log(ChargeVoltage / (ChargeVoltage - ThresholdVoltage));

    /// <summary>Closed-form one-shot width, s: from 0 V to 2/3 V_CC with R, C, a constant drain and a leakage
    /// resistance (Thevenin: V∞ = (V₀/R − I)·(R∥R_L), τ = C·(R∥R_L)); +∞ when the threshold is never reached.</summary>
    public double ClosedFormWidth
    {
        get
        {
            double rl = LeakageResistance;
            double rPar = double.IsInfinity(rl) ? Resistance : Resistance * rl / (Resistance + rl);
            double vInf = double.IsInfinity(rl)
                ? ChargeVoltage - DrainCurrent * Resistance
                : (ChargeVoltage / Resistance - DrainCurrent) * rPar;
            double vTh = ThresholdVoltage;
            if (vInf <= vTh) return double.PositiveInfinity;
            return rPar * Capacitance * Math.Log(vInf / (vInf - vTh));
        }
    }
}

/// <summary>The timing capacitor dumped through the timer's discharge transistor when the one-shot ends: the network
/// at the discharge pin (timing capacitor at the threshold) as a source <see cref="Voltage"/> behind
/// <see cref="PathResistance"/>, into the transistor's on-resistance.</summary>
/// <param name="Voltage">Open-circuit voltage at the discharge pin when the transistor switches on, V (the threshold
/// voltage when the pin is tied to the capacitor).</param>
/// <param name="PathResistance">Resistance in series with the transistor (Thevenin, at the pin), Ω; 0 when the pin is
/// tied to the capacitor.</param>
/// <param name="OnResistance">The transistor's on-resistance, Ω.</param>
/// <param name="CurrentLimit">Most current the transistor conducts, A.</param>
/// <param name="SafeCurrent">Peak current it takes safely again and again, A.</param>
public sealed record DischargeFacts(double Voltage, double PathResistance, double OnResistance, double CurrentLimit, double SafeCurrent)
{
    /// <summary>Peak current the circuit would push through the on-resistance, A: V/(R_path + R_on) (Ohm's law at the
    /// instant the capacitor starts to discharge).</summary>
    public double CircuitPeak => Voltage / (PathResistance + OnResistance);

    /// <summary>Peak current the transistor carries: the circuit's peak, no more than its own limit, A.</summary>
    public double PeakCurrent => Math.Min(CircuitPeak, CurrentLimit);

    /// <summary>True when the transistor carries more than its safe current at the dump.</summary>
    public bool AboveSafe => PeakCurrent > SafeCurrent;

    /// <summary>Series resistance that brings the peak down to the safe current, Ω: V/I_safe − R_on − R_path.</summary>
    public double SeriesResistanceNeeded => Math.Max(0.0, Voltage / SafeCurrent - OnResistance - PathResistance);
}

/// <summary>A relay coil as the analysis sees it.</summary>
/// <param name="PartId">Relay part id.</param>
/// <param name="PullIn">Pull-in coil voltage, V.</param>
/// <param name="DropOut">Drop-out coil voltage, V.</param>
/// <param name="CoilPeak">Highest coil voltage that counts against pull-in within [from, to] (run seconds), V: the
/// peak coil current times the coil resistance; NaN when not recorded.</param>
public sealed record RelayFacts(string PartId, double PullIn, double DropOut, Func<double, double, double> CoilPeak);

/// <summary>The light sensor and its switching level.</summary>
/// <param name="PartId">Sensor part id.</param>
/// <param name="SwitchingLux">Light at the sensor below which the circuit switches on (found from the circuit at
/// rest), lux; null when it could not be found.</param>
public sealed record SensorFacts(string PartId, double? SwitchingLux);

/// <summary>Everything the analysis reads about one finished run, in run seconds. Built from the simulation result,
/// the scenario and the netlist by the caller; the analysers never see the solver.</summary>
public sealed record RunFacts
{
    public required DateTimeOffset Origin { get; init; }
    public TimeZoneInfo TimeZone { get; init; } = TimeZoneInfo.Utc;
    public required double Duration { get; init; }
    public IReadOnlyList<NightWindow> Nights { get; init; } = [];
    public IReadOnlyList<LoadTransition> LoadTransitions { get; init; } = [];

    /// <summary>False when the circuit has nothing to switch (no relay or named load): then no night can be "missed".</summary>
    public bool HasSwitchedLoad { get; init; } = true;
    public IReadOnlyList<EventFact> Events { get; init; } = [];
    public IReadOnlyList<DiscreteEvent> DeviceEvents { get; init; } = [];
    public IReadOnlyList<TimerFacts> Timers { get; init; } = [];

    /// <summary>The relays (coil thresholds and coil voltage over time).</summary>
    public IReadOnlyList<RelayFacts> Relays { get; init; } = [];

    /// <summary>The relays that switch a named load: their contacts against the load.</summary>
    public IReadOnlyList<ContactFacts> Contacts { get; init; } = [];

    /// <summary>The mains-fed supply (rail, Zener regulation per load state, relay drives, ripple at the trigger), or
    /// null when the circuit runs from an ideal rail.</summary>
    public SupplyFacts? Supply { get; init; }

    /// <summary>The light sensor the circuit switches on (the first one), or null.</summary>
    public SensorFacts? Sensor { get; init; }

    /// <summary>Illuminance the scenario puts on the circuit's sensor channel (sky, weather and scheduled light events; not
    /// the lamp's own light), lux against run seconds; null if unknown. Used to find when the evening light fell through
    /// the switching level (events are seconds long and do not move that crossing).</summary>
    public Func<double, double>? SkyLux { get; init; }

    /// <summary>Illuminance at the sensor including every event, lux against run seconds; null if unknown.</summary>
    public Func<double, double>? SensorLux { get; init; }

    /// <summary>Lux the lamp adds at its own sensor while on (0 when not coupled).</summary>
    public double LampCouplingLux { get; init; }

    /// <summary>Run time until which a switch-on counts as caused by power-up, seconds.</summary>
    public double PowerUpWindow { get; init; } = 5.0;

    /// <summary>How long after a darkening edge (event end) a switch-on is still attributed to it, seconds
    /// (the sensor's decay lag and the trigger network).</summary>
    public double AttributionLag { get; init; } = 30.0;

    /// <summary>The attribution lag for a darkening edge at run time t, seconds (the sensor slows down in the dark);
    /// null: <see cref="AttributionLag"/> everywhere.</summary>
    public Func<double, double>? AttributionLagAt { get; init; }

    /// <summary>Clock time of a run time.</summary>
    public DateTimeOffset Clock(double runSeconds) => TimeZoneInfo.ConvertTime(Origin.AddSeconds(runSeconds), TimeZone);
}
