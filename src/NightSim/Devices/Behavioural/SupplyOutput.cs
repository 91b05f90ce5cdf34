namespace NightSim.Devices.Behavioural;

/// <summary>
/// A push-pull behavioural output as a Norton equivalent referenced to two supply pins: a conductance g from the
/// output node to a level V_lev = V_gnd + c + k·(V_vcc − V_gnd). For a level fraction f (0 = low, 1 = high) the low
/// and high levels sit <c>dropLow</c> above the lower rail and <c>dropHigh</c> below the upper one, and g moves from
/// the low-state to the high-state conductance with f. The output current returns through the supply pins in the
/// proportion k : (1 − k), so the supply pins carry the load current (sourcing from vcc, sinking into gnd).
/// A Norton output needs no branch unknown; an output resistance is always present (a real output has one).
/// Below dropLow + dropHigh of supply (power-up) both levels collapse to one point of the supply, continuously.
/// </summary>
public readonly struct SupplyOutput
{
    private readonly int _out;
    private readonly int _vcc;
    private readonly int _gnd;
    private readonly int[] _slots; // 3×3: rows (out, vcc, gnd) × cols (out, vcc, gnd)

    private SupplyOutput(int output, int vcc, int gnd, int[] slots)
    {
        _out = output;
        _vcc = vcc;
        _gnd = gnd;
        _slots = slots;
    }

    /// <summary>Reserve the nine matrix slots of an output at <paramref name="output"/> fed from vcc and gnd.</summary>
    public static SupplyOutput Reserve(SetupContext setup, int output, int vcc, int gnd)
    {
        int[] n = [output, vcc, gnd];
        int[] slots = new int[9];
        for (int r = 0; r < 3; r++)
            for (int c = 0; c < 3; c++)
                slots[3 * r + c] = setup.Slot(n[r], n[c]);
        return new SupplyOutput(output, vcc, gnd, slots);
    }

    /// <summary>Voltage the output would sit at with no load for level fraction <paramref name="f"/>, V.</summary>
    public double OpenLevel(LoadContext ctx, double f, double dropLow, double dropHigh)
    {
        Coefficients(ctx, f, dropLow, dropHigh, out double c, out double k);
        double vg = ctx.V(_gnd);
        return vg + c + k * (ctx.V(_vcc) - vg);
    }

    /// <summary>Stamp the output for level fraction <paramref name="f"/> (0…1).</summary>
    /// <param name="ctx">Load context.</param>
    /// <param name="f">Level fraction, 0 low … 1 high.</param>
    /// <param name="gLow">Output conductance in the low state, S.</param>
    /// <param name="gHigh">Output conductance in the high state, S.</param>
    /// <param name="dropLow">Low level above the lower rail, V.</param>
    /// <param name="dropHigh">High level below the upper rail, V.</param>
    public void Load(LoadContext ctx, double f, double gLow, double gHigh, double dropLow, double dropHigh)
    {
        Coefficients(ctx, f, dropLow, dropHigh, out double c, out double k);
        double g = gLow + f * (gHigh - gLow);
        double vg = ctx.V(_gnd);
        double level = vg + c + k * (ctx.V(_vcc) - vg);
        double i = g * (ctx.V(_out) - level); // leaves the output node into the block
        ctx.AddCurrent(_out, -1, i);
        ctx.AddCurrent(-1, _vcc, k * i);
        ctx.AddCurrent(-1, _gnd, (1.0 - k) * i);

        // ∂i/∂(out, vcc, gnd); row weights 1 (out), −k (vcc), −(1 − k) (gnd). No allocation: hot path.
        double d0 = g, d1 = -g * k, d2 = -g * (1.0 - k);
        StampRow(ctx, 0, 1.0, d0, d1, d2);
        StampRow(ctx, 1, -k, d0, d1, d2);
        StampRow(ctx, 2, -(1.0 - k), d0, d1, d2);
    }

    private void StampRow(LoadContext ctx, int row, double weight, double d0, double d1, double d2)
    {
        ctx.AddG(_slots[3 * row], weight * d0);
        ctx.AddG(_slots[3 * row + 1], weight * d1);
        ctx.AddG(_slots[3 * row + 2], weight * d2);
    }

    private void Coefficients(LoadContext ctx, double f, double dropLow, double dropHigh, out double c, out double k)
    {
        double drops = dropLow + dropHigh;
        double supply = ctx.V(_vcc) - ctx.V(_gnd);
        if (drops <= 0.0 || supply >= drops)
        {
            c = dropLow - f * drops;
            k = f;
        }
        else
        {
            c = 0.0;
            k = dropLow / drops;
        }
    }
}
