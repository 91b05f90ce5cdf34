using NightSim.Mna;

namespace NightSim.Transient;

/// <summary>
/// Nodes with no path to ground at power-up (the DC side of a bridge rectifier when the mains neutral is the ground):
/// every path from them to ground runs through a junction, which is off near each zero crossing. Their common-mode
/// voltage is then set only by leakage and gmin — a near-singular algebraic mode that Newton cannot resolve at the
/// moment the rectifier stops conducting. A real board has a small capacitance to earth; the solver gives each such
/// group of such nodes <see cref="TransientOptions.FloatingNodeCapacitance"/> to ground on its stiffest node, so the
/// mode holds its charge while the rectifier is off. Nodes with a resistive, source or capacitive path to ground are left as they are.
/// </summary>
/// <remarks>
/// A minimum capacitance from every such node to ground is a usual aid of transient circuit solvers, beside gmin and
/// junction limiting (common practice); its value, a few picofarads, is the order of a small board's capacitance to
/// its surroundings (from memory). Measured here: without it a bridge-fed night circuit with the neutral as ground
/// stopped at the first mains peak; with it the run completes and the rail is unchanged.
/// </remarks>
public sealed partial class TransientSolver
{
    /// <summary>Conductance (S) and capacitance (F) above which a matrix entry counts as a connection.</summary>
    private const double ConnectionConductance = 1e-9;
    private const double ConnectionCapacitance = 1e-15;

    private int[] _floatingNodes = [];
    private bool[] _floorOnly = [];
    private int[] _floatingDiagonal = [];

    /// <summary>For each unknown of a floating group, the group's anchor (the node with the floor capacitance); -1 for
    /// every other unknown. The error norm measures a group's nodes against their anchor (see <see cref="ErrorNorm"/>).</summary>
    private int[] _groupAnchor = [];

    /// <summary>Node voltages that had no path to ground at power-up and carry the floor capacitance (labels).</summary>
    public IReadOnlyList<string> FloatingNodes => [.. _floatingNodes.Select(i => _circuit.Labels[i])];

    /// <summary>
    /// Find the unknowns that no conductance above 1 nS or capacitance above 1 fF ties to ground, with every junction at
    /// zero bias (rectifiers and transistors off), from the matrix entries the devices load at that point.
    /// </summary>
    private void FindFloatingNodes()
    {
        double cFloor = _options.FloatingNodeCapacitance;
        if (!(cFloor > 0) || _n == 0) return;
        var zero = new double[_n];
        bool init = _ctx.InitJunctions;
        _ctx.InitJunctions = false;
        Evaluate(zero, 0.0);
        _ctx.InitJunctions = init;
        foreach (Devices.Device d in _devices) d.PowerUp(); // undo any per-iteration memory the probe left

        var neighbours = new List<int>[_n];
        for (int i = 0; i < _n; i++) neighbours[i] = [];
        var ownCharge = new bool[_n];
        var toGroundG = new double[_n];
        var toGroundC = new double[_n];
        for (int s = 0; s < _slotRow.Length; s++)
        {
            int r = _slotRow[s], c = _slotCol[s];
            double g = _ctx.G[s], cap = _ctx.C[s];
            if (cap != 0) ownCharge[r] = true;
            if (_circuit.Kinds[c] != UnknownKind.Branch)
            {
                toGroundG[r] += g;
                toGroundC[r] += cap;
            }
            if (r != c && (Math.Abs(g) > ConnectionConductance || Math.Abs(cap) > ConnectionCapacitance))
            {
                neighbours[r].Add(c);
                neighbours[c].Add(r);
            }
        }
        var reached = new bool[_n];
        var queue = new Queue<int>();
        for (int i = 0; i < _n; i++)
        {
            if (Math.Abs(toGroundG[i]) > ConnectionConductance || Math.Abs(toGroundC[i]) > ConnectionCapacitance)
            {
                reached[i] = true;
                queue.Enqueue(i);
            }
        }
        while (queue.Count > 0)
        {
            int i = queue.Dequeue();
            foreach (int j in neighbours[i])
            {
                if (reached[j]) continue;
                reached[j] = true;
                queue.Enqueue(j);
            }
        }
        // One floor capacitance per floating group is enough to give its common mode a charge; it goes on the group's
        // stiffest node (largest own capacitance, then conductance: the smoothing capacitor's rail), so high-impedance
        // nodes of the group (sensor, trigger inputs) get no displacement current from the group's swings.
        int[] diag = _circuit.NodeDiagonal;
        var nodes = new List<int>();
        var grouped = new bool[_n];
        var members = new List<int>();
        _groupAnchor = new int[_n];
        Array.Fill(_groupAnchor, -1);
        for (int start = 0; start < _n; start++)
        {
            if (reached[start] || grouped[start]) continue;
            int best = -1;
            double bestC = -1, bestG = -1;
            grouped[start] = true;
            queue.Enqueue(start);
            members.Clear();
            while (queue.Count > 0)
            {
                int i = queue.Dequeue();
                members.Add(i);
                if (diag[i] >= 0)
                {
                    double c = Math.Abs(_ctx.C[diag[i]]), g = Math.Abs(_ctx.G[diag[i]]);
                    if (c > bestC || (c == bestC && g > bestG)) (best, bestC, bestG) = (i, c, g);
                }
                foreach (int j in neighbours[i])
                {
                    if (reached[j] || grouped[j]) continue;
                    grouped[j] = true;
                    queue.Enqueue(j);
                }
            }
            if (best < 0) continue;
            nodes.Add(best);
            foreach (int i in members)
                if (_circuit.Kinds[i] != UnknownKind.Branch) _groupAnchor[i] = best;
        }
        _floatingNodes = [.. nodes];
        _floatingDiagonal = [.. nodes.Select(i => diag[i])];
        _floorOnly = new bool[_n];
        foreach (int i in nodes) _floorOnly[i] = !ownCharge[i];
    }

    /// <summary>
    /// A floating node whose only charge is the floor capacitance stays out of the error norm (it is algebraic for the
    /// circuit; held to a truncation-error bound, a node a comparator output drives through 100 Ω would force 1 ns
    /// steps). Called right after the tolerances are set.
    /// </summary>
    private void ExcludeFloorOnlyNodesFromNorm()
    {
        foreach (int i in _floatingNodes)
            if (_floorOnly[i]) _inNorm[i] = false;
    }

    /// <summary>Add the floor capacitance of the floating nodes to Q and C (inside <see cref="Evaluate"/>).</summary>
    private void LoadFloatingNodeCapacitance()
    {
        double c = _options.FloatingNodeCapacitance;
        for (int k = 0; k < _floatingNodes.Length; k++)
        {
            int i = _floatingNodes[k];
            _ctx.Q[i] += c * _ctx.X[i];
            _ctx.C[_floatingDiagonal[k]] += c;
        }
    }
}
