using System.CommandLine;
using System.Text.Json;
using NightSim.Netlist;
using NightSim.Studies;

namespace NightSim.Cli.Commands;

/// <summary>`nightsim merge DIR... --out DIR`: joins the shard files of a spread, sweep or year into the files the
/// unsharded run writes (byte for byte).</summary>
internal static class MergeCommand
{
    public static Command Create()
    {
        var dirs = new Argument<DirectoryInfo[]>("DIR") { Description = "Folders holding shard-i-of-n.json files (or the files themselves).", Arity = ArgumentArity.OneOrMore };
        var outDir = new Option<DirectoryInfo>("--out") { Description = "Output folder for the joined study.", Required = true, HelpName = "DIR" };
        var format = new Option<string>("--format") { Description = "Terminal output: text or json.", DefaultValueFactory = _ => "text" };
        format.AcceptOnlyFromAmong("text", "json");
        var command = new Command("merge", "Join the shard files of a spread, sweep or year (run with --shard i/n on several machines) into the files one unsharded run writes.");
        command.Arguments.Add(dirs);
        command.Options.Add(outDir);
        command.Options.Add(format);
        command.SetAction(pr => CliErrors.Run(pr, (output, error) =>
        {
            var files = new List<string>();
            foreach (DirectoryInfo d in pr.GetValue(dirs)!)
            {
                if (File.Exists(d.FullName)) files.Add(d.FullName);
                else if (Directory.Exists(d.FullName)) files.AddRange(Directory.EnumerateFiles(d.FullName, "shard-*-of-*.json").Order(StringComparer.Ordinal));
                else
                {
                    error.WriteLine($"{d}: error: no such folder. hint: give the folders the sharded runs wrote with --out");
                    return CliErrors.InvalidInput;
                }
            }
            (StudyHeader header, List<System.Text.Json.JsonElement> items) = ShardFile.Join(files.Select(ShardFile.Read).ToList());
            string dir = StudyCommon.OutDir(pr.GetValue(outDir), "merged");
            if (!File.Exists(header.Netlist))
                throw new StudyFileException([$"{header.Netlist}: error: the study's netlist is not here. hint: run merge from the folder the shards were run from"]);
            NetlistDefinition net = NetlistLoader.Load(header.Netlist);
            string fmt = pr.GetValue(format)!;
            return OutputException.Guard(dir, () => header.Kind switch
            {
                "spread" => SpreadCommand.Finish(header, net, items.Select(SpreadRun.Read).ToList(), true, dir, fmt, output, error),
                "sweep" => MergeSweep(header, net, items, dir, fmt, output, error),
                "year" => YearCommand.Finish(header, net, items.Select(YearNight.Read).ToList(), true, dir, fmt, output, error),
                "tune" => TuneCommand.Merge(header, items, dir, fmt, output, error),
                _ => throw new StudyFileException([$"{files[0]}: error: unknown study kind '{header.Kind}'"]),
            });
        }));
        return command;
    }

    private static int MergeSweep(StudyHeader header, NetlistDefinition net, IReadOnlyList<JsonElement> items, string dir, string fmt, TextWriter output, TextWriter error)
    {
        List<string> specs = [.. header.Settings.Where(k => k.Key.StartsWith("vary", StringComparison.Ordinal)).Select(k => k.Value)];
        ScenarioVariants? variants = SweepCommand.Variants(specs, header.Scenario ?? "");
        return SweepCommand.Finish(header, net, SweepCommand.Axes(net, specs, variants), items.Select(SweepPoint.Read).ToList(), true, dir, fmt, output, error);
    }
}
