namespace NightSim.Cli.Rendering;

/// <summary>Progress of a night run: which night (1-based) of how many, and how far through it (0…1).</summary>
public readonly record struct NightProgress(int Night, int Nights, double Fraction)
{
    /// <summary>Fraction of the whole run done, 0…1.</summary>
    public double Overall => Nights <= 0 ? 0 : Math.Clamp((Night - 1 + Math.Clamp(Fraction, 0, 1)) / Nights, 0, 1);

    /// <summary>"simulating night 1/3: 35%".</summary>
    public override string ToString() =>
        string.Create(System.Globalization.CultureInfo.InvariantCulture,
            $"simulating night {Night}/{Nights}: {Math.Floor(Math.Clamp(Fraction, 0, 1) * 100):0}%");
}
