namespace NightSim.Studies;

/// <summary>
/// A fixed arithmetic loop timed beside the workloads, so that bench figures compare across machines as ratios
/// (workload CPU seconds ÷ kernel CPU seconds). It mixes a dependent multiply–add chain, a division and a square root
/// over a small array, the operations a Newton step is made of; its result is returned so it cannot be optimised away.
/// </summary>
public static class CalibrationKernel
{
    /// <summary>Passes over the work array.</summary>
    public const int Passes = 4000;

    /// <summary>Runs the kernel once; returns a checksum.</summary>
    public static double Run()
    {
        var a = new double[1024];
        for (int i = 0; i < a.Length; i++) a[i] = 1.0 + i * 1e-3;
        double sum = 0;
        for (int p = 0; p < Passes; p++)
        {
            double carry = 1.0 + p * 1e-9;
            for (int i = 0; i < a.Length; i++)
            {
                double v = a[i] * 0.999 + carry * 1e-3;
                carry = v / (1.0 + Math.Sqrt(v));
                a[i] = v;
            }
            sum += carry;
        }
        return sum;
    }
}
