namespace NightSim.Tests.Fixtures;

/// <summary>Principal branch W0 of the Lambert W function for x ≥ 0 by Halley's iteration (Corless et al., "On the
/// Lambert W function", Adv. Comput. Math. 5, 1996, eq. 5.9).</summary>
internal static class LambertW
{
    public static double W0(double x)
    {
        double w = x < 1 ? x : Math.Log(x) - Math.Log(Math.Log(x) + 1e-300 + (x < 3 ? 1 : 0));
        if (x >= 3) w = Math.Log(x) - Math.Log(Math.Log(x));
        for (int i = 0; i < 100; i++)
        {
            double ew = Math.Exp(w);
            double f = w * ew - x;
            double step = f / (ew * (w + 1) - (w + 2) * f / (2 * w + 2));
            w -= step;
            if (Math.Abs(step) <= 1e-15 * Math.Max(1, Math.Abs(w))) break;
        }
        return w;
    }
}
