using NightSim.Devices;
using NightSim.Mna;
using NightSim.Netlist;
using NightSim.Results;
using NightSim.Sky;

namespace NightSim.Transient;

/// <summary>
/// The transient driver for one run of one circuit: power-up (or operating point), then accepted steps of TR-BDF2
/// (default), backward Euler or the trapezoidal rule with local-error control, breakpoints landed on exactly and
/// discrete events located and fired between steps. The loop in one page: DEVELOPERS.md, "The step loop"; the
/// numerics and their published sources: docs/numerics.md.
/// </summary>
/// <remarks>
/// Formulation (charge-oriented MNA, Ho–Ruehli–Brennan 1975): F(x, t) = dq(x)/dt + j(x, t) = 0. Every formula replaces
/// dq/dt at the new point by α·q(x) − H (history H), so each Newton iteration solves (α·C + G)·Δx = −(α·q + j − H).
/// TR-BDF2 per Bank et al. 1985, error estimate and its stiff filter per Hosea &amp; Shampine 1996.
/// The accepted-step loop allocates nothing: all vectors are allocated here, devices stamp into fixed slots.
/// </remarks>
public sealed partial class TransientSolver
{
    // TR-BDF2 constants, γ = 2 − √2 (docs/numerics.md §1).
    private static readonly double s_gamma = 2.0 - Math.Sqrt(2.0);
    private static readonly double s_d = s_gamma / 2.0;
    private static readonly double s_a = 1.0 / (s_gamma * (2.0 - s_gamma));
    private static readonly double s_b = (1.0 - s_gamma) * (1.0 - s_gamma) / (s_gamma * (2.0 - s_gamma));
    private static readonly double s_k = (-3.0 * s_gamma * s_gamma + 4.0 * s_gamma - 2.0) / (12.0 * (2.0 - s_gamma));

    /// <summary>Longest reach of the stage-1 predictor, in lengths of the last step.</summary>
    private const double MaxPredictorReach = 10.0;

    private readonly Circuit _circuit;
    private readonly TransientOptions _options;
    private readonly ILightSignal? _light;
    private readonly Device[] _devices;

    /// <summary>Longest step: the options' limit and every device's own (a sine source's fraction of its period), s.</summary>
    private double _maxStep; // lifted while the mains runs cycle-averaged
    private readonly LoadContext _ctx;
    private readonly ILinearSolver _solver;
    private readonly int _n;
    private readonly int[] _slotRow;
    private readonly int[] _slotCol;
    private readonly double[] _allowed;
    private readonly double[] _matrix;
    private readonly double[] _factored;
    private bool _factorValid;

    // State at the last accepted point t_n.
    private readonly double[] _x;
    private readonly double[] _q;
    private readonly double[] _qd;
    private readonly double[] _xPrev;
    private readonly double[] _qdPrev;
    // Stage and step results.
    private readonly double[] _xg;
    private readonly double[] _qg;
    private readonly double[] _qdg;
    private readonly double[] _xNew;
    private readonly double[] _qNew;
    private readonly double[] _qdNew;
    // Work vectors.
    private readonly double[] _hist;
    private readonly double[] _rhs;
    private readonly double[] _err;
    private readonly double[] _atol;
    private readonly double[] _newtonAtol;
    private readonly bool[] _inNorm;
    private readonly bool[] _rowHasCharge;
    private readonly double[] _lastDelta;
    private readonly double[] _jumpProbe;

    // Events, flattened over (source, index).
    private readonly IEventSource[] _eventSource;
    private readonly int[] _eventIndex;
    private readonly double[] _gOld;
    private readonly double[] _gNew;
    private readonly double[] _gRef;
    private readonly bool[] _fire;

    private readonly BreakpointQueue _requested = new();
    private readonly EventLog _eventLog;
    private readonly SolverStatistics _stats = new();
    private TraceRecorder? _recorder;

    private SimTime _time;
    private double _stop;
    private double _h;          // proposed next step
    private double _hLast;      // last accepted step
    private double _hPrevStep;  // step before the last accepted one (TR estimate)
    private bool _havePrev;     // x_{n-1} and q̇_{n-1} are valid (no jump since)
    private bool _needRestart;  // next step is a backward-Euler restart step
    private bool _rejectedLast;
    private bool _ramping;      // steps since the last restart have all grown as fast as allowed: RestartGrowth applies
    private int _failuresHere;
    private double _opGmin;
    private double _opTime; // time at which an operating point is solved (0 but for a resting point)
    private SimulationFailure? _failure;
    private long _cpuStart;
    private long _steadyAllocStart;
    private bool _begun;
    private double _lastStepH; // h of the step just computed (trial)
    private bool _lastStepWasTrBdf2;

