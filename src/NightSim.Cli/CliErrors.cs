using System.CommandLine;
using NightSim.Netlist;
using NightSim.Inputs;

namespace NightSim.Cli;

/// <summary>
/// Turns failures into exit codes and messages on stderr, never a stack trace: bad input files
/// (<see cref="InputFileException"/>, missing or unreadable files) → <see cref="InvalidInput"/> (2); anything
/// unexpected → <see cref="Unexpected"/> (3) with a one-line message.
/// </summary>
internal static class CliErrors
{
    /// <summary>Exit code: success.</summary>
    public const int Success = 0;

    /// <summary>Exit code: command-line usage error (same as the parser's own).</summary>
    public const int Usage = 1;

    /// <summary>Exit code: an input file is invalid.</summary>
    public const int InvalidInput = 2;

    /// <summary>Exit code: the simulation or the tool failed.</summary>
    public const int Unexpected = 3;

    /// <summary>Runs a verb's body with the invocation's output and error writers, mapping exceptions to exit codes.</summary>
    public static int Run(ParseResult parseResult, Func<TextWriter, TextWriter, int> body)
    {
        TextWriter output = parseResult.InvocationConfiguration.Output;
        TextWriter error = parseResult.InvocationConfiguration.Error;
        try
        {
            return body(output, error);
        }
        catch (Exception ex)
        {
            return Report(ex, error);
        }
    }

    /// <summary>Writes the message for <paramref name="ex"/> to <paramref name="error"/> and returns its exit code.</summary>
    public static int Report(Exception ex, TextWriter error)
    {
        switch (ex)
        {
            case InputFileException input:
                foreach (string line in input.Lines) error.WriteLine(line);
                if (input.Lines.Count > 1) error.WriteLine($"{input.Lines.Count} problems found.");
                return InvalidInput;
            case FileNotFoundException notFound:
                error.WriteLine($"{notFound.FileName ?? "file"}: error: file not found. hint: check the path");
                return InvalidInput;
            case DirectoryNotFoundException or UnauthorizedAccessException or IOException:
                error.WriteLine($"error: {ex.Message}");
                return InvalidInput;
            default:
                error.WriteLine($"nightsim: unexpected failure ({ex.GetType().Name}): {ex.Message.ReplaceLineEndings(" ")}");
                return Unexpected;
        }
    }
}
