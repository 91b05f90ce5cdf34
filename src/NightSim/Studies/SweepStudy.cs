using System.Globalization;
using NightSim.Devices;
using NightSim.Netlist;
using NightSim.Runs;

namespace NightSim.Studies;

/// <summary>
/// A grid of night runs over part parameters, numbers in the scenario and scenario files: point i sets axis 0 to value
/// i mod n0, axis 1 to (i / n0) mod n1, and so on. Everything not swept (the scenario's seed included) is the same for
/// every point, so only the swept values differ.
/// </summary>
public sealed class SweepStudy
{
    private readonly NightRunRequest _base;
    private readonly ScenarioVariants? _scenarios;
    private readonly StudyRunBuffers _buffers = new();

    /// <param name="request">The design and its (first) scenario.</param>
    /// <param name="axes">What to vary.</param>
    /// <param name="scenarios">The scenario files the scenario axes refer to; needed when an axis sets the scenario.</param>
    public SweepStudy(NightRunRequest request, IReadOnlyList<SweepAxis> axes, ScenarioVariants? scenarios = null)
    {
        ArgumentNullException.ThrowIfNull(request.Scenario);
        if (axes.Count == 0) throw new ArgumentException("at least one axis", nameof(axes));
        if (scenarios is null && axes.Any(a => a.Target != SweepTarget.Part)) throw new ArgumentException("scenario axes need the scenario files", nameof(scenarios));
        _base = request;
        _scenarios = scenarios;
        Axes = axes;
        Total = axes.Aggregate(1, (n, a) => checked(n * a.Values.Count));
    }

    public IReadOnlyList<SweepAxis> Axes { get; }
    public int Total { get; }

    /// <summary>Checks "PART.param" against the netlist (the part exists and the parameter is a number of its kind),
    /// "scenario.path" against the scenario files (a number is there in every file, and every value makes a valid
    /// scenario) or "scenario=FILE,FILE" (the files, already read into <paramref name="scenarios"/>). Returns the axis
    /// or null with a message naming the part or the file.</summary>
    public static SweepAxis? Axis(NetlistDefinition net, string spec, out string? error, ScenarioVariants? scenarios = null)
    {
        error = null;
        int eq = spec.IndexOf('=', StringComparison.Ordinal);
        if (eq > 0 && spec[..eq] == SweepAxis.ScenarioPrefix) return FileAxis(spec, eq, scenarios, out error);
        if (eq > 0 && spec.StartsWith(SweepAxis.ScenarioPrefix + ".", StringComparison.Ordinal) && net.Part(SweepAxis.ScenarioPrefix) is null)
        {
            return FieldAxis(spec, eq, scenarios, out error);
        }
        int dot = eq > 0 ? spec.LastIndexOf('.', eq) : -1;
        if (eq < 0 || dot <= 0)
        {
            error = $"--vary '{spec}': write PART.PARAM=VALUES, e.g. --vary CF.value=E12:1n..100n";
            return null;
        }
        string id = spec[..dot], name = spec[(dot + 1)..eq];
        PartDefinition? part = net.Part(id);
        if (part is null)
        {
            error = $"--vary '{spec}': the netlist has no part '{id}'. hint: parts: {string.Join(", ", net.Parts.Select(p => p.Id))}";
            return null;
        }
        PartKind kind = PartCatalog.Find(part.Kind)!;
        ParameterSpec? p = kind.Parameters.FirstOrDefault(x => x.Name == name);
        if (p is null || p.Type != ParameterType.Number)
        {
            error = $"--vary '{spec}': part '{id}' ({part.Kind}) has no number parameter '{name}'. hint: {string.Join(", ", kind.Parameters.Where(x => x.Type == ParameterType.Number).Select(x => x.Name))}";
            return null;
        }
        IReadOnlyList<double>? values = SweepAxis.ParseValues(spec[(eq + 1)..], p.Unit, out bool log, out string? vErr);
        if (values is null)
        {
            error = $"--vary '{spec}': {vErr}";
            return null;
        }
        foreach (double v in values)
        {
            if (v < p.Min || v > p.Max)
            {
                error = string.Create(CultureInfo.InvariantCulture, $"--vary '{spec}': {v:G4} is outside the range of {id}.{name} ({p.Min:G4} … {p.Max:G4} {p.Unit})");
                return null;
            }
        }
        return new SweepAxis(id, name, values, spec[(eq + 1)..], log, p.Unit);
    }

