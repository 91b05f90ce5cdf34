using NightSim.Devices;

namespace NightSim.Tests.Devices;

/// <summary>A minimal <see cref="SetupContext"/> for stamp tests: named nodes first, then branches/internal nodes in
/// reservation order; slots are numbered as reserved.</summary>
internal sealed class StampHarness : SetupContext
{
    private readonly List<string> _unknowns = [];
    private readonly Dictionary<(int Row, int Col), int> _slots = [];

    public StampHarness(params string[] nodes) => _unknowns.AddRange(nodes);

    public int Unknowns => _unknowns.Count;

    public int SlotCount => _slots.Count;

    public IReadOnlyList<string> Labels => _unknowns;

    public override int Node(string name) => name == "gnd" ? -1 : _unknowns.IndexOf(name) is var i and >= 0 ? i : throw new KeyNotFoundException(name);

    public override int Branch(string label)
    {
        _unknowns.Add(label);
        return _unknowns.Count - 1;
    }

    public override int InternalNode(string label) => Branch(label);

    public override int Slot(int row, int col)
    {
        if (row < 0 || col < 0) return -1;
        if (!_slots.TryGetValue((row, col), out int s))
        {
            s = _slots.Count;
            _slots[(row, col)] = s;
        }
        return s;
    }

    public override int LightChannel(string name) => -1;

    /// <summary>Set up the device, load it at x and time t, return the context.</summary>
    public LoadContext Load(Device device, double[] x, double time = 0)
    {
        var ctx = new LoadContext(Unknowns, SlotCount) { Time = time };
        x.CopyTo(ctx.X, 0);
        device.Load(ctx);
        return ctx;
    }

    /// <summary>Matrix entry (row, col) of a slot-indexed array; 0 when the slot was never reserved.</summary>
    public double At(double[] values, int row, int col) => _slots.TryGetValue((row, col), out int s) ? values[s] : 0.0;

    /// <summary>Checks G = ∂J/∂x and C = ∂Q/∂x against central finite differences at x (relative 1e-6).</summary>
    public void AssertJacobians(Device device, double[] x, double time = 0)
    {
        LoadContext at = Load(device, x, time);
        for (int col = 0; col < Unknowns; col++)
        {
            double h = 1e-6 * Math.Max(1.0, Math.Abs(x[col]));
            double[] xp = (double[])x.Clone();
            double[] xm = (double[])x.Clone();
            xp[col] += h;
            xm[col] -= h;
            LoadContext plus = Load(device, xp, time);
            LoadContext minus = Load(device, xm, time);
            for (int row = 0; row < Unknowns; row++)
            {
                double dj = (plus.J[row] - minus.J[row]) / (2 * h);
                double dq = (plus.Q[row] - minus.Q[row]) / (2 * h);
                double g = At(at.G, row, col);
                double c = At(at.C, row, col);
                Assert.True(Math.Abs(dj - g) <= 1e-6 * Math.Max(1e-9, Math.Abs(dj)) + 1e-12,
                    $"G[{_unknowns[row]},{_unknowns[col]}] = {g}, finite difference {dj}");
                Assert.True(Math.Abs(dq - c) <= 1e-6 * Math.Max(1e-9, Math.Abs(dq)) + 1e-15,
                    $"C[{_unknowns[row]},{_unknowns[col]}] = {c}, finite difference {dq}");
            }
        }
    }
}