    /// <summary>Prepare a run. The circuit's devices carry per-run state: use a fresh circuit per run.</summary>
    public TransientSolver(Circuit circuit, TransientOptions? options = null, ILightSignal? light = null)
    {
        _circuit = circuit;
        _options = options ?? TransientOptions.Default;
        _light = light ?? circuit.Light;
        _devices = [.. circuit.Devices];
        _maxStep = _options.MaxStep;
        foreach (Device d in _devices) _maxStep = Math.Min(_maxStep, d.MaxStep);
        _n = circuit.Size;
        int slots = circuit.Pattern.Count;
        _slotRow = [.. circuit.Pattern.Rows];
        _slotCol = [.. circuit.Pattern.Cols];
        _allowed = new double[_n];
        _ctx = new LoadContext(_n, slots)
        {
            Light = _light,
            ConstantLux = _options.ConstantLux,
            Gmin = _options.Gmin,
        };
        _solver = _options.SparseSolver ? new SparseLuSolver(circuit.Pattern) : new DenseLuSolver(circuit.Pattern);
        _matrix = new double[slots];
        _factored = new double[slots];
        _x = new double[_n];
        _q = new double[_n];
        _qd = new double[_n];
        _xPrev = new double[_n];
        _qdPrev = new double[_n];
        _xg = new double[_n];
        _qg = new double[_n];
        _qdg = new double[_n];
        _xNew = new double[_n];
        _qNew = new double[_n];
        _qdNew = new double[_n];
        _hist = new double[_n];
        _rhs = new double[_n];
        _err = new double[_n];
        _atol = new double[_n];
        _newtonAtol = new double[_n];
        _inNorm = new bool[_n];
        _rowHasCharge = new bool[_n];
        _lastDelta = new double[_n];
        _jumpProbe = new double[_n];

        var sources = new List<IEventSource>();
        var indices = new List<int>();
        foreach (IEventSource source in circuit.EventSources)
            for (int i = 0; i < source.EventCount; i++)
            {
                sources.Add(source);
                indices.Add(i);
            }
        _eventSource = [.. sources];
        _eventIndex = [.. indices];
        _gOld = new double[_eventSource.Length];
        _gNew = new double[_eventSource.Length];
        _gRef = new double[_eventSource.Length];
        _fire = new bool[_eventSource.Length];
        _eventLog = new EventLog(_requested);
    }

    /// <summary>Run a circuit from power-up (or its operating point) to <paramref name="stopTime"/> seconds.</summary>
    public static SimulationResult Run(Circuit circuit, double stopTime, TransientOptions? options = null, ILightSignal? light = null) =>
        new TransientSolver(circuit, options, light).Run(stopTime);

    /// <summary>Run to <paramref name="stopTime"/> seconds. Never throws for numerical failure: the result carries it.</summary>
    public SimulationResult Run(double stopTime)
    {
        Begin(stopTime);
        while (Advance()) { }
        return Finish();
    }

    /// <summary>Statistics so far.</summary>
    public SolverStatistics Statistics => _stats;

    /// <summary>Time of the last accepted point, seconds.</summary>
    public double Time => _time.Value;

    /// <summary>Solution at the last accepted point (node voltages V, branch currents A).</summary>
    public ReadOnlySpan<double> Solution => _x;

    /// <summary>dq/dt at the last accepted point as the integration formula produced it (A on node rows).</summary>
    public ReadOnlySpan<double> ChargeDerivative => _qd;

    /// <summary>Trace storage to take over from an earlier run on this thread (the runs of a study), or null.</summary>
    public TraceBuffers? TraceBuffers { get; init; }

    /// <summary>Called after every accepted point (tests, progress). Must not allocate if the loop is to stay allocation-free.</summary>
    public Action<TransientSolver>? Accepted { get; set; }

    /// <summary>Start the run: initial state, first breakpoints, recorder.</summary>
    internal void Begin(double stopTime)
    {
        if (_begun) throw new InvalidOperationException("a TransientSolver runs once; build a new circuit and solver per run");
        if (!(stopTime > 0) || !double.IsFinite(stopTime)) throw new ArgumentOutOfRangeException(nameof(stopTime), "stop time must be a positive number of seconds");
        _begun = true;
        _cpuStart = Environment.CpuUsage.TotalTime.Ticks;
        _stop = stopTime;
        _time.Set(0.0);
        _recorder = BuildRecorder(stopTime);
        foreach (Device d in _devices) d.PowerUp();

        Array.Clear(_x);
        if (_options.InitialVoltages is { } initial)
            foreach (var (node, v) in initial)
            {
                int i = _circuit.IndexOf(node);
                if (i < 0) throw new ArgumentException($"initial voltage given for unknown node '{node}'", nameof(_options));
                _x[i] = v;
            }
        ApplyCapacitorStartVoltages();
        FindFloatingNodes();

        _ctx.SourceScale = SourceScaleAt(0.0);
        if (_options.Start == StartMode.OperatingPoint)
        {
            if (!SolveOperatingPoint())
            {
                _failure = new SimulationFailure(0, "no DC operating point found (Newton, gmin stepping and source stepping all failed)",
                    WorstUnknowns(), "check for floating nodes and for loops of voltage sources, or start by power-up");
                return;
            }
            _needRestart = false;
        }
        else
        {
            _needRestart = true;
        }

        Evaluate(_x, 0.0);
        FindChargeFreeNodes();
        Array.Copy(_ctx.Q, _q, _n);
        for (int i = 0; i < _n; i++) _qd[i] = -_ctx.J[i];
        SetTolerances();
        ExcludeFloorOnlyNodesFromNorm();
        SetUpEnvelope();
        SetUpMainsAveraging();
        SetUpInternalStates();
        SetUpOscillationSkipping();
        if (_options.Start == StartMode.PowerUp) _needRestart = !AlgebraicRowsSatisfied();
        RecordPoint(keepRow: true);
        EvaluateEvents(_x, 0.0, _gNew, _gOld);
        Array.Copy(_gNew, _gOld, _gOld.Length);
        _h = _options.FixedStep ?? _options.RestartStep;
        _havePrev = false;
    }

