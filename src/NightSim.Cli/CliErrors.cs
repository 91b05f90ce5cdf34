using System.CommandLine;
using NightSim.Netlist;
using NightSim.Inputs;

namespace NightSim.Cli;

/// <summary>
/// Turns failures into exit codes and messages on stderr, never a stack trace: bad input files
/// (<see cref="InputFileException"/>, missing or unreadable files) → <see cref="InvalidInput"/> (2); an output that
/// cannot be written → <see cref="OutputFailed"/> (5); anything else is a defect of the tool → <see cref="Unexpected"/>
/// (3) with a one-line message. Lists of problems are bounded: the first <see cref="MaxProblems"/> and a count.
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

    /// <summary>Exit code: a finding at or above --fail-on.</summary>
    public const int FindingAtLevel = 4;

    /// <summary>Exit code: an output file or folder could not be written.</summary>
    public const int OutputFailed = 5;

    /// <summary>Problems printed before the rest are only counted.</summary>
    public const int MaxProblems = 20;

    /// <summary>Longest problem line printed; longer lines are cut.</summary>
    public const int MaxLineLength = 400;

    /// <summary>Writes the first <see cref="MaxProblems"/> problems (each cut to <see cref="MaxLineLength"/>), a line
    /// counting the rest, and the total ("3 errors.").</summary>
    public static void WriteProblems(IReadOnlyList<string> problems, TextWriter error, string noun = "error")
    {
        foreach (string p in problems.Take(MaxProblems)) error.WriteLine(Cut(p));
        if (problems.Count > MaxProblems) error.WriteLine($"… and {problems.Count - MaxProblems} more (not shown).");
        error.WriteLine(problems.Count == 1 ? $"1 {noun}." : $"{problems.Count} {noun}s.");
    }

    private static string Cut(string line)
    {
        string flat = line.ReplaceLineEndings(" ");
        return flat.Length <= MaxLineLength ? flat : flat[..MaxLineLength] + "…";
    }

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
                foreach (string line in input.Lines.Take(MaxProblems)) error.WriteLine(Cut(line));
                if (input.Lines.Count > MaxProblems) error.WriteLine($"… and {input.Lines.Count - MaxProblems} more (not shown).");
                if (input.Lines.Count > 1) error.WriteLine($"{input.Lines.Count} problems found.");
                return InvalidInput;
            case OutputException output:
                error.WriteLine($"{output.Message}. hint: check free disk space, that the folder exists and is writable, or give another folder with --out");
                return OutputFailed;
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
