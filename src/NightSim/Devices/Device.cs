namespace NightSim.Devices;

/// <summary>
/// Base of every engine device. A device owns immutable parameters (SI) and, for one run, its small per-run state
/// (junction voltages for limiting, discrete state). Each run builds its own devices, so state is never shared.
/// </summary>
/// <remarks>
/// Contract, in order: <see cref="Setup"/> once per circuit (resolve nodes, reserve branch unknowns and matrix slots;
/// every slot the device may ever touch, in every discrete state, so the sparsity pattern is fixed);
/// <see cref="PowerUp"/> at the start of a run; then per Newton iteration <see cref="Load"/>, which only ADDS
/// contributions and never changes discrete state; after each accepted step <see cref="Accept"/>.
/// Discrete state changes only in <see cref="IEventSource.OnEvent"/>.
/// Formulation (charge-oriented MNA): for every row r, F_r = d/dt Q_r(x) + J_r(x, t) = 0, where J on a node row is the
/// sum of currents leaving the node through the device and on a branch row the branch equation.
/// </remarks>
public abstract class Device
{
    protected Device(string name, string partId, IReadOnlyList<string> nodes)
    {
        Name = name;
        PartId = partId;
        Nodes = nodes;
    }

    /// <summary>Device name, unique in the circuit ("R1", or "U1.trigger" for a primitive of a composite).</summary>
    public string Name { get; }

    /// <summary>Id of the netlist part this device came from.</summary>
    public string PartId { get; }

    /// <summary>Node names of the device terminals, in the device's own pin order.</summary>
    public IReadOnlyList<string> Nodes { get; }

    /// <summary>What this device is to the analysis (light sensor, one-shot timer, relay coil, supply), or null. A
    /// composite states its part's role on one of its primitives.</summary>
    public Roles.PartRole? Role { get; init; }

    /// <summary>Resolve nodes to unknown indices, reserve branch unknowns and matrix slots.</summary>
    public abstract void Setup(SetupContext setup);

    /// <summary>Set the power-up state: discrete states to their defined start, history cleared.</summary>
    public virtual void PowerUp() { }

    /// <summary>Add J, Q, ∂J/∂x (G) and ∂Q/∂x (C) at the iterate in <paramref name="ctx"/>.</summary>
    public abstract void Load(LoadContext ctx);

    /// <summary>Commit history after an accepted step (ctx.X is the accepted solution at ctx.Time).</summary>
    public virtual void Accept(LoadContext ctx) { }

    /// <summary>The longest step the device can be followed with, seconds (+∞: no limit). A sine source returns a fraction
    /// of its period: smooth, cornerless inputs give no breakpoints and may not show in the error estimate.</summary>
    public virtual double MaxStep => double.PositiveInfinity;

    /// <summary>The first time strictly after <paramref name="time"/> at which this device has a known edge
    /// (source corners, scheduled transitions), seconds; +∞ if none.</summary>
    public virtual double NextBreakpoint(double time) => double.PositiveInfinity;
}