    /// <summary>
    /// Capacitors with an initial voltage: v(p) − v(n) = v0 at power-up, whichever side is grounded and in whatever order
    /// the parts are listed. Passes repeat until nothing changes, so a chain (C2 from top to mid on C1 from mid to
    /// ground) settles outward from ground.
    /// </summary>
    private void ApplyCapacitorStartVoltages()
    {
        int passes = 0;
        bool changed = true;
        while (changed && passes++ <= _devices.Length)
        {
            changed = false;
            foreach (Device d in _devices)
            {
                if (d is not Capacitor { InitialVoltage: double v0 } cap) continue;
                int p = cap.InnerNode, n = _circuit.IndexOf(cap.Nodes[1]);
                int target = p >= 0 ? p : n;
                if (target < 0) continue;
                double value = p >= 0 ? v0 + (n >= 0 ? _x[n] : 0.0) : -v0;
                if (_x[target] != value)
                {
                    _x[target] = value;
                    changed = true;
                }
            }
        }
    }

    /// <summary>Take one accepted step (possibly after rejections). False when the run is over (done or failed).</summary>
    internal bool Advance()
    {
        if (_failure is not null || StopRequested()) return false;
        double t = _time.Value;
        if (t >= _stop) return false;
        if (TryEnvelopeJump()) return _time.Value < _stop;
        MainsAveragingAt();
        // Smallest step: a couple of ulps of the absolute time, so that t + γh is still a distinct time for the devices;
        // the step itself is carried exactly (SimTime keeps the rounding). 16 ulps (6e-11 s five hours into a night)
        // was too coarse for a transistor discharging a coil's winding capacitance in 2 ns.
        double hMin = Math.Max(_options.MinStep, 2.0 * (Math.BitIncrement(Math.Max(Math.Abs(t), 1e-300)) - Math.Abs(t)));

        while (true)
        {
            if (StopRequested()) return false;
            // PlanStep: controller proposal, limits, breakpoint landing without sliver steps.
            double bp = NextBreakpoint(t);
            double h = Math.Min(_h, _maxStep);
            if (_light is not null && _options.FixedStep is null) h = Math.Min(h, _light.StepLimit(t, _options.LightChange));
            if (_internal.Length > 0 && _options.FixedStep is null) h = Math.Min(h, InternalStepLimit());
            if (_eventRate.Length > 0 && _options.FixedStep is null) h = Math.Min(h, EventApproachLimit());
            if (_options.FixedStep is null) h = Math.Max(h, hMin);
            double dist = bp - t;
            bool landing = false;
            if (dist <= h * (1.0 + 1e-3))
            {
                h = dist;
                landing = true;
            }
            else if (dist < 2.0 * h && _options.FixedStep is null)
            {
                h = 0.5 * dist;
            }

            bool restart = _needRestart;
            long factorsBefore = _solver.Factorizations;
            bool ok = restart ? StepBackwardEuler(t, h, predict: false) : TakeStep(t, h);
            if (!ok)
            {
                _stats.RejectedSteps++;
                _stats.NewtonFailures++;
                _failuresHere++;
                _rejectedLast = true;
                _damped = true; // retries at this point take damped Newton corrections
                _h = h / (_failuresHere > 1 ? 8.0 : 4.0);
                // Late in a long run the smallest step is a nanosecond or more: try once at it before the aids below.
                if (_h < hMin && h > hMin * (1.0 + 1e-9)) _h = hMin;
                if (_failuresHere >= 2) _needRestart = true; // two failures at this point: fall back to BE
                if (_h < hMin && StartContinuation())
                {
                    // Pseudo-transient continuation: a small capacitance on every node without any of its own, from
                    // the restart step down (TransientSolver.Convergence.cs).
                    _h = Math.Max(hMin, _options.RestartStep);
                    _failuresHere = 0;
                    _needRestart = true;
                    continue;
                }
                if (_h < hMin && _opGmin == 0)
                {
                    // Last resort before giving up: a temporary 1e-9 S shunt on every node for this step
                    // (docs/numerics.md §6).
                    _opGmin = 1e-9;
                    _h = Math.Max(hMin, _options.RestartStep);
                    _failuresHere = 0;
                    continue;
                }
                if (_h < hMin)
                {
                    _opGmin = 0;
                    _failure = new SimulationFailure(t, "Newton iteration did not converge even at the smallest step", WorstUnknowns(),
                        "try --accuracy loose; give the transistors or diodes on the worst nodes a junction capacitance (e.g. baseEmitterCapacitance \"10p\", baseCollectorCapacitance \"4p\"), or put about 1 µF from the sensor node to gnd");
                    return false;
                }
                continue;
            }

            double hNext = h;
            // A restart step of the restart size (after a jump or an event) has no usable error estimate; a backward-Euler
            // fallback after Newton failures can be long, so it is held to the error test like any other step.
            bool checkError = !restart || h > 10.0 * _options.RestartStep;
            if (checkError && _options.FixedStep is null)
            {
                double r = ErrorNorm();
                bool atFloor = h <= hMin * (1.0 + 1e-9) && !landing;
                if (!(r <= 1.0) && !(atFloor && double.IsFinite(r)))
                {
                    _stats.RejectedSteps++;
                    double fac = double.IsFinite(r) ? 0.9 * Math.Pow(r / _options.ErrorTarget, -1.0 / 3.0) : 0.1;
                    _h = Math.Max(h * Math.Max(0.1, Math.Min(0.9, fac)), hMin);
                    _rejectedLast = true;
                    if (!double.IsFinite(r) && h <= hMin * (1.0 + 1e-9))
                    {
                        _failure = new SimulationFailure(t, "the local error is not finite even at the smallest step", WorstUnknowns(),
                            "the circuit may switch infinitely fast (an ideal loop); add a capacitor of about 1 nF from the worst node to gnd, a resistor of about 100 Ω in series with the ideal source, or try --accuracy loose");
                        return false;
                    }
                    continue;
                }
                // At the smallest step the time resolution itself (a few ulp of t late in a long run) limits the
                // accuracy: accept, and count it, rather than stop the run.
                if (!(r <= 1.0)) _stats.ForcedSteps++;
                hNext = ProposeStep(h, Math.Min(r, 1.0), reusedLu: _solver.Factorizations == factorsBefore);
            }
            else if (restart)
            {
                // The restart step only settles the algebraic unknowns; from the next (error-checked) step on, the ramp
                // lets the error estimate choose how fast h grows back.
                hNext = _options.FixedStep ?? Math.Max(h, _options.RestartStep);
                _ramping = true;
            }

            // Events: locate the earliest sign change in (t, t + h], re-take the step up to it, fire.
            bool fired = false;
            if (_eventSource.Length > 0)
            {
                // On a landing the step ends exactly at the breakpoint; t + h can come out one ulp short of it, and a
                // timed event function (t − t_due) would then read −ulp and miss its own breakpoint.
                EvaluateEvents(_xNew, landing ? bp : t + h, _gNew, _gOld);
                if (AnyFlip(_gOld, _gNew))
                {
                    double hEvent = LocateAndRetake(t, h, restart);
                    if (hEvent < h)
                    {
                        h = hEvent;
                        landing = false;
                    }
                    for (int e = 0; e < _fire.Length; e++) _fire[e] = Flipped(_gOld[e], _gNew[e]);
                    fired = true;
                }
            }

            _opGmin = 0; // a temporary shunt lasts one accepted step
            Commit(t, h, landing ? bp : double.NaN, restart, keepRow: fired || landing || restart);
            StepEnd end = StepEnd.Smooth;
            if (fired)
            {
                OscillationAtEvents(); // may move time and state on by whole cycles of an oscillation
                if (!FireEvents()) return false;
                end = StepEnd.EventsFired;
            }
            else if (landing)
            {
                _stats.Breakpoints++;
                // An ideal edge leaves x_n inconsistent with the sources just after it.
                end = SourcesJumpAt(_time.Value) ? StepEnd.SourceJump : StepEnd.Landed;
            }
            ContinueAfter(end, hNext, restart);
            return _time.Value < _stop;
        }
    }

