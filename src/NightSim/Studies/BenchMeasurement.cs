namespace NightSim.Studies;

/// <summary>Medians over the timed repetitions of one bench workload.</summary>
/// <param name="Name">Workload name.</param>
/// <param name="Description">What it exercises.</param>
/// <param name="SimulatedSeconds">Simulated time, seconds.</param>
/// <param name="WallSeconds">Wall time of the whole run (solve, analysis, report and plot data), seconds.</param>
/// <param name="CpuSeconds">Processor time of the whole run, seconds (all threads of the process).</param>
/// <param name="SolverCpuSeconds">Processor time of the solve alone, seconds.</param>
/// <param name="AcceptedSteps">Accepted time steps.</param>
/// <param name="RejectedSteps">Rejected time steps.</param>
/// <param name="NewtonIterations">Newton iterations (one linear solve each).</param>
/// <param name="Factorizations">Numeric LU factorisations.</param>
/// <param name="Events">Discrete events fired.</param>
/// <param name="AllocatedBytesPerStep">Bytes allocated per accepted step once the run is under way.</param>
/// <param name="Error">Largest relative deviation of a timer-ended on-time from the 555 closed form with leakage, or
/// null when the workload has no timer-ended on-time.</param>
/// <param name="CalibrationRatio">Solver CPU seconds ÷ calibration kernel CPU seconds (machine-independent figure).</param>
/// <param name="Repetitions">Timed repetitions the medians are taken over.</param>
public sealed record BenchMeasurement(
    string Name,
    string Description,
    double SimulatedSeconds,
    double WallSeconds,
    double CpuSeconds,
    double SolverCpuSeconds,
    long AcceptedSteps,
    long RejectedSteps,
    long NewtonIterations,
    long Factorizations,
    long Events,
    double AllocatedBytesPerStep,
    double? Error,
    double CalibrationRatio,
    int Repetitions);

/// <summary>A whole bench run: the calibration kernel's time and one measurement per workload.</summary>
/// <param name="Quick">True for the short set.</param>
/// <param name="CalibrationCpuSeconds">Median processor time of one calibration kernel run, seconds.</param>
/// <param name="Workloads">One entry per workload, in run order.</param>
public sealed record BenchReport(bool Quick, double CalibrationCpuSeconds, IReadOnlyList<BenchMeasurement> Workloads);
