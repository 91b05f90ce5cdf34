namespace NightSim.Devices;

/// <summary>
/// Allocation services for <see cref="Device.Setup"/>: node and branch unknowns, matrix slots of the fixed
/// sparsity pattern, light channels. Ground ("gnd") maps to -1 everywhere; slots touching ground are -1 and are
/// skipped by the stamping helpers.
/// </summary>
public abstract class SetupContext
{
    /// <summary>Unknown index of a circuit node by name, -1 for ground.</summary>
    public abstract int Node(string name);

    /// <summary>Reserve a new unknown that is a branch current (voltage sources, inductors, behavioural outputs).</summary>
    /// <param name="label">For messages, e.g. "V1.i".</param>
    public abstract int Branch(string label);

    /// <summary>Reserve a new internal node unknown (e.g. a diode's node behind its series resistance).</summary>
    public abstract int InternalNode(string label);

    /// <summary>Reserve the matrix position (row, col); returns its slot in the value arrays, -1 if row or col is ground.</summary>
    public abstract int Slot(int row, int col);

    /// <summary>Index of a light channel by name (default "sensor"); -1 if the run has no such channel.</summary>
    public abstract int LightChannel(string name);

    /// <summary>True when the run has a light signal (then every light sensor's channel must exist in it).</summary>
    public virtual bool HasLightSignal => false;

    /// <summary>Reserve the four slots of a conductance between nodes a and b.</summary>
    public PairSlots Pair(int a, int b) => new(Slot(a, a), Slot(a, b), Slot(b, a), Slot(b, b));

    /// <summary>Reserve a branch-current unknown between nodes a and b and the four slots that tie it to them
    /// (voltage sources, inductors, relay coils).</summary>
    public BranchSlots BranchBetween(int a, int b, string label)
    {
        int k = Branch(label);
        return new BranchSlots(a, b, k, Slot(a, k), Slot(b, k), Slot(k, a), Slot(k, b));
    }
}

/// <summary>
/// A branch current i (unknown <see cref="K"/>) flowing from node A through the element to node B: KCL terms ±i on the
/// node rows and the voltage V(A) − V(B) on the branch row, with their ±1 Jacobian entries. The element adds the rest
/// of its branch equation (−V(t) for a source, −R·i and the flux −L·i for a coil).
/// </summary>
public readonly record struct BranchSlots(int A, int B, int K, int AK, int BK, int KA, int KB)
{
    /// <summary>Add the incidence terms at the iterate in <paramref name="ctx"/>.</summary>
    public void Load(LoadContext ctx)
    {
        ctx.AddCurrent(A, B, ctx.X[K]);
        ctx.J[K] += ctx.V(A) - ctx.V(B);
        ctx.AddG(AK, 1.0);
        ctx.AddG(BK, -1.0);
        ctx.AddG(KA, 1.0);
        ctx.AddG(KB, -1.0);
    }
}

/// <summary>The four matrix slots of a two-node element; any may be -1 (ground).</summary>
public readonly record struct PairSlots(int AA, int AB, int BA, int BB)
{
    /// <summary>Add a conductance-like value g between the two nodes to matrix values m.</summary>
    public void Add(double[] m, double g)
    {
        if (AA >= 0) m[AA] += g;
        if (AB >= 0) m[AB] -= g;
        if (BA >= 0) m[BA] -= g;
        if (BB >= 0) m[BB] += g;
    }
}