    /// <summary>Set up the next step from how this one ended: a restart (backward Euler, history dropped) after events
    /// and ideal edges, a step sized to the next breakpoint after a smooth landing, else the controller's proposal.</summary>
    private void ContinueAfter(StepEnd end, double hNext, bool restart)
    {
        switch (end)
        {
            case StepEnd.EventsFired:
            case StepEnd.SourceJump:
                _needRestart = true;
                _havePrev = false;
                _h = _options.FixedStep ?? _options.RestartStep;
                break;
            case StepEnd.Landed:
                // A corner, not a jump: the error estimate's proposal goes on (planning lands on the next breakpoint
                // if it is nearer). A segment short against it, such as a pulse's edge, is one step, held to the error
                // test like any other; a tenth of the distance each time cost a noise pulse six steps instead of three.
                _h = _options.FixedStep ?? hNext;
                if (restart) _needRestart = false;
                _ramping = true; // h was set by the breakpoint, not by the error estimate
                break;
            default:
                _h = hNext;
                if (restart) _needRestart = false;
                break;
        }
    }

    /// <summary>Collect the result.</summary>
    internal SimulationResult Finish()
    {
        FinishMainsAveraging();
        _stats.Factorizations = _solver.Factorizations;
        _stats.PivotAnalyses = _solver.Analyses;
        _stats.CpuSeconds = (Environment.CpuUsage.TotalTime.Ticks - _cpuStart) / (double)TimeSpan.TicksPerSecond;
        if (_failure is { } f) _failure = DescribeFailure(f);
        if (_stats.AcceptedSteps > SolverStatistics.SteadyFromStep)
        {
            _stats.SteadyAllocatedBytes = GC.GetAllocatedBytesForCurrentThread() - _steadyAllocStart;
            _stats.SteadySteps = _stats.AcceptedSteps - SolverStatistics.SteadyFromStep;
        }
        return new SimulationResult(_recorder?.Build() ?? [], _eventLog.ToResult(), _stats,
            _failure?.Time ?? _time.Value, _light?.Origin, _failure) { Interrupted = _interrupted && _failure is null };
    }

