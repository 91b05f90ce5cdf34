using NightSim.Cli;

namespace NightSim.Tests.Cli;

/// <summary>Runs the command line in-process with captured output: (exit code, standard output, standard error).</summary>
internal static class CliRun
{
    public static (int Exit, string Out, string Err) Invoke(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        int exit = Program.CreateRoot().Parse(args).Invoke(new System.CommandLine.InvocationConfiguration { Output = output, Error = error });
        return (exit, output.ToString(), error.ToString());
    }
}
