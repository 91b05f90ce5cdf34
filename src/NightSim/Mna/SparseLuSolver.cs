namespace NightSim.Mna;

/// <summary>
/// Sparse LU for small MNA matrices (20–200 unknowns) with a pivot order chosen once and numeric refactorisation on
/// the fixed pattern.
/// </summary>
/// <remarks>
/// <para><b>Analysis</b> (on the values of the first matrix, and again whenever a pivot goes bad): Markowitz ordering
/// (Markowitz 1957) — at each elimination step choose, among entries that pass the threshold test
/// |a_ij| ≥ u·max_i|a_ij| in their reduced column (u = 0.1, threshold partial pivoting, Duff–Erisman–Reid §7.8),
/// the one with the smallest (r_i − 1)(c_j − 1), ties broken by the larger |a_ij| relative to its column.
/// The elimination runs on a dense work copy (n ≤ a few hundred), recording fill-in. The result is compiled into
/// flat operation lists: per pivot k the positions of its L column, of its U row, and of every update target
/// a[t] −= l·u (the idea of a symbolically generated elimination, Gustavson, Liniger &amp; Willoughby 1970).</para>
/// <para><b>Refactorisation</b> replays those lists on new values without any search; each pivot is checked
/// against the pivot it had at analysis time, relative to its original column size: if it fell by more than 10³
/// (or is zero / not finite), the matrix is analysed again on the current values (re-pivot).</para>
/// <para><b>Solve</b>: forward substitution by L columns, back substitution by U rows, in pivot order.</para>
/// </remarks>
public sealed class SparseLuSolver : ILinearSolver
{
    private const double Threshold = 0.1;
    private const double PivotDrop = 1e-3;

    private readonly int _n;
    private readonly int[] _slotRow;
    private readonly int[] _slotCol;
    private readonly double[] _colScale;
    private readonly double[] _y;

    // Compiled factorisation (rebuilt by Analyze).
    private int[] _pivRow = [];
    private int[] _pivCol = [];
    private int[] _slotPos = [];
    private int[] _diagPos = [];
    private int[] _lStart = [];
    private int[] _lPos = [];
    private int[] _lRow = [];
    private int[] _uStart = [];
    private int[] _uPos = [];
    private int[] _uCol = [];
    private int[] _opTarget = [];
    private double[] _pivotRatio = [];
    private double[] _lu = [];
    private bool _analysed;

    public SparseLuSolver(SparsityPattern pattern)
    {
        _n = pattern.Size;
        _slotRow = [.. pattern.Rows];
        _slotCol = [.. pattern.Cols];
        _colScale = new double[_n];
        _y = new double[_n];
    }

    public int Size => _n;
    public int Factorizations { get; private set; }
    public int Analyses { get; private set; }

    /// <summary>Entries of L and U (fill included) in the current compiled factorisation.</summary>
    public int FactorNonzeros => _lu.Length;

    public bool Factor(ReadOnlySpan<double> values)
    {
        Factorizations++;
        if (_analysed && Refactor(values)) return true;
        return Analyze(values) && Refactor(values);
    }

    private bool Refactor(ReadOnlySpan<double> values)
    {
        double[] lu = _lu;
        Array.Clear(lu);
        Array.Clear(_colScale);
        for (int s = 0; s < _slotPos.Length; s++)
        {
            double v = values[s];
            lu[_slotPos[s]] += v;
            double av = Math.Abs(v);
            int c = _slotCol[s];
            if (av > _colScale[c]) _colScale[c] = av;
        }
        int op = 0;
        for (int k = 0; k < _n; k++)
        {
            double piv = lu[_diagPos[k]];
            double scale = _colScale[_pivCol[k]];
            double ratio = scale > 0 ? Math.Abs(piv) / scale : 0.0;
            if (piv == 0.0 || !double.IsFinite(piv) || ratio < PivotDrop * _pivotRatio[k]) return false;
            int l0 = _lStart[k], l1 = _lStart[k + 1], u0 = _uStart[k], u1 = _uStart[k + 1];
            double inv = 1.0 / piv;
            for (int li = l0; li < l1; li++)
            {
                int lp = _lPos[li];
                double l = lu[lp] * inv;
                lu[lp] = l;
                for (int ui = u0; ui < u1; ui++) lu[_opTarget[op++]] -= l * lu[_uPos[ui]];
            }
        }
        return true;
    }

    public void Solve(Span<double> rhs)
    {
        double[] y = _y, lu = _lu;
        int n = _n;
        for (int k = 0; k < n; k++) y[k] = rhs[_pivRow[k]];
        for (int k = 0; k < n; k++)
        {
            double yk = y[k];
            if (yk == 0.0) continue;
            for (int li = _lStart[k]; li < _lStart[k + 1]; li++) y[_lRow[li]] -= lu[_lPos[li]] * yk;
        }
        for (int k = n - 1; k >= 0; k--)
        {
            double s = y[k];
            for (int ui = _uStart[k]; ui < _uStart[k + 1]; ui++) s -= lu[_uPos[ui]] * y[_uCol[ui]];
            y[k] = s / lu[_diagPos[k]];
        }
        for (int k = 0; k < n; k++) rhs[_pivCol[k]] = y[k];
    }