    /// <param name="reusedLu">The step reused the previous factorisation (a linear circuit at constant h): keeping h
    /// keeps that saving. Otherwise h follows the error estimate freely.</param>
    private double ProposeStep(double h, double r, bool reusedLu)
    {
        // After a restart or a landing, h was set by the event or the breakpoint, not by the error estimate: the estimate
        // alone limits growth (up to RestartGrowth per step) until it holds h below MaxGrowth; then MaxGrowth applies.
        double maxGrowth = _ramping && !_rejectedLast ? Math.Max(_options.RestartGrowth, _options.MaxGrowth) : _options.MaxGrowth;
        double fac = r > 0 ? 0.9 * Math.Pow(r / _options.ErrorTarget, -1.0 / 3.0) : maxGrowth;
        if (!(fac >= _options.MaxGrowth) || _rejectedLast) _ramping = false;
        double hNew;
        if (fac >= 1.0 && (fac <= 1.2 && reusedLu || fac <= 1.02)) hNew = h; // hysteresis: keep h (and its LU)
        else hNew = h * Math.Min(maxGrowth, Math.Max(0.2, fac));
        if (_rejectedLast) hNew = Math.Min(hNew, h);
        return hNew;
    }

    /// <summary>Make the point (t + h) the accepted point.</summary>
    private void Commit(double t, double h, double landAt, bool restart, bool keepRow)
    {
        if (_havePrev || restart)
        {
            Array.Copy(_x, _xPrev, _n);
            Array.Copy(_qd, _qdPrev, _n);
        }
        Array.Copy(_xNew, _x, _n);
        Array.Copy(_qNew, _q, _n);
        Array.Copy(_qdNew, _qd, _n);
        _havePrev = true;
        _hPrevStep = _hLast;
        _hLast = h;
        if (double.IsNaN(landAt)) _time.Advance(h); else _time.Set(landAt);
        _stats.NoteStep(h);
        if (_stats.AcceptedSteps == SolverStatistics.SteadyFromStep) _steadyAllocStart = GC.GetAllocatedBytesForCurrentThread();
        _rejectedLast = false;
        _failuresHere = 0;
        _damped = false;
        NoteContinuationStep(h);

        double tNow = _time.Value;
        Array.Copy(_x, _ctx.X, _n);
        _ctx.Time = tNow;
        _ctx.SourceScale = SourceScaleAt(tNow);
        foreach (Device d in _devices) d.Accept(_ctx);
        RecordPoint(keepRow);
        if (_eventSource.Length > 0)
        {
            EvaluateEvents(_x, tNow, _gNew, _gOld);
            NoteEventRates(h, restart);
            Array.Copy(_gNew, _gOld, _gOld.Length);
        }
        EnvelopeObserve(!double.IsNaN(landAt));
        OscillationObserve();
        Accepted?.Invoke(this);
    }

    private void RecordPoint(bool keepRow) => _recorder?.Record(_time.Value, _x, keepRow);

    // ---------------------------------------------------------------- integration formulas

    private bool TakeStep(double t, double h) => _options.Method switch
    {
        IntegrationMethod.BackwardEuler => StepBackwardEuler(t, h, predict: _havePrev),
        IntegrationMethod.Trapezoidal => StepTrapezoidal(t, h),
        _ => StepTrBdf2(t, h),
    };

    /// <summary>TR stage over γh, BDF2 stage to t + h; error estimate into _err.</summary>
    private bool StepTrBdf2(double t, double h)
    {
        _lastStepH = h;
        _lastStepWasTrBdf2 = true;
        int n = _n;
        double alpha = 1.0 / (s_d * h);
        double[] x = _ctx.X;
        double[] hist = _hist;
        // Stage 1 (trapezoidal over γh).
        for (int i = 0; i < n; i++) hist[i] = alpha * _q[i] + _qd[i];
        // A retry after a Newton failure starts from the last accepted point: the extrapolation of a node that collapses
        // within the step (a transistor saturating onto a coil) is what failed.
        if (_havePrev && _hLast > 0 && _failuresHere == 0)
        {
            // The straight line through the last two points is extrapolated at most MaxPredictorReach of the last step
            // (after a restart h grows by up to RestartGrowth in one step: a node that followed a source's ramp through a
            // nanosecond step extrapolated over a second lands Newton on the wrong branch of a latch).
            double f = s_gamma * Math.Min(h / _hLast, MaxPredictorReach);
            for (int i = 0; i < n; i++) x[i] = _x[i] + f * (_x[i] - _xPrev[i]);
        }
        else
        {
            Array.Copy(_x, x, n);
        }
        if (!Newton(t + s_gamma * h, alpha, hist)) return false;
        Array.Copy(x, _xg, n);
        Array.Copy(_ctx.Q, _qg, n);
        for (int i = 0; i < n; i++) _qdg[i] = alpha * (_qg[i] - _q[i]) - _qd[i];

        // Stage 2 (BDF2 on t_n, t_n + γh, t_n + h).
        for (int i = 0; i < n; i++)
        {
            hist[i] = alpha * (s_a * _qg[i] - s_b * _q[i]);
            x[i] = _x[i] + (_xg[i] - _x[i]) / s_gamma;
        }
        if (!Newton(t + h, alpha, hist)) return false;
        Array.Copy(x, _xNew, n);
        Array.Copy(_ctx.Q, _qNew, n);
        for (int i = 0; i < n; i++) _qdNew[i] = alpha * (_qNew[i] - s_a * _qg[i] + s_b * _q[i]);

        // Error estimate in q-space, filtered through (C/(dh) + G)⁻¹·(1/(dh)) (Hosea & Shampine 1996).
        double g = s_gamma;
        double c = 2.0 * s_k * h;
        for (int i = 0; i < n; i++)
            _err[i] = alpha * c * (_qd[i] / g - _qdg[i] / (g * (1.0 - g)) + _qdNew[i] / (1.0 - g));
        _solver.Solve(_err);
        return true;
    }