    /// <summary>"scenario=a.json,b.json": the files of <paramref name="scenarios"/>, which must be these.</summary>
    private static SweepAxis? FileAxis(string spec, int eq, ScenarioVariants? scenarios, out string? error)
    {
        error = null;
        string[] files = [.. spec[(eq + 1)..].Split(',').Select(f => f.Trim())];
        if (scenarios is null || !scenarios.Files.SequenceEqual(files))
        {
            error = $"--vary '{spec}': give several scenarios as --scenario FILE --scenario FILE";
            return null;
        }
        // Labels: the file names without their folder and ".scenario.json" when that tells them apart.
        string[] shortNames = [.. files.Select(f => Path.GetFileName(f) is var n && n.EndsWith(".scenario.json", StringComparison.OrdinalIgnoreCase) ? n[..^".scenario.json".Length] : Path.GetFileNameWithoutExtension(f))];
        return new SweepAxis(SweepAxis.ScenarioPrefix, "", [.. Enumerable.Range(0, files.Length).Select(i => (double)i)], string.Join(",", files), false, "")
        {
            Target = SweepTarget.ScenarioFile,
            Labels = shortNames.Distinct(StringComparer.Ordinal).Count() == files.Length ? shortNames : files,
        };
    }

    /// <summary>"scenario.events[0].peakLux=VALUES": a number in every scenario file; each value is written into every
    /// file and read back, so a value the scenario cannot take is reported with the loader's own message.</summary>
    private static SweepAxis? FieldAxis(string spec, int eq, ScenarioVariants? scenarios, out string? error)
    {
        error = null;
        string path = spec[(SweepAxis.ScenarioPrefix.Length + 1)..eq];
        if (scenarios is null)
        {
            error = $"--vary '{spec}': no scenario to set it in";
            return null;
        }
        if (scenarios.CheckNumber(path) is string why)
        {
            error = $"--vary '{spec}': {why}. hint: name a number of the scenario file, e.g. scenario.weather.floorLux or scenario.events[0].peakLux";
            return null;
        }
        IReadOnlyList<double>? values = SweepAxis.ParseValues(spec[(eq + 1)..], null, out bool log, out string? vErr);
        if (values is null)
        {
            error = $"--vary '{spec}': {vErr}";
            return null;
        }
        for (int f = 0; f < scenarios.Files.Count; f++)
        {
            foreach (double v in values)
            {
                try
                {
                    scenarios.Build(f, [new(path, v)]);
                }
                catch (StudyFileException e)
                {
                    error = string.Create(CultureInfo.InvariantCulture, $"--vary '{spec}': the value {v:G6} does not fit the scenario:\n  ") + string.Join("\n  ", e.Lines);
                    return null;
                }
            }
        }
        return new SweepAxis(SweepAxis.ScenarioPrefix, path, values, spec[(eq + 1)..], log, "") { Target = SweepTarget.ScenarioField, Prefixed = scenarios.WrittenAsText(path) };
    }

    public StudyHeader Header(string tool) => new()
    {
        Kind = "sweep",
        Tool = tool,
        Netlist = _base.NetlistPath,
        Scenario = _base.ScenarioPath,
        Seed = _base.Scenario!.Seed,
        Total = Total,
        Settings = [.. Axes.Select((a, i) => new KeyValuePair<string, string>("vary" + (i + 1).ToString(CultureInfo.InvariantCulture), a.Key + "=" + a.Text))],
    };

    /// <summary>The run request of point <paramref name="index"/>: the part values applied to the netlist and, when
    /// an axis sets the scenario, the scenario file of the point with its swept numbers written in.</summary>
    public NightRunRequest Request(int index)
    {
        List<KeyValuePair<string, double>> values = ValuesOf(index);
        var parts = new List<KeyValuePair<string, double>>();
        var fields = new List<KeyValuePair<string, double>>();
        int file = -1;
        for (int i = 0; i < Axes.Count; i++)
        {
            switch (Axes[i].Target)
            {
                case SweepTarget.Part: parts.Add(values[i]); break;
                case SweepTarget.ScenarioField: fields.Add(new(Axes[i].Parameter, values[i].Value)); break;
                case SweepTarget.ScenarioFile: file = (int)values[i].Value; break;
            }
        }
        NightRunRequest request = _base with { Netlist = ToleranceModel.Apply(_base.Netlist, parts) };
        if (file < 0 && fields.Count == 0) return request;
        int f = Math.Max(file, 0);
        return request with { Scenario = _scenarios!.Build(f, fields), ScenarioPath = _scenarios.Files[f] };
    }

    /// <summary>The swept values of point <paramref name="index"/>.</summary>
    public List<KeyValuePair<string, double>> ValuesOf(int index)
    {
        var list = new List<KeyValuePair<string, double>>(Axes.Count);
        int rest = index;
        foreach (SweepAxis a in Axes)
        {
            list.Add(new(a.Key, a.Values[rest % a.Values.Count]));
            rest /= a.Values.Count;
        }
        return list;
    }

    public SweepPoint Run(int index)
    {
        NightRunResult r = NightRun.Run(_buffers.ForThisThread(Request(index)));
        return new SweepPoint(index, ValuesOf(index), StudyOutcome.From(r));
    }
}