    /// <summary>Choose the pivot order on the current values and compile the operation lists.</summary>
    private bool Analyze(ReadOnlySpan<double> values)
    {
        Analyses++;
        int n = _n;
        var w = new double[n * n];
        var s = new bool[n * n];
        var colScale = new double[n];
        for (int k = 0; k < _slotRow.Length; k++)
        {
            int i = _slotRow[k], j = _slotCol[k];
            w[i * n + j] += values[k];
            s[i * n + j] = true;
        }
        for (int k = 0; k < _slotRow.Length; k++)
        {
            double av = Math.Abs(values[k]);
            if (av > colScale[_slotCol[k]]) colScale[_slotCol[k]] = av;
        }
        var rowCount = new int[n];
        var colCount = new int[n];
        for (int i = 0; i < n; i++)
            for (int j = 0; j < n; j++)
                if (s[i * n + j]) { rowCount[i]++; colCount[j]++; }
        var rowDone = new bool[n];
        var colDone = new bool[n];
        var pivRow = new int[n];
        var pivCol = new int[n];
        var pivotRatio = new double[n];
        var colMax = new double[n];

        for (int k = 0; k < n; k++)
        {
            for (int j = 0; j < n; j++)
            {
                colMax[j] = 0;
                if (colDone[j]) continue;
                for (int i = 0; i < n; i++)
                    if (!rowDone[i] && s[i * n + j]) colMax[j] = Math.Max(colMax[j], Math.Abs(w[i * n + j]));
            }
            int bi = -1, bj = -1;
            long bestCost = long.MaxValue;
            double bestRel = 0;
            for (int i = 0; i < n; i++)
            {
                if (rowDone[i]) continue;
                for (int j = 0; j < n; j++)
                {
                    if (colDone[j] || !s[i * n + j]) continue;
                    double av = Math.Abs(w[i * n + j]);
                    if (av == 0.0 || !double.IsFinite(av) || av < Threshold * colMax[j]) continue;
                    long cost = (long)(rowCount[i] - 1) * (colCount[j] - 1);
                    double rel = av / colMax[j];
                    if (cost < bestCost || (cost == bestCost && rel > bestRel))
                    {
                        bestCost = cost; bestRel = rel; bi = i; bj = j;
                    }
                }
            }
            if (bi < 0) { _analysed = false; return false; }
            pivRow[k] = bi;
            pivCol[k] = bj;
            double piv = w[bi * n + bj];
            pivotRatio[k] = colScale[bj] > 0 ? Math.Abs(piv) / colScale[bj] : 0;
            rowDone[bi] = true;
            colDone[bj] = true;
            for (int j = 0; j < n; j++) if (s[bi * n + j]) colCount[j]--;
            for (int i = 0; i < n; i++) if (s[i * n + bj]) rowCount[i]--;
            for (int i = 0; i < n; i++)
            {
                if (rowDone[i] || !s[i * n + bj]) continue;
                double l = w[i * n + bj] / piv;
                for (int j = 0; j < n; j++)
                {
                    if (colDone[j] || !s[bi * n + j]) continue;
                    w[i * n + j] -= l * w[bi * n + j];
                    if (!s[i * n + j])
                    {
                        s[i * n + j] = true;
                        rowCount[i]++;
                        colCount[j]++;
                    }
                }
            }
        }

        // Compile: positions of every structural entry in pivot order.
        var rowRank = new int[n];
        var colRank = new int[n];
        for (int k = 0; k < n; k++) { rowRank[pivRow[k]] = k; colRank[pivCol[k]] = k; }
        var pos = new int[n * n];
        Array.Fill(pos, -1);
        int count = 0;
        for (int a = 0; a < n; a++)
            for (int b = 0; b < n; b++)
                if (s[pivRow[a] * n + pivCol[b]]) pos[a * n + b] = count++;
        var lStart = new int[n + 1];
        var uStart = new int[n + 1];
        var lPos = new List<int>();
        var lRow = new List<int>();
        var uPos = new List<int>();
        var uCol = new List<int>();
        var ops = new List<int>();
        var diag = new int[n];
        for (int k = 0; k < n; k++)
        {
            diag[k] = pos[k * n + k];
            lStart[k] = lPos.Count;
            uStart[k] = uPos.Count;
            for (int a = k + 1; a < n; a++)
                if (pos[a * n + k] >= 0) { lPos.Add(pos[a * n + k]); lRow.Add(a); }
            for (int b = k + 1; b < n; b++)
                if (pos[k * n + b] >= 0) { uPos.Add(pos[k * n + b]); uCol.Add(b); }
            for (int li = lStart[k]; li < lPos.Count; li++)
                for (int ui = uStart[k]; ui < uPos.Count; ui++)
                {
                    int t = pos[lRow[li] * n + uCol[ui]];
                    if (t < 0) throw new InvalidOperationException("sparse LU: fill-in position missing from the analysed pattern");
                    ops.Add(t);
                }
        }
        lStart[n] = lPos.Count;
        uStart[n] = uPos.Count;
        var slotPos = new int[_slotRow.Length];
        for (int k = 0; k < slotPos.Length; k++) slotPos[k] = pos[rowRank[_slotRow[k]] * n + colRank[_slotCol[k]]];

        _pivRow = pivRow;
        _pivCol = pivCol;
        _pivotRatio = pivotRatio;
        _slotPos = slotPos;
        _diagPos = diag;
        _lStart = lStart;
        _uStart = uStart;
        _lPos = [.. lPos];
        _lRow = [.. lRow];
        _uPos = [.. uPos];
        _uCol = [.. uCol];
        _opTarget = [.. ops];
        _lu = new double[count];
        _analysed = true;
        return true;
    }
}
