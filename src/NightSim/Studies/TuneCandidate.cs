namespace NightSim.Studies;

/// <summary>A quantity's closed-form value across the corners of one candidate.</summary>
/// <param name="Quantity">Quantity name (<see cref="TunePhysics"/>).</param>
/// <param name="Low">Lowest value over the corners.</param>
/// <param name="High">Highest value over the corners.</param>
/// <param name="Margin">Least margin over the corners, relative to the target's size.</param>
/// <param name="Corner">The corner that gives <paramref name="Margin"/>.</param>
public sealed record TunePrediction(string Quantity, double Low, double High, double Margin, string Corner);

/// <summary>One combination of the varied values, with what the closed forms predict for it.</summary>
/// <param name="Index">Position in the grid of combinations (axis 0 fastest).</param>
/// <param name="Values">"PART.parameter" → value (SI), in axis order.</param>
/// <param name="Predictions">One per closed-form quantity (empty when the search fell back to the full grid).</param>
public sealed record TuneCandidate(int Index, IReadOnlyList<KeyValuePair<string, double>> Values, IReadOnlyList<TunePrediction> Predictions)
{
    /// <summary>Least predicted margin over quantities and corners; null without predictions.</summary>
    public double? PredictedMargin => Predictions.Count == 0 ? null : Predictions.Min(p => p.Margin);
}
