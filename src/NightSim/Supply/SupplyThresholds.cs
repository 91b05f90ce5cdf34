namespace NightSim.Supply;

/// <summary>Thresholds and ratios the supply budget and the supply findings share.</summary>
public static class SupplyThresholds
{
    /// <summary>A Zener whose current falls below this fraction of its test current no longer regulates (its voltage
    /// is then about V_T·N·ln 100 ≈ 0.23 V below V_Z in the model's exponential knee).</summary>
    public const double RegulationLost = 0.01;

    /// <summary>Mean of a full-wave rectified sine over its RMS: 2√2/π (any circuits textbook).</summary>
    public static readonly double FullWaveAverageOverRms = Analysis.SupplyFixes.FullWaveAverageOverRms;

    /// <summary>The coil counts as driven from this fraction of its drop-out voltage.</summary>
    public const double Driven = 0.5;
}
