using MathNet.Numerics.LinearAlgebra;
using NightSim.Mna;

namespace NightSim.Tests.Mna;

/// <summary>The sparse LU's analysis and factorisation grow with the entries of the matrix, not with n².</summary>
public sealed class SparseLuScalingTests
{
    /// <summary>Nodal matrix of an RC ladder after a time step: series conductance g between node i and i+1, a
    /// capacitor's α·C to ground on every node, a voltage-source branch row on node 0.</summary>
    private static (SparsityPattern Pattern, double[] Values) Ladder(int nodes)
    {
        var entries = new Dictionary<(int, int), double>();
        void Add(int r, int c, double v) => entries[(r, c)] = entries.GetValueOrDefault((r, c)) + v;
        const double g = 1e-3, cap = 1e-9 / 1e-3;
        for (int i = 0; i < nodes; i++)
        {
            Add(i, i, cap);
            if (i + 1 < nodes) { Add(i, i, g); Add(i + 1, i + 1, g); Add(i, i + 1, -g); Add(i + 1, i, -g); }
        }
        Add(nodes - 1, nodes - 1, g); // end resistor to ground
        int b = nodes; // source branch: V(node 0) = 5
        Add(0, b, 1); Add(b, 0, 1);
        var list = entries.Keys.ToList();
        var pattern = SparsityPattern.From(nodes + 1, list);
        var values = new double[pattern.Count];
        for (int k = 0; k < list.Count; k++) values[pattern.Find(list[k].Item1, list[k].Item2)] = entries[list[k]];
        return (pattern, values);
    }

    [Fact]
    public void Ladder_Work_Grows_Linearly_With_Part_Count()
    {
        var counters = new List<(int N, long Analysis, int Nonzeros, int Ops)>();
        foreach (int nodes in new[] { 500, 2000, 8000 })
        {
            var (pattern, values) = Ladder(nodes);
            var lu = new SparseLuSolver(pattern);
            Assert.True(lu.Factor(values));
            Assert.True(lu.Factor(values)); // replayed refactorisation, no new analysis
            Assert.Equal(1, lu.Analyses);
            counters.Add((nodes, lu.AnalysisWork, lu.FactorNonzeros, lu.FactorOperations));
        }
        for (int k = 1; k < counters.Count; k++)
        {
            // 4× the parts: a tridiagonal ladder eliminated in a good order has no fill, so every counter grows
            // 4× (within 10 %); the former dense analysis grew 64× (n³) and its work arrays 16× (n²).
            double size = (double)counters[k].N / counters[k - 1].N;
            Assert.InRange(counters[k].Analysis / (double)counters[k - 1].Analysis, 0.9 * size, 1.1 * size);
            Assert.InRange(counters[k].Nonzeros / (double)counters[k - 1].Nonzeros, 0.9 * size, 1.1 * size);
            Assert.InRange(counters[k].Ops / (double)counters[k - 1].Ops, 0.9 * size, 1.1 * size);
        }
        // No fill: L and U hold exactly the matrix's own entries (Markowitz order on a tree-structured graph).
        var (p, _) = Ladder(500);
        Assert.Equal(p.Count, counters[0].Nonzeros);
    }

    [Fact]
    public void Ladder_Solution_Equals_MathNet_Dense_Lu()
    {
        // MathNet.Numerics' dense LU (a general-purpose reference library) on the same 400-node ladder.
        var (pattern, values) = Ladder(400);
        int n = pattern.Size;
        var dense = Matrix<double>.Build.Dense(n, n);
        for (int s = 0; s < pattern.Count; s++) dense[pattern.Rows[s], pattern.Cols[s]] += values[s];
        var b = Enumerable.Range(0, n).Select(i => Math.Cos(0.1 * i)).ToArray();
        var reference = dense.LU().Solve(Vector<double>.Build.DenseOfArray(b));
        var lu = new SparseLuSolver(pattern);
        Assert.True(lu.Factor(values));
        lu.Solve(b);
        double norm = reference.AbsoluteMaximum();
        for (int i = 0; i < n; i++) Assert.True(Math.Abs(b[i] - reference[i]) <= 1e-12 * norm, $"x[{i}]: {b[i]} vs {reference[i]}");
    }
}
