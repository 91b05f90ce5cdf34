namespace NightSim.Mna;

/// <summary>
/// Factors and solves A·x = b for a matrix given by its nonzero values on a fixed sparsity pattern (one value per
/// matrix slot, see <see cref="SparsityPattern"/>). Contract: <see cref="Factor"/> either returns true and leaves a
/// factorisation that <see cref="Solve"/> uses, or returns false when the matrix is numerically singular.
/// Both calls are allocation-free after the first factorisation of a pattern (re-pivoting may allocate).
/// </summary>
public interface ILinearSolver
{
    /// <summary>Number of unknowns.</summary>
    int Size { get; }

    /// <summary>Numeric factorisations performed so far.</summary>
    int Factorizations { get; }

    /// <summary>Pivot-order choices (symbolic analyses) performed so far.</summary>
    int Analyses { get; }

    /// <summary>Factor the matrix whose entry at slot s is <paramref name="values"/>[s]. False if singular.</summary>
    bool Factor(ReadOnlySpan<double> values);

    /// <summary>Overwrite <paramref name="rhs"/> (b) with the solution x of A·x = b.</summary>
    void Solve(Span<double> rhs);
}
