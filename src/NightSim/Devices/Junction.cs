namespace NightSim.Devices;

/// <summary>
/// Shared pn-junction mathematics for diodes and transistors: thermal voltage, exponential with a linear extension
/// (no overflow), depletion charge, and the logarithmic junction-voltage limiting of Newton iterates.
/// </summary>
/// <remarks>
/// Limiting is the classic scheme of the circuit-simulation textbooks (Vlach &amp; Singhal 1994; Najm 2010, "pn-junction
/// limiting"): above the critical voltage V_crit = nV_T·ln(nV_T/(√2·I_S)) — where the junction's I–V curve bends
/// sharply — a Newton step is replaced by the voltage change that would produce the same change in current on the
/// exponential's tangent, i.e. a logarithmic step.
/// </remarks>
public static class Junction
{
    /// <summary>Boltzmann constant over elementary charge, V/K (CODATA 2018 exact values).</summary>
    public const double BoltzmannOverCharge = 1.380649e-23 / 1.602176634e-19;

    /// <summary>Exponent above which exp() is continued by its tangent (C¹), dimensionless.</summary>
    public const double MaxExponent = 40.0;

    /// <summary>Thermal voltage kT/q at <paramref name="kelvin"/>, volts (0.025865 V at 300.15 K).</summary>
    public static double ThermalVoltage(double kelvin) => BoltzmannOverCharge * kelvin;

    /// <summary>V_crit = vte·ln(vte/(√2·I_S)), volts (0.7303 V for I_S = 1e-14 A, n = 1, 27 °C).</summary>
    /// <param name="vte">n·V_T, volts.</param>
    /// <param name="saturationCurrent">I_S, amperes.</param>
    public static double CriticalVoltage(double vte, double saturationCurrent) => vte * Math.Log(vte / (Math.Sqrt(2.0) * saturationCurrent));

    /// <summary>exp(x) continued linearly above <see cref="MaxExponent"/>; <paramref name="derivative"/> = d/dx.</summary>
    public static double Exp(double x, out double derivative)
    {
        if (x <= MaxExponent)
        {
            double e = Math.Exp(x);
            derivative = e;
            return e;
        }
        double em = Math.Exp(MaxExponent);
        derivative = em;
        return em * (1.0 + (x - MaxExponent));
    }

    /// <summary>
    /// Limit a new junction voltage against the previous iterate (logarithmic limiting). Returns the voltage to use and sets
    /// <paramref name="limited"/> when it differs from <paramref name="vNew"/>.
    /// </summary>
    /// <param name="vNew">Junction voltage from the Newton update, volts.</param>
    /// <param name="vOld">Junction voltage used in the previous iteration, volts.</param>
    /// <param name="vte">n·V_T, volts.</param>
    /// <param name="vCrit">Critical voltage, volts.</param>
    public static double Limit(double vNew, double vOld, double vte, double vCrit, out bool limited)
    {
        limited = false;
        if (vNew > vCrit && Math.Abs(vNew - vOld) > 2.0 * vte)
        {
            double v;
            if (vOld > 0)
            {
                double arg = 1.0 + (vNew - vOld) / vte;
                v = arg > 0 ? vOld + vte * Math.Log(arg) : vCrit;
            }
            else
            {
                v = vte * Math.Log(vNew / vte);
            }
            limited = true;
            return v;
        }
        return vNew;
    }

    /// <summary>
    /// Depletion charge of a junction, q(v) = C_j0·V_j/(1 − m)·(1 − (1 − v/V_j)^(1 − m)) for v &lt; F_c·V_j, continued
    /// with the linearised capacitance above (the usual forward-bias extension); <paramref name="capacitance"/> = dq/dv.
    /// </summary>
    /// <param name="v">Junction voltage, volts.</param>
    /// <param name="cj0">Zero-bias capacitance, farads.</param>
    /// <param name="vj">Built-in potential, volts.</param>
    /// <param name="m">Grading coefficient (0 &lt; m &lt; 1).</param>
    /// <param name="fc">Forward-bias fraction where the extension starts (typically 0.5).</param>
    public static double DepletionCharge(double v, double cj0, double vj, double m, double fc, out double capacitance)
    {
        if (cj0 <= 0)
        {
            capacitance = 0;
            return 0;
        }
        double vf = fc * vj;
        if (v < vf)
        {
            double s = 1.0 - v / vj;
            double sm = Math.Pow(s, -m);
            capacitance = cj0 * sm;
            return cj0 * vj / (1.0 - m) * (1.0 - s * sm);
        }
        double f1 = vj * (1.0 - Math.Pow(1.0 - fc, 1.0 - m)) / (1.0 - m);
        double f2 = Math.Pow(1.0 - fc, 1.0 + m);
        double f3 = 1.0 - fc * (1.0 + m);
        capacitance = cj0 / f2 * (f3 + m * v / vj);
        return cj0 * f1 + cj0 / f2 * (f3 * (v - vf) + m / (2.0 * vj) * (v * v - vf * vf));
    }
}
