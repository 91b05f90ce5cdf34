namespace NightSim.Mna;

/// <summary>
/// Dense LU with partial (row) pivoting, Doolittle form in place (Golub &amp; Van Loan, Matrix Computations, alg. 3.4.1).
/// The reference solver: simple and robust, adequate up to ≈ 30 unknowns.
/// </summary>
public sealed class DenseLuSolver : ILinearSolver
{
    private readonly int _n;
    private readonly int[] _rows;
    private readonly int[] _cols;
    private readonly double[] _a;
    private readonly int[] _perm;
    private readonly double[] _work;

    public DenseLuSolver(SparsityPattern pattern)
    {
        _n = pattern.Size;
        _rows = [.. pattern.Rows];
        _cols = [.. pattern.Cols];
        _a = new double[_n * _n];
        _perm = new int[_n];
        _work = new double[_n];
    }

    public int Size => _n;
    public int Factorizations { get; private set; }
    public int Analyses => 0;

    public bool Factor(ReadOnlySpan<double> values)
    {
        int n = _n;
        double[] a = _a;
        Array.Clear(a);
        for (int s = 0; s < _rows.Length; s++) a[_rows[s] * n + _cols[s]] += values[s];
        for (int i = 0; i < n; i++) _perm[i] = i;
        Factorizations++;
        for (int k = 0; k < n; k++)
        {
            int p = k;
            double max = Math.Abs(a[k * n + k]);
            for (int i = k + 1; i < n; i++)
            {
                double v = Math.Abs(a[i * n + k]);
                if (v > max) { max = v; p = i; }
            }
            if (max == 0.0 || !double.IsFinite(max)) return false;
            if (p != k)
            {
                for (int j = 0; j < n; j++) (a[k * n + j], a[p * n + j]) = (a[p * n + j], a[k * n + j]);
                (_perm[k], _perm[p]) = (_perm[p], _perm[k]);
            }
            double piv = a[k * n + k];
            for (int i = k + 1; i < n; i++)
            {
                double l = a[i * n + k];
                if (l == 0.0) continue;
                l /= piv;
                a[i * n + k] = l;
                for (int j = k + 1; j < n; j++) a[i * n + j] -= l * a[k * n + j];
            }
        }
        return true;
    }

    public void Solve(Span<double> rhs)
    {
        int n = _n;
        double[] a = _a, y = _work;
        for (int i = 0; i < n; i++) y[i] = rhs[_perm[i]];
        for (int i = 0; i < n; i++)
        {
            double s = y[i];
            for (int j = 0; j < i; j++) s -= a[i * n + j] * y[j];
            y[i] = s;
        }
        for (int i = n - 1; i >= 0; i--)
        {
            double s = y[i];
            for (int j = i + 1; j < n; j++) s -= a[i * n + j] * y[j];
            y[i] = s / a[i * n + i];
        }
        for (int i = 0; i < n; i++) rhs[i] = y[i];
    }
}
