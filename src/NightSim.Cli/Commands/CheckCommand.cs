using System.CommandLine;
using System.Globalization;
using System.Text.Json;
using NightSim.Devices;
using NightSim.Netlist;
using NightSim.Reporting;
using NightSim.Runs;
using NightSim.Sky;

namespace NightSim.Cli.Commands;

/// <summary>`nightsim check NETLIST [SCENARIO]`: validate a netlist (every problem at once) and print a summary.</summary>
internal static class CheckCommand
{
    public static Command Create()
    {
        var netlist = new Argument<FileInfo?>("NETLIST")
        {
            Description = "Netlist JSON file to check.",
            Arity = ArgumentArity.ZeroOrOne,
        };
        var scenario = new Argument<FileInfo?>("SCENARIO")
        {
            Description = "Scenario JSON file to check along with it (optional).",
            Arity = ArgumentArity.ZeroOrOne,
        };
        var writeSchema = new Option<FileInfo?>("--write-schema")
        {
            HelpName = "FILE",
            Description = "Write the netlist JSON Schema generated from the part catalogue to this file (e.g. netlists/netlist.schema.json).",
        };
        var writeKinds = new Option<FileInfo?>("--write-kinds")
        {
            HelpName = "FILE",
            Description = "Write the part-kind reference (Markdown) generated from the part catalogue to this file (e.g. docs/part-kinds.md).",
        };
        var command = new Command("check", "Check a netlist (and optionally a scenario): print a summary, or every problem with file, line:column, JSON path and part. Exit 0 when valid, 2 when not.");
        command.Arguments.Add(netlist);
        command.Arguments.Add(scenario);
        command.Options.Add(writeSchema);
        command.Options.Add(writeKinds);
        command.SetAction(pr => CliErrors.Run(pr, (output, error) =>
            Execute(pr.GetValue(netlist), pr.GetValue(scenario), pr.GetValue(writeSchema), pr.GetValue(writeKinds), output, error)));
        return command;
    }