    /// <summary>Backward Euler over h; the error estimate is (h/2)·(q̇_{n+1} − q̇_n), filtered.</summary>
    private bool StepBackwardEuler(double t, double h, bool predict)
    {
        _lastStepH = h;
        _lastStepWasTrBdf2 = false;
        int n = _n;
        double alpha = 1.0 / h;
        double[] x = _ctx.X;
        for (int i = 0; i < n; i++) _hist[i] = alpha * _q[i];
        if (predict && _hLast > 0)
        {
            double f = h / _hLast;
            for (int i = 0; i < n; i++) x[i] = _x[i] + f * (_x[i] - _xPrev[i]);
        }
        else
        {
            Array.Copy(_x, x, n);
        }
        if (!Newton(t + h, alpha, _hist)) return false;
        Array.Copy(x, _xNew, n);
        Array.Copy(_ctx.Q, _qNew, n);
        for (int i = 0; i < n; i++) _qdNew[i] = alpha * (_qNew[i] - _q[i]);
        for (int i = 0; i < n; i++) _err[i] = alpha * 0.5 * h * (_qdNew[i] - _qd[i]);
        _solver.Solve(_err);
        return true;
    }

    /// <summary>Trapezoidal rule over h; error −(h³/12)·q''' from divided differences of q̇, filtered.</summary>
    private bool StepTrapezoidal(double t, double h)
    {
        _lastStepH = h;
        _lastStepWasTrBdf2 = false;
        int n = _n;
        double alpha = 2.0 / h;
        double[] x = _ctx.X;
        for (int i = 0; i < n; i++) _hist[i] = alpha * _q[i] + _qd[i];
        if (_havePrev && _hLast > 0)
        {
            double f = h / _hLast;
            for (int i = 0; i < n; i++) x[i] = _x[i] + f * (_x[i] - _xPrev[i]);
        }
        else
        {
            Array.Copy(_x, x, n);
        }
        if (!Newton(t + h, alpha, _hist)) return false;
        Array.Copy(x, _xNew, n);
        Array.Copy(_ctx.Q, _qNew, n);
        for (int i = 0; i < n; i++) _qdNew[i] = alpha * (_qNew[i] - _q[i]) - _qd[i];
        if (_havePrev && _hLast > 0)
        {
            double hp = _hLast;
            for (int i = 0; i < n; i++)
            {
                double q3 = 2.0 * ((_qdNew[i] - _qd[i]) / h - (_qd[i] - _qdPrev[i]) / hp) / (h + hp);
                _err[i] = alpha * (h * h * h / 12.0) * q3;
            }
        }
        else
        {
            for (int i = 0; i < n; i++) _err[i] = alpha * 0.5 * h * (_qdNew[i] - _qd[i]);
        }
        _solver.Solve(_err);
        return true;
    }

    /// <summary>Dense output of the step just computed at θ ∈ [0, 1] into <paramref name="dest"/>.</summary>
    private void DenseOutput(double theta, double[] dest)
    {
        int n = _n;
        if (_lastStepWasTrBdf2)
        {
            // Quadratic through x_n (θ = 0), x_γ (θ = γ), x_{n+1} (θ = 1) (docs/numerics.md §5).
            double g = s_gamma;
            double w0 = (theta - g) * (theta - 1.0) / g;
            double wg = theta * (theta - 1.0) / (g * (g - 1.0));
            double w1 = theta * (theta - g) / (1.0 - g);
            for (int i = 0; i < n; i++) dest[i] = w0 * _x[i] + wg * _xg[i] + w1 * _xNew[i];
        }
        else
        {
            for (int i = 0; i < n; i++) dest[i] = _x[i] + theta * (_xNew[i] - _x[i]);
        }
    }

    // ---------------------------------------------------------------- Newton

    /// <summary>
    /// Newton–Raphson on α·q(x) + j(x, t) − H = 0 from the guess in _ctx.X. On success _ctx.X holds the solution and
    /// _ctx.Q/_ctx.J are evaluated there; the factorisation of the last iteration is kept for the error filter.
    /// </summary>
    private bool Newton(double time, double alpha, double[] hist)
    {
        int n = _n;
        double[] x = _ctx.X, rhs = _rhs;
        double rel = 0.1 * _options.RelativeTolerance;
        int max = _ctx.IsOperatingPoint ? _options.MaxOperatingPointIterations : _options.MaxNewtonIterations;
        if (_damped) max = Math.Max(max, _options.DampedNewtonIterations); // damped corrections need more of them
        for (int it = 0; it < max; it++)
        {
            _ctx.Limited = false;
            Evaluate(x, time);
            double[] q = _ctx.Q, j = _ctx.J, g = _ctx.G, c = _ctx.C;
            for (int i = 0; i < n; i++) rhs[i] = -(alpha * q[i] + j[i] - hist[i]);
            for (int s = 0; s < _matrix.Length; s++) _matrix[s] = alpha * c[s] + g[s];
            if (it > 0 && !_ctx.Limited && ResidualNegligible(x, rel)) return true; // Q and J are already at x
            _stats.NewtonIterations++;
            // Reuse the factorisation when the matrix is bit-for-bit the one factored last (linear parts at constant h).
            if (!_factorValid || !_matrix.AsSpan().SequenceEqual(_factored))
            {
                _factorValid = false;
                if (!_solver.Factor(_matrix)) return false;
                Array.Copy(_matrix, _factored, _matrix.Length);
                _factorValid = true;
            }
            _solver.Solve(rhs);
            DampCorrection();
            bool converged = !_ctx.Limited;
            for (int i = 0; i < n; i++)
            {
                double xi = x[i], d = rhs[i], xn = xi + d;
                if (!double.IsFinite(xn)) return false;
                x[i] = xn;
                double tol = rel * Math.Max(Math.Abs(xi), Math.Abs(xn)) + _newtonAtol[i];
                _lastDelta[i] = Math.Abs(d) / tol;
                if (Math.Abs(d) > tol) converged = false;
            }
            _ctx.InitJunctions = false;
            if (converged)
            {
                Evaluate(x, time);
                return true;
            }
        }
        return false;
    }

