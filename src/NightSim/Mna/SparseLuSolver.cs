namespace NightSim.Mna;

/// <summary>
/// Sparse LU for MNA matrices with a pivot order chosen once and numeric refactorisation on the fixed pattern; the
/// analysis and the factorisation scale with the entries (fill included), not with n².
/// </summary>
/// <remarks>
/// <para><b>Analysis</b> (on the values of the first matrix, and again whenever a pivot goes bad): Markowitz ordering
/// (Markowitz 1957) — at each elimination step choose, among entries that pass the threshold test
/// |a_ij| ≥ u·max_i|a_ij| in their reduced column (u = 0.1, threshold partial pivoting, Duff–Erisman–Reid §7.8),
/// the one with the smallest (r_i − 1)(c_j − 1), ties broken by the larger |a_ij| relative to its column.
/// The elimination runs on sparse row maps and column sets of the active submatrix, recording fill-in. The result is compiled into
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
    private const int SearchLines = 4;

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

    /// <summary>Multiply-subtract operations of one refactorisation on the current compiled order.</summary>
    public int FactorOperations => _opTarget.Length;

    /// <summary>Entries visited by every pivot-order analysis so far (search, column maxima, elimination): the
    /// analysis cost, counted rather than timed.</summary>
    public long AnalysisWork { get; private set; }

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
    /// <remarks>The active submatrix is held as one value map per row and one row set per column, so the work grows
    /// with the entries (fill included), not with n². The pivot search visits columns and rows in order of their
    /// entry count (buckets by count) and stops once no unvisited entry can beat the best cost found: after the lines
    /// of count m every unvisited entry costs at least (m − 1)²; it also stops after <see cref="SearchLines"/> lines that
    /// held a candidate (the restricted Markowitz search of Duff, Erisman &amp; Reid, "Direct Methods for Sparse
    /// Matrices", §9.2).</remarks>
    private bool Analyze(ReadOnlySpan<double> values)
    {
        Analyses++;
        int n = _n;
        long work = 0;
        var rows = new Dictionary<int, double>[n];
        var cols = new HashSet<int>[n];
        for (int i = 0; i < n; i++) { rows[i] = []; cols[i] = []; }
        var colScale = new double[n];
        for (int k = 0; k < _slotRow.Length; k++)
        {
            int i = _slotRow[k], j = _slotCol[k];
            rows[i][j] = rows[i].GetValueOrDefault(j) + values[k];
            cols[j].Add(i);
            double av = Math.Abs(values[k]);
            if (av > colScale[j]) colScale[j] = av;
        }
        var rowBuckets = new CountBuckets(n);
        var colBuckets = new CountBuckets(n);
        for (int i = 0; i < n; i++) { rowBuckets.Set(i, rows[i].Count); colBuckets.Set(i, cols[i].Count); }

        var pivRow = new int[n];
        var pivCol = new int[n];
        var pivotRatio = new double[n];
        // Per pivot: original rows of its L column and original columns of its U row.
        var lRows = new int[n][];
        var uCols = new int[n][];

        double ColMax(int j)
        {
            double m = 0;
            foreach (int i in cols[j]) m = Math.Max(m, Math.Abs(rows[i][j]));
            work += cols[j].Count;
            return m;
        }

        for (int k = 0; k < n; k++)
        {
            int bi = -1, bj = -1;
            long bestCost = long.MaxValue;
            double bestRel = 0;
            int linesWithCandidate = 0;
            void Consider(int i, int j, double colMax)
            {
                double av = Math.Abs(rows[i][j]);
                if (av == 0.0 || !double.IsFinite(av) || av < Threshold * colMax) return;
                long cost = (long)(rows[i].Count - 1) * (cols[j].Count - 1);
                double rel = av / colMax;
                bool better = cost < bestCost
                    || (cost == bestCost && (rel > bestRel || (rel == bestRel && (i < bi || (i == bi && j < bj)))));
                if (better)
                {
                    bestCost = cost; bestRel = rel; bi = i; bj = j;
                }
            }
            for (int m = 1; m <= n; m++)
            {
                if (bi >= 0 && (bestCost <= (long)(m - 1) * (m - 1) || linesWithCandidate >= SearchLines)) break;
                foreach (int j in colBuckets.Members(m))
                {
                    double cm = ColMax(j);
                    foreach (int i in cols[j]) Consider(i, j, cm);
                    work += cols[j].Count;
                    if (bi >= 0) linesWithCandidate++;
                    if (bi >= 0 && (bestCost <= (long)(m - 1) * (m - 1) || linesWithCandidate >= SearchLines)) break;
                }
                if (bi >= 0 && (bestCost <= (long)(m - 1) * (m - 1) || linesWithCandidate >= SearchLines)) break;
                foreach (int i in rowBuckets.Members(m))
                {
                    foreach (int j in rows[i].Keys) Consider(i, j, ColMax(j));
                    work += rows[i].Count;
                    if (bi >= 0) linesWithCandidate++;
                    if (bi >= 0 && (bestCost <= (long)(m - 1) * (m - 1) || linesWithCandidate >= SearchLines)) break;
                }
            }
            if (bi < 0) { _analysed = false; AnalysisWork += work; return false; }
            pivRow[k] = bi;
            pivCol[k] = bj;
            double piv = rows[bi][bj];
            pivotRatio[k] = colScale[bj] > 0 ? Math.Abs(piv) / colScale[bj] : 0;

            // The pivot row leaves every column's row set; the pivot column leaves every row's map.
            Dictionary<int, double> prow = rows[bi];
            var uList = new int[prow.Count - 1];
            int u = 0;
            foreach (int j in prow.Keys)
            {
                cols[j].Remove(bi);
                if (j != bj) { uList[u++] = j; colBuckets.Set(j, cols[j].Count); }
            }
            var lList = new int[cols[bj].Count];
            int l = 0;
            foreach (int i in cols[bj]) lList[l++] = i;
            Array.Sort(lList);
            Array.Sort(uList);
            rowBuckets.Remove(bi);
            colBuckets.Remove(bj);
            foreach (int i in lList)
            {
                Dictionary<int, double> row = rows[i];
                double factor = row[bj] / piv;
                row.Remove(bj);
                foreach (int j in uList)
                {
                    double target = row.GetValueOrDefault(j);
                    if (!row.ContainsKey(j))
                    {
                        cols[j].Add(i);
                        colBuckets.Set(j, cols[j].Count);
                    }
                    row[j] = target - factor * prow[j];
                }
                rowBuckets.Set(i, row.Count);
                work += uList.Length + 1;
            }
            cols[bj].Clear();
            lRows[k] = lList;
            uCols[k] = uList;
        }
        AnalysisWork += work;

        // Compile: positions of every entry of L and U in pivot order.
        var rowRank = new int[n];
        var colRank = new int[n];
        for (int k = 0; k < n; k++) { rowRank[pivRow[k]] = k; colRank[pivCol[k]] = k; }
        var posOf = new Dictionary<long, int>();
        static long Key(int a, int b) => ((long)a << 32) | (uint)b;
        var lStart = new int[n + 1];
        var uStart = new int[n + 1];
        var lPos = new List<int>();
        var lRow = new List<int>();
        var uPos = new List<int>();
        var uCol = new List<int>();
        var diag = new int[n];
        int count = 0;
        for (int k = 0; k < n; k++)
        {
            diag[k] = count;
            posOf.Add(Key(k, k), count++);
            lStart[k] = lPos.Count;
            uStart[k] = uPos.Count;
            int[] lr = Array.ConvertAll(lRows[k], i => rowRank[i]);
            int[] uc = Array.ConvertAll(uCols[k], j => colRank[j]);
            Array.Sort(lr);
            Array.Sort(uc);
            foreach (int a in lr) { posOf.Add(Key(a, k), count); lPos.Add(count++); lRow.Add(a); }
            foreach (int b in uc) { posOf.Add(Key(k, b), count); uPos.Add(count++); uCol.Add(b); }
        }
        lStart[n] = lPos.Count;
        uStart[n] = uPos.Count;
        var ops = new List<int>();
        for (int k = 0; k < n; k++)
            for (int li = lStart[k]; li < lStart[k + 1]; li++)
                for (int ui = uStart[k]; ui < uStart[k + 1]; ui++)
                {
                    if (!posOf.TryGetValue(Key(lRow[li], uCol[ui]), out int t))
                        throw new InvalidOperationException("sparse LU: fill-in position missing from the analysed pattern");
                    ops.Add(t);
                }
        var slotPos = new int[_slotRow.Length];
        for (int k = 0; k < slotPos.Length; k++) slotPos[k] = posOf[Key(rowRank[_slotRow[k]], colRank[_slotCol[k]])];

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

    /// <summary>Lines (rows or columns) grouped by their current entry count, for the pivot search.</summary>
    private sealed class CountBuckets(int n)
    {
        private readonly int[] _countOf = CreateFilled(n);
        private readonly List<SortedSet<int>> _buckets = [];

        private static int[] CreateFilled(int n)
        {
            var a = new int[n];
            Array.Fill(a, -1);
            return a;
        }

        public void Set(int line, int count)
        {
            int old = _countOf[line];
            if (old == count) return;
            if (old >= 0) _buckets[old].Remove(line);
            while (_buckets.Count <= count) _buckets.Add([]);
            _buckets[count].Add(line);
            _countOf[line] = count;
        }

        public void Remove(int line)
        {
            int old = _countOf[line];
            if (old >= 0) _buckets[old].Remove(line);
            _countOf[line] = -2;
        }

        public IEnumerable<int> Members(int count) => count < _buckets.Count ? _buckets[count] : [];
    }
}