    private static int Execute(FileInfo? netlist, FileInfo? scenario, FileInfo? writeSchema, FileInfo? writeKinds,
        TextWriter output, TextWriter error)
    {
        if (writeSchema is not null || writeKinds is not null)
        {
            if (writeSchema is not null)
            {
                AtomicFile.WriteText(writeSchema.FullName, NetlistSchema.Generate());
                output.WriteLine($"wrote {writeSchema}");
            }
            if (writeKinds is not null)
            {
                AtomicFile.WriteText(writeKinds.FullName, NetlistReference.Markdown());
                output.WriteLine($"wrote {writeKinds}");
            }
            if (netlist is null) return CliErrors.Success;
        }
        if (netlist is null)
        {
            error.WriteLine("nightsim check: give a NETLIST file, e.g. `nightsim check netlists/rc-step.json` (see `nightsim check --help`)");
            return CliErrors.Usage;
        }

        string netlistPath = netlist.ToString();
        NetlistLoadResult result = NetlistLoader.Read(netlistPath);
        var problems = new List<string>();
        problems.AddRange(result.Errors.Select(e => e.ToString()));
        LightScenario? loadedScenario = null;
        if (scenario is not null)
        {
            string scenarioPath = scenario.ToString();
            List<string> syntax = CheckScenario(scenarioPath).ToList();
            problems.AddRange(syntax);
            if (syntax.Count == 0)
            {
                loadedScenario = ScenarioLoader.Load(scenarioPath, out IReadOnlyList<ScenarioError> scenarioErrors);
                problems.AddRange(scenarioErrors.Select(e => e.ToString()));
                if (loadedScenario is not null && result.Definition is not null)
                    problems.AddRange(ScenarioFit.Problems(result.Definition, loadedScenario, netlistPath, scenarioPath));
            }
        }

        foreach (NetlistError w in result.Warnings) error.WriteLine(w.ToString());
        if (problems.Count > 0)
        {
            CliErrors.WriteProblems(problems, error);
            return CliErrors.InvalidInput;
        }

        NetlistDefinition def = result.Definition!;
        output.WriteLine($"{def.Name}: valid ({netlistPath})");
        if (!string.IsNullOrWhiteSpace(def.Description)) output.WriteLine($"  {def.Description}");
        IEnumerable<string> byKind = def.Parts.GroupBy(p => p.Kind)
            .OrderBy(g => PartCatalog.All.ToList().FindIndex(k => k.Name == g.Key))
            .Select(g => $"{g.Key} {g.Count()}");
        output.WriteLine($"  parts:    {def.Parts.Count} ({string.Join(", ", byKind)})");
        List<string> nodes = def.Parts.SelectMany(p => p.Pins.Values).Where(n => !Ground.Is(n)).Distinct().Order(StringComparer.Ordinal).ToList();
        string shown = string.Join(", ", nodes.Take(20)) + (nodes.Count > 20 ? $", … and {nodes.Count - 20} more" : "");
        output.WriteLine($"  nodes:    {nodes.Count} + ground ({shown})");
        output.WriteLine(result.Warnings.Count == 0 ? "  warnings: none" : $"  warnings: {result.Warnings.Count} (above)");
        foreach (string caution in NightSim.Supply.MainsExposure.Cautions(def)) output.WriteLine("CAUTION: " + caution);
        if (loadedScenario is not null)
        {
            output.WriteLine($"  scenario: {loadedScenario.Name} ({scenario}): {loadedScenario.Site.Name}, {loadedScenario.Start.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture)}, " +
                $"{loadedScenario.Nights} night{(loadedScenario.Nights == 1 ? "" : "s")}, {loadedScenario.Events.Count} event definition{(loadedScenario.Events.Count == 1 ? "" : "s")}, seed {loadedScenario.Seed}");
            foreach (ScenarioError w in loadedScenario.Warnings) error.WriteLine(w.ToString());
        }
        return CliErrors.Success;
    }

    private static IEnumerable<string> CheckScenario(string path)
    {
        if (Directory.Exists(path)) return [$"{path}: error at $: this is a folder, not a scenario file. hint: check the path"];
        if (!File.Exists(path)) return [$"{path}: error at $: file not found. hint: check the path"];
        try
        {
            byte[]? bytes = NightSim.Text.Utf8Check.ReadBounded(path, InputLimits.MaxInputBytes, out string? notRead);
            if (bytes is null)
                return [$"{path}: error at $: the file {notRead}. hint: give a scenario JSON file; an input file may hold at most 64 MB"];
            if ((NightSim.Text.Utf8Check.Problem(bytes) ?? NightSim.Text.JsonEscapeCheck.Problem(bytes)) is { } bad)
                return [$"{path}:{bad.Line}:{bad.Column}: error at $: {bad.Message}. hint: {bad.Hint}"];
            int start = bytes.AsSpan().StartsWith((ReadOnlySpan<byte>)[0xEF, 0xBB, 0xBF]) ? 3 : 0;
            using JsonDocument _ = JsonDocument.Parse(bytes.AsMemory(start), new JsonDocumentOptions
            {
                CommentHandling = JsonCommentHandling.Skip,
                AllowTrailingCommas = true,
            });
            return [];
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            return [$"{path}: error at $: cannot read the file: {ex.Message.TrimEnd('.')}. hint: check the path"];
        }
        catch (JsonException ex)
        {
            string message = ex.Message;
            int cut = message.IndexOf(" LineNumber:", StringComparison.Ordinal);
            if (cut > 0) message = message[..cut];
            string where = string.Create(CultureInfo.InvariantCulture, $"{(ex.LineNumber ?? 0) + 1}:{(ex.BytePositionInLine ?? 0) + 1}");
            return [$"{path}:{where}: error at $: invalid JSON: {message.TrimEnd('.', ' ')}. hint: check brackets, quotes and commas near this position"];
        }
    }
}