    /// <summary>
    /// True when the residual (in _rhs) is so small that the Newton correction it implies is far below tolerance:
    /// every |F_i| ≤ 0.01·Σ_j |M_ij|·(0.1·rtol·|x_j| + 0.1·atol_j). A linear circuit then stops after one solve
    /// instead of solving again only to see a zero correction.
    /// </summary>
    private bool ResidualNegligible(double[] x, double rel)
    {
        double[] allowed = _allowed;
        Array.Clear(allowed);
        for (int s = 0; s < _matrix.Length; s++)
        {
            int col = _slotCol[s];
            allowed[_slotRow[s]] += Math.Abs(_matrix[s]) * (rel * Math.Abs(x[col]) + _newtonAtol[col]);
        }
        for (int i = 0; i < _n; i++)
        {
            double r = _rhs[i];
            if (!(Math.Abs(r) <= 0.01 * allowed[i])) return false;
        }
        return true;
    }

    /// <summary>Clear and load every device at <paramref name="x"/> (copied into the context when different).</summary>
    private void Evaluate(double[] x, double time)
    {
        if (!ReferenceEquals(x, _ctx.X)) Array.Copy(x, _ctx.X, _n);
        _ctx.Time = time;
        if (!_ctx.IsOperatingPoint) _ctx.SourceScale = SourceScaleAt(time);
        Array.Clear(_ctx.J);
        Array.Clear(_ctx.Q);
        Array.Clear(_ctx.G);
        Array.Clear(_ctx.C);
        foreach (Device d in _devices) d.Load(_ctx);
        if (_floatingNodes.Length > 0) LoadFloatingNodeCapacitance();
        AddContinuationCapacitance();
        if (_opGmin > 0)
        {
            int[] diag = _circuit.NodeDiagonal;
            for (int i = 0; i < _n; i++)
            {
                if (diag[i] < 0) continue;
                _ctx.G[diag[i]] += _opGmin;
                _ctx.J[i] += _opGmin * _ctx.X[i];
            }
        }
    }

    private double SourceScaleAt(double time)
    {
        if (_options.Start == StartMode.OperatingPoint) return 1.0;
        double ramp = _options.SupplyRamp;
        return ramp > 0 && time < ramp ? Math.Max(0.0, time / ramp) : 1.0;
    }

    // ---------------------------------------------------------------- error control

    private void SetTolerances()
    {
        // A branch row is a state (inductor current) when some ∂q/∂x entry of the row is nonzero.
        var rowHasCharge = _rowHasCharge;
        for (int s = 0; s < _slotRow.Length; s++)
            if (_ctx.C[s] != 0.0) rowHasCharge[_slotRow[s]] = true;
        for (int i = 0; i < _n; i++)
        {
            bool branch = _circuit.Kinds[i] == UnknownKind.Branch;
            _atol[i] = branch ? _options.CurrentTolerance : _options.VoltageTolerance;
            // Only unknowns that carry state (a row with charge: capacitor nodes, inductor currents) are in the error
            // norm. An algebraic node (no capacitance) follows the states through Newton; its value can change as fast
            // as a saturating junction, and holding it to a truncation-error bound stalls the step at h_min.
            _inNorm[i] = rowHasCharge[i];
            _newtonAtol[i] = 0.1 * _atol[i];
        }
    }

    /// <summary>True when the start state satisfies every row without charge exactly (a consistent initial state:
    /// then TR-BDF2 can start at once; otherwise a backward-Euler step first settles the algebraic unknowns).</summary>
    private bool AlgebraicRowsSatisfied()
    {
        for (int i = 0; i < _n; i++)
            if (!_rowHasCharge[i] && Math.Abs(_ctx.J[i]) > 1e-15) return false;
        return true;
    }

    /// <summary>Max norm of the filtered estimate over state unknowns, weighted by rtol·|x| + atol (the nodes of a floating
    /// group against the group's anchor).</summary>
    private double ErrorNorm()
    {
        double r = 0;
        double rtol = _options.RelativeTolerance;
        for (int i = 0; i < _n; i++)
        {
            if (!_inNorm[i]) continue;
            double ei = _err[i], xi = _x[i], xn = _xNew[i];
            int anchor = _groupAnchor.Length > 0 ? _groupAnchor[i] : -1;
            if (anchor >= 0)
            {
                // A floating group's common mode (its potential against ground, held only by the floor capacitance) is
                // not a circuit quantity and its solution is noisy while the rectifier is off (a 4 700 µF capacitor
                // beside a 10 pF floor: condition ~10^8); measure the group's nodes against its anchor instead, value
                // and weight alike.
                if (anchor == i) continue;
                ei -= _err[anchor];
                xi -= _x[anchor];
                xn -= _xNew[anchor];
            }
            double w = rtol * Math.Max(Math.Abs(xi), Math.Abs(xn)) + _atol[i];
            double e = Math.Abs(ei) / w;
            if (!(e <= r)) r = e; // NaN propagates as a rejection
        }
        return r;
    }

