namespace NightSim.Devices;

/// <summary>What a relay's data give for its contacts; null where the part states nothing.</summary>
/// <param name="Current">Rated contact current for a resistive load, A.</param>
/// <param name="Voltage">Rated contact (switching) voltage, V.</param>
/// <param name="Life">Electrical life: operations (one make and one break) at the rated load.</param>
/// <param name="InrushCurrent">Peak switch-on current the contacts are rated for (a lamp or inrush rating), A.</param>
public sealed record ContactRating(double? Current = null, double? Voltage = null, double? Life = null, double? InrushCurrent = null)
{
    /// <summary>
    /// Switch-on peak that general-purpose contacts with only a resistive rating take again and again, as a multiple of
    /// that rating. Common practice, from memory: such a relay switches a filament lamp of about a fifth of its
    /// resistive rating, and a filament's 10–15× inrush at a fifth of the rating is about 3× the rating.
    /// </summary>
    public const double GeneralPurposeInrushMultiple = 3.0;

    /// <summary>Nothing stated.</summary>
    public static ContactRating Unknown { get; } = new();

    /// <summary>The switch-on peak the contacts take, A: the stated inrush rating, else
    /// <see cref="GeneralPurposeInrushMultiple"/> × the resistive rating; null when neither is stated.</summary>
    public double? InrushLimit => InrushCurrent ?? GeneralPurposeInrushMultiple * Current;

    /// <summary>True when the limit is the stated inrush rating rather than the multiple of the resistive rating.</summary>
    public bool InrushStated => InrushCurrent is not null;
}
