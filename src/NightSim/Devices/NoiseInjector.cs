namespace NightSim.Devices;

/// <summary>
/// Electrical noise pulses injected at one node, built from a scenario's noise events (not a netlist kind).
/// As a voltage: a pulse source coupled to the node through a small capacitance (the way interference reaches a
/// high-impedance trigger line from a neighbouring wire), so it is invisible at DC and a filter capacitor on the
/// node divides it down by C_c/(C_c + C_node). As a current: the pulse current is pushed into the node.
/// </summary>
public sealed class NoiseInjector : Device
{
    /// <summary>Default coupling capacitance for voltage pulses, farads (a few cm of parallel wiring, from memory).</summary>
    public const double DefaultCoupling = 100e-12;

    private readonly double[] _starts;
    private readonly double[] _widths;
    private readonly double[] _amplitudes;
    private readonly bool _asCurrent;
    private readonly double _coupling;
    private int _node;
    private int _source;
    private BranchSlots _branch;
    private PairSlots _cap;

    /// <param name="name">Device name.</param>
    /// <param name="node">Node the pulses are injected at.</param>
    /// <param name="starts">Pulse start times, run seconds, ascending.</param>
    /// <param name="widths">Pulse widths, seconds.</param>
    /// <param name="amplitudes">Pulse amplitudes, volts (voltage) or amperes (current); negative pulls the node down.</param>
    /// <param name="asCurrent">True: current injection; false: capacitively coupled voltage pulse.</param>
    /// <param name="coupling">Coupling capacitance for voltage pulses, farads.</param>
    public NoiseInjector(string name, string node, double[] starts, double[] widths, double[] amplitudes, bool asCurrent, double coupling = DefaultCoupling)
        : base(name, name, [node])
    {
        if (starts.Length != widths.Length || starts.Length != amplitudes.Length) throw new ArgumentException("pulse arrays differ in length");
        _starts = starts;
        _widths = widths;
        _amplitudes = amplitudes;
        _asCurrent = asCurrent;
        _coupling = coupling;
    }

    /// <summary>Edge time of a pulse as a fraction of its width (trapezoid: 10 % rise, 80 % top, 10 % fall).</summary>
    public const double EdgeFraction = 0.1;

    public override void Setup(SetupContext setup)
    {
        _node = setup.Node(Nodes[0]);
        if (_asCurrent) return;
        _source = setup.InternalNode(Name + ".src");
        _branch = setup.BranchBetween(_source, -1, Name + ".i");
        _cap = setup.Pair(_source, _node);
    }

    /// <summary>Pulse value at run time t (trapezoid per pulse; pulses do not overlap).</summary>
    public double Value(double t)
    {
        int i = Array.BinarySearch(_starts, t);
        if (i < 0) i = ~i - 1;
        if (i < 0) return 0;
        double w = _widths[i], x = t - _starts[i], edge = EdgeFraction * w;
        if (x < 0 || x > w) return 0;
        double a = _amplitudes[i];
        if (x < edge) return a * x / edge;
        if (x > w - edge) return a * (w - x) / edge;
        return a;
    }

    public override void Load(LoadContext ctx)
    {
        double v = Value(ctx.Time);
        if (_asCurrent)
        {
            // Current into the node = negative current leaving it.
            if (_node >= 0) ctx.J[_node] -= v;
            return;
        }
        _branch.Load(ctx);
        ctx.J[_branch.K] -= v;
        double dv = ctx.X[_source] - ctx.V(_node);
        ctx.AddCharge(_source, _node, _coupling * dv);
        _cap.Add(ctx.C, _coupling);
    }

    public override double NextBreakpoint(double time)
    {
        int i = Array.BinarySearch(_starts, time);
        if (i < 0) i = ~i - 1;
        for (int k = Math.Max(0, i); k < _starts.Length; k++)
        {
            double s = _starts[k], w = _widths[k], e = EdgeFraction * w;
            if (s > time) return s;
            if (s + e > time) return s + e;
            if (s + w - e > time) return s + w - e;
            if (s + w > time) return s + w;
        }
        return double.PositiveInfinity;
    }
}
