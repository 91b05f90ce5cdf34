namespace NightSim.Transient;

/// <summary>Knobs of a transient run. Immutable; start from <see cref="Default"/> and change with <c>with</c>.</summary>
public sealed record TransientOptions
{
    /// <summary>Production defaults (docs/numerics.md §2).</summary>
    public static TransientOptions Default { get; } = new();

    /// <summary>Tight settings for verification against closed forms.</summary>
    public static TransientOptions Verification { get; } = new() { RelativeTolerance = 1e-7, VoltageTolerance = 1e-9, CurrentTolerance = 1e-12, MaxStep = 1.0 };

    /// <summary>Looser production settings (`--accuracy loose`): rtol 1e-3, 10 µV, 10 nA. Faster, and a way past a
    /// stage that will not settle at the default tolerance.</summary>
    public static TransientOptions Loose { get; } = new() { RelativeTolerance = 1e-3, VoltageTolerance = 1e-5, CurrentTolerance = 1e-8 };

    /// <summary>Tighter production settings (`--accuracy tight`): rtol 1e-5, 0.1 µV, 0.1 nA.</summary>
    public static TransientOptions Tight { get; } = new() { RelativeTolerance = 1e-5, VoltageTolerance = 1e-7, CurrentTolerance = 1e-10 };

    /// <summary>The settings for an accuracy word: "loose", "normal" (the default) or "tight"; null for any other word.</summary>
    public static TransientOptions? ForAccuracy(string word) => word switch
    {
        "loose" => Loose,
        "normal" => Default,
        "tight" => Tight,
        _ => null,
    };

    /// <summary>Integration formula.</summary>
    public IntegrationMethod Method { get; init; } = IntegrationMethod.TrBdf2;

    /// <summary>Relative local-error tolerance (dimensionless).</summary>
    public double RelativeTolerance { get; init; } = 1e-4;

    /// <summary>Absolute local-error tolerance on voltages, volts.</summary>
    public double VoltageTolerance { get; init; } = 1e-6;

    /// <summary>Absolute local-error tolerance on inductor currents, amperes.</summary>
    public double CurrentTolerance { get; init; } = 1e-9;

    /// <summary>Largest step, seconds. Unbounded by default: the error estimate, the breakpoints (source corners, light
    /// event edges), the devices' own limits and <see cref="LightChange"/> bound the step instead.</summary>
    public double MaxStep { get; init; } = double.PositiveInfinity;

    /// <summary>Light-aware step: no step lets the light signal's smooth part (the sky) change by more than this in
    /// ln lux (0.1: about 10 %) on any channel. Light sensors' nodes carry no charge, so the error estimate does not see
    /// them; this bound keeps them followed through dusk and dawn.</summary>
    public double LightChange { get; init; } = 0.1;

    /// <summary>Largest growth of h per step while h is not yet limited by the error estimate: after a restart (an event,
    /// an ideal edge, the start) and after landing on a breakpoint, h was set by the event or the breakpoint, and the
    /// error estimate of each step alone chooses the next, up to this factor, until it holds h below
    /// <see cref="MaxGrowth"/>. So a step after an event starts at <see cref="RestartStep"/> and reaches the length the
    /// error allows in a few steps instead of doubling up from it.</summary>
    public double RestartGrowth { get; init; } = 1e4;

    /// <summary>Newton iterations per stage in the damped retries after a failed step (each moves a node by at most
    /// <see cref="NewtonVoltageStepLimit"/>, so a 12 V swing needs a dozen of them).</summary>
    public int DampedNewtonIterations { get; init; } = 25;

    /// <summary>Smallest step, seconds (the solver also never goes below 16 ulp of the current time).</summary>
    public double MinStep { get; init; } = 1e-13;

    /// <summary>First step and step after a jump (event, inconsistent start), seconds.</summary>
    public double RestartStep { get; init; } = 1e-9;

    /// <summary>When set, every step has this size (no error control; breakpoints still landed on). Seconds.</summary>
    public double? FixedStep { get; init; }

    /// <summary>Local error the step controller aims at, as a fraction of the tolerance (a step is accepted up to 1).
    /// Below 1 so that local errors accumulated over a run stay within the tolerance (measured on RC and RLC closed
    /// forms: 0.25 keeps the global error of an RC charge below rtol·V).</summary>
    public double ErrorTarget { get; init; } = 0.25;

    /// <summary>Largest growth of h from one step to the next.</summary>
    public double MaxGrowth { get; init; } = 2.0;

    /// <summary>Newton iterations per stage before the step is cut.</summary>
    public int MaxNewtonIterations { get; init; } = 12;

    /// <summary>Newton iterations for the operating point.</summary>
    public int MaxOperatingPointIterations { get; init; } = 100;

    /// <summary>Pseudo-transient continuation at a failing step: capacitance to ground put on every node that has no
    /// capacitance of its own, farads (0 = off). Turns the jump of a regenerative stage into a fast transient that small
    /// steps can follow (docs/numerics.md §6).</summary>
    public double ContinuationCapacitance { get; init; } = 1e-12;

    /// <summary>The continuation capacitance is taken away once an accepted step is this long, seconds.</summary>
    public double ContinuationEndStep { get; init; } = 1e-4;

    /// <summary>Largest node-voltage change of one Newton iteration in the retries after a failed step, volts (0 = no
    /// damping).</summary>
    public double NewtonVoltageStepLimit { get; init; } = 1.0;

    /// <summary>Junction shunt conductance, siemens.</summary>
    public double Gmin { get; init; } = 1e-12;

