using MathNet.Numerics.LinearAlgebra;
using NightSim.Mna;
using NightSim.Tests.Fixtures;

namespace NightSim.Tests.Mna;

/// <summary>The sparse LU against MathNet.Numerics' dense LU (a general-purpose reference library).</summary>
public sealed class SparseLuTests
{
    /// <summary>An MNA-like random matrix: conductance stamps between random node pairs (to ground too) spanning
    /// <paramref name="decades"/> decades, and voltage-source rows with zero diagonal. The 1e-12 comparison needs
    /// well-conditioned matrices (two backward-stable solvers differ by ≈ cond·ε).</summary>
    internal static (SparsityPattern Pattern, double[] Values) RandomMna(SeededRandom rng, int nodes, int sources, double decades = 2)
    {
        int n = nodes + sources;
        var entries = new Dictionary<(int, int), double>();
        void Add(int r, int c, double v)
        {
            if (r < 0 || c < 0) return;
            entries[(r, c)] = entries.GetValueOrDefault((r, c)) + v;
        }
        // A spanning chain keeps the matrix nonsingular; extra random elements add coupling.
        for (int i = 0; i < nodes; i++)
        {
            int a = i, b = i == 0 ? -1 : (int)rng.NextInt(i);
            int elements = 1 + (int)rng.NextInt(3);
            for (int e = 0; e < elements; e++)
            {
                if (e > 0) b = (int)rng.NextInt(nodes + 1) - 1;
                if (b == a) continue;
                double g = Math.Pow(10, decades * (rng.NextDouble() - 0.5));
                Add(a, a, g); Add(b, b, g); Add(a, b, -g); Add(b, a, -g);
            }
        }
        // Sources: distinct positive nodes, each tied to ground or a lower-numbered node, so the sources form a
        // forest (no loop of voltage sources, which would be singular).
        var used = new HashSet<int>();
        for (int s = 0; s < sources; s++)
        {
            int k = nodes + s;
            int p;
            do p = (int)rng.NextInt(nodes); while (!used.Add(p));
            int m = (int)rng.NextInt(p + 1) - 1;
            Add(p, k, 1); Add(m, k, -1); Add(k, p, 1); Add(k, m, -1);
        }
        var list = entries.Keys.ToList();
        var pattern = SparsityPattern.From(n, list);
        var values = new double[pattern.Count];
        for (int i = 0; i < list.Count; i++) values[pattern.Find(list[i].Item1, list[i].Item2)] = entries[list[i]];
        return (pattern, values);
    }

    [Fact]
    public void Should_Equal_MathNet_Dense_Lu_On_200_Random_Mna_Matrices()
    {
        var rng = new SeededRandom(20261202); // reported seed
        double worst = 0;
        for (int trial = 0; trial < 200; trial++)
        {
            int nodes = 10 + (int)rng.NextInt(150);
            int sources = 1 + (int)rng.NextInt(Math.Min(40, nodes / 3));
            var (pattern, values) = RandomMna(rng, nodes, sources);
            int n = pattern.Size;
            var dense = Matrix<double>.Build.Dense(n, n);
            for (int s = 0; s < pattern.Count; s++) dense[pattern.Rows[s], pattern.Cols[s]] += values[s];
            var b = new double[n];
            for (int i = 0; i < n; i++) b[i] = rng.NextDouble() * 2 - 1;
            var reference = dense.LU().Solve(Vector<double>.Build.DenseOfArray(b));

            var lu = new SparseLuSolver(pattern);
            Assert.True(lu.Factor(values), $"trial {trial}: reported singular");
            var x = (double[])b.Clone();
            lu.Solve(x);
            double err = 0, norm = 0;
            for (int i = 0; i < n; i++)
            {
                err = Math.Max(err, Math.Abs(x[i] - reference[i]));
                norm = Math.Max(norm, Math.Abs(reference[i]));
            }
            Assert.True(err <= 1e-12 * norm, $"trial {trial} (n = {n}): max difference {err:E3} against |x| {norm:E3}");
            worst = Math.Max(worst, err / norm);

            // Refactorisation on the fixed pattern with new values (scaled, perturbed) must still agree.
            for (int s = 0; s < values.Length; s++) values[s] *= 1 + 0.01 * (rng.NextDouble() - 0.5);
            dense.Clear();
            for (int s = 0; s < pattern.Count; s++) dense[pattern.Rows[s], pattern.Cols[s]] += values[s];
            reference = dense.LU().Solve(Vector<double>.Build.DenseOfArray(b));
            Assert.True(lu.Factor(values));
            x = (double[])b.Clone();
            lu.Solve(x);
            err = 0; norm = 0;
            for (int i = 0; i < n; i++)
            {
                err = Math.Max(err, Math.Abs(x[i] - reference[i]));
                norm = Math.Max(norm, Math.Abs(reference[i]));
            }
            Assert.True(err <= 1e-12 * norm, $"trial {trial} refactor: max difference {err:E3}");
        }
    }

    [Fact]
    public void Should_Repivot_When_A_Pivot_Vanishes()
    {
        // [[a, 1], [1, 0]] analysed with a = 1 chooses a as first pivot... then a → 0 forces a new order.
        var pattern = SparsityPattern.From(2, [(0, 0), (0, 1), (1, 0), (1, 1)]);
        var lu = new SparseLuSolver(pattern);
        Assert.True(lu.Factor([4.0, 1.0, 1.0, 3.0]));
        Assert.True(lu.Factor([0.0, 1.0, 1.0, 3.0]));
        Assert.Equal(2, lu.Analyses);
        double[] x = [1.0, 2.0];
        lu.Solve(x);
        // 0·x0 + x1 = 1; x0 + 3x1 = 2 → x1 = 1, x0 = −1.
        Assert.Equal(-1.0, x[0], 14);
        Assert.Equal(1.0, x[1], 14);
    }

    [Fact]
    public void Should_Report_A_Singular_Matrix()
    {
        var pattern = SparsityPattern.From(2, [(0, 0), (0, 1), (1, 0), (1, 1)]);
        Assert.False(new SparseLuSolver(pattern).Factor([0.0, 0.0, 0.0, 0.0]));
        Assert.False(new DenseLuSolver(pattern).Factor([0.0, 0.0, 0.0, 0.0]));
    }

    [Fact]
    public void Dense_Lu_Should_Equal_MathNet_Too()
    {
        var rng = new SeededRandom(7);
        var (pattern, values) = RandomMna(rng, 30, 5);
        int n = pattern.Size;
        var dense = Matrix<double>.Build.Dense(n, n);
        for (int s = 0; s < pattern.Count; s++) dense[pattern.Rows[s], pattern.Cols[s]] += values[s];
        var b = Enumerable.Range(0, n).Select(i => Math.Sin(i + 1.0)).ToArray();
        var reference = dense.LU().Solve(Vector<double>.Build.DenseOfArray(b));
        var lu = new DenseLuSolver(pattern);
        Assert.True(lu.Factor(values));
        lu.Solve(b);
        for (int i = 0; i < n; i++) Assert.True(Math.Abs(b[i] - reference[i]) <= 1e-12 * reference.AbsoluteMaximum());
    }
}