    // ---------------------------------------------------------------- breakpoints

    /// <summary>
    /// True when the sources jump at <paramref name="t"/> (an ideal edge) rather than only changing slope: the change of
    /// j(x_n, ·) over [t, t + δ] is compared with its changes over [t + δ, t + 2δ] and [t − δ, t]. A slope gives
    /// changes of the same size; a jump gives one change far larger than its neighbours. The change before t matters
    /// when the landed time is a rounding short of a ramp's corner: the step after it then holds a sliver of the ramp
    /// and none after, which is no jump.
    /// </summary>
    private bool SourcesJumpAt(double t)
    {
        double delta = Math.Max(1e-15, 64.0 * (Math.BitIncrement(Math.Max(Math.Abs(t), 1e-300)) - Math.Abs(t)));
        Evaluate(_x, t);
        Array.Copy(_ctx.J, _rhs, _n);
        Evaluate(_x, t + delta);
        Array.Copy(_ctx.J, _err, _n);
        Evaluate(_x, t + 2.0 * delta);
        bool jump = false;
        double[] d = _jumpProbe;
        for (int i = 0; i < _n; i++)
        {
            double d1 = _err[i] - _rhs[i];
            double d2 = _ctx.J[i] - _err[i];
            d[i] = Math.Abs(d1) > 10.0 * _newtonAtol[i] && Math.Abs(d1 - d2) > 0.5 * Math.Abs(d1) ? d1 : 0.0;
            jump |= d[i] != 0.0;
        }
        if (!jump) return false;
        // The change just before t, on the rows whose change after t looked like a jump.
        Evaluate(_x, t - delta);
        for (int i = 0; i < _n; i++)
            if (d[i] != 0.0 && Math.Abs(d[i]) > 4.0 * Math.Abs(_rhs[i] - _ctx.J[i])) return true;
        return false;
    }

    private double NextBreakpoint(double t)
    {
        double tiny = 4.0 * (Math.BitIncrement(Math.Max(Math.Abs(t), 1e-300)) - Math.Abs(t)) + 1e-15;
        double bp = _stop;
        if (_options.Start == StartMode.PowerUp && _options.SupplyRamp > 0 && t < _options.SupplyRamp - tiny) bp = Math.Min(bp, _options.SupplyRamp);
        foreach (Device d in _devices)
        {
            double b = d.NextBreakpoint(t);
            if (b <= t + tiny) b = d.NextBreakpoint(t + tiny);
            if (b > t + tiny && b < bp) bp = b;
        }
        if (_light is not null)
        {
            double b = _light.NextBreakpoint(t);
            if (b <= t + tiny) b = _light.NextBreakpoint(t + tiny);
            if (b > t + tiny && b < bp) bp = b;
        }
        double r = _requested.NextAfter(t + tiny);
        return Math.Min(Math.Min(bp, r), Math.Min(EnvelopeBoundaryAfter(t, tiny), MainsSwitchAfter(t, tiny)));
    }

    // ---------------------------------------------------------------- recorder and diagnostics

    private TraceRecorder BuildRecorder(double stop)
    {
        var indices = new List<int>();
        var names = new List<string>();
        var units = new List<string>();
        if (_options.RecordNodes is { } wanted)
        {
            foreach (string name in wanted)
            {
                int i = _circuit.IndexOf(name);
                if (i < 0 && !CircuitSetup.IsGround(name)) throw new ArgumentException($"cannot record '{name}': no such node or branch in the circuit", nameof(_options));
                indices.Add(i);
                names.Add(name);
                units.Add(i >= 0 && _circuit.Kinds[i] == UnknownKind.Branch ? "A" : "V");
            }
        }
        else
        {
            for (int i = 0; i < _n; i++)
            {
                if (_circuit.Kinds[i] != UnknownKind.Node) continue;
                indices.Add(i);
                names.Add(_circuit.Labels[i]);
                units.Add("V");
            }
        }
        return new TraceRecorder(indices, names, units, 0.0, stop, _options.TraceBuckets, TraceBuffers);
    }

    /// <summary>The failure with the values of its worst unknowns at the last accepted point and the parts on them.</summary>
    private SimulationFailure DescribeFailure(SimulationFailure f)
    {
        var values = new List<double>();
        var nodes = new HashSet<string>(StringComparer.Ordinal);
        foreach (string name in f.WorstNodes)
        {
            int i = _circuit.IndexOf(name);
            values.Add(i >= 0 ? _x[i] : double.NaN);
            nodes.Add(name);
        }
        var parts = new List<string>();
        foreach (Device d in _devices)
            if (d.Nodes.Any(nodes.Contains) && !parts.Contains(d.PartId)) parts.Add(d.PartId);
        return f with { WorstValues = values, Parts = parts };
    }

    private List<string> WorstUnknowns()
    {
        var order = Enumerable.Range(0, _n).Where(i => _lastDelta[i] > 1.0 || double.IsNaN(_lastDelta[i]))
            .OrderByDescending(i => double.IsNaN(_lastDelta[i]) ? double.MaxValue : _lastDelta[i]).Take(3);
        return order.Select(i => _circuit.Labels[i]).ToList();
    }
}