    /// <summary>Capacitance to ground given to every node with no conductive or capacitive path to ground at power-up
    /// (the DC side of a bridge whose AC side is grounded), farads; 0 = none.</summary>
    public double FloatingNodeCapacitance { get; init; } = 10e-12;

    /// <summary>Envelope following: when every periodic source shares one frequency (a mains sine), jump many cycles
    /// forward along the per-cycle change of the state between windows of full detail (docs/supply.md).</summary>
    public bool EnvelopeFollowing { get; init; }

    /// <summary>Envelope tolerance: the curvature error of a jump, m²/2·|second difference|, is kept within this fraction
    /// of each state's scale (|x| + 1 V, or |x| + 1 mA for currents).</summary>
    public double EnvelopeTolerance { get; init; } = 1e-3;

    /// <summary>Largest change of any state in one jump, as a fraction of its scale (|x| + 1 V).</summary>
    public double EnvelopeMaxChange { get; init; } = 0.05;

    /// <summary>Longest jump, seconds.</summary>
    public double EnvelopeMaxJump { get; init; } = 3600.0;

    /// <summary>Full detail kept after power-up, every event and every breakpoint before the next jump, seconds.</summary>
    public double EnvelopeDetailWindow { get; init; } = 1.0;

    /// <summary>Mains averaging: when the circuit holds the cycle-averaged model of a capacitive-dropper supply
    /// (Supply.AveragedDropper, added by the night run), run the mains cycle-averaged between windows of full mains
    /// detail around power-up, events and breakpoints (docs/supply.md). False: full mains detail throughout.</summary>
    public bool MainsAveraging { get; init; } = true;

    /// <summary>Power-up: the supply runs averaged from t = 0 and the events of the first this-many seconds (the timer and
    /// comparators finding their states while the rail comes up) open no window of full detail, seconds.</summary>
    public double MainsPowerUp { get; init; } = 0.5;

    /// <summary>Full mains detail kept after every event (a comparator or timer flip, a relay operation) and every
    /// breakpoint before the supply may run averaged again, seconds.</summary>
    public double MainsDetailMinimum { get; init; } = 0.04;

    /// <summary>Longest window of full mains detail after its last event, seconds: a rail still sagging then is carried
    /// on by the averaged model.</summary>
    public double MainsDetailMaximum { get; init; } = 10.0;

    /// <summary>A detail window ends once the rail's mean over each of the last <see cref="MainsSettledCycles"/> whole
    /// mains cycles moved from the cycle before by at most this fraction of it plus 1 mV.</summary>
    public double MainsSettledChange { get; init; } = 1e-3;

    /// <summary>Whole mains cycles whose rail means must agree (2 to 4) before a detail window may end.</summary>
    public int MainsSettledCycles { get; init; } = 2;

    /// <summary>Run time of one window of full mains detail in standby after power-up, seconds (0 = none): the supply's
    /// standby figures (rail, Zener current, ripple at the trigger) come from its cycles. After the supply findings'
    /// quiet time of 1 s from power-up.</summary>
    public double MainsStandbySample { get; init; } = 1.5;

    /// <summary>Mains cycles of full detail entered before every known breakpoint (a light event, a scheduled source
    /// edge), so the circuit meets it with the real ripple.</summary>
    public int MainsLeadCycles { get; init; } = 3;

    /// <summary>Oscillation skipping: once three cycles of a switching oscillation (a relay chattering at dusk) were
    /// alike, jump whole cycles forward along their measured per-cycle change, writing their events (docs/numerics.md
    /// §10). False: every cycle in full detail.</summary>
    public bool OscillationSkipping { get; init; } = true;

    /// <summary>Oscillation tolerance: the time error the period's curvature may add over a jump, as a fraction of the
    /// jump's span, and the curvature error of each state's extrapolation, as a fraction of its scale.</summary>
    public double OscillationTolerance { get; init; } = 1e-2;

    /// <summary>Most cycles skipped in one jump.</summary>
    public double OscillationMaxCycles { get; init; } = 10_000;

    /// <summary>How the run starts.</summary>
    public StartMode Start { get; init; } = StartMode.PowerUp;

    /// <summary>Power-up: time over which independent sources ramp from 0 to full, seconds; 0 = switched on at t = 0.</summary>
    public double SupplyRamp { get; init; } = 1e-3;

    /// <summary>Initial voltages of named nodes at power-up, volts (others start at 0 V).</summary>
    public IReadOnlyDictionary<string, double>? InitialVoltages { get; init; }

    /// <summary>Event time tolerance, seconds: the crossing is bracketed on real steps to this width (the solver uses at
    /// least 100ε·t, a few tens of ulps of the current time, and at most 1 µs unless that floor is coarser).</summary>
    public double EventTimeTolerance { get; init; } = 1e-9;

    /// <summary>Logic passes allowed at one event time before the run fails as an endless switching loop.</summary>
    public int MaxLogicPasses { get; init; } = 20;

    /// <summary>Unknowns to record (node names or branch labels); null = every netlist node.</summary>
    public IReadOnlyList<string>? RecordNodes { get; init; }

    /// <summary>Decimation buckets of the trace store (≤ 2 points per bucket and signal are kept).</summary>
    public int TraceBuckets { get; init; } = 20_000;

    /// <summary>Illuminance seen by sensors when no light signal is attached, lux.</summary>
    public double ConstantLux { get; init; }

    /// <summary>Linear solver: true for the sparse LU (default), false for the dense reference LU.</summary>
    public bool SparseSolver { get; init; } = true;
}
