using System.Globalization;
using NightSim.Devices;
using NightSim.Netlist;
using NightSim.Runs;

namespace NightSim.Studies;

/// <summary>
/// A grid of night runs over one or more part parameters: point i sets axis 0 to value i mod n0, axis 1 to
/// (i / n0) mod n1, and so on; the scenario (and its seed) is the same for every point, so only the swept values differ.
/// </summary>
public sealed class SweepStudy
{
    private readonly NightRunRequest _base;
    private readonly StudyRunBuffers _buffers = new();

    public SweepStudy(NightRunRequest request, IReadOnlyList<SweepAxis> axes)
    {
        ArgumentNullException.ThrowIfNull(request.Scenario);
        if (axes.Count == 0) throw new ArgumentException("at least one axis", nameof(axes));
        _base = request;
        Axes = axes;
        Total = axes.Aggregate(1, (n, a) => checked(n * a.Values.Count));
    }

    public IReadOnlyList<SweepAxis> Axes { get; }
    public int Total { get; }

    /// <summary>Checks "PART.param" against the netlist: the part exists and the parameter is a number of its kind.
    /// Returns the axis or null with a message naming the part.</summary>
    public static SweepAxis? Axis(NetlistDefinition net, string spec, out string? error)
    {
        error = null;
        int eq = spec.IndexOf('=', StringComparison.Ordinal);
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
        List<KeyValuePair<string, double>> values = ValuesOf(index);
        NightRunResult r = NightRun.Run(_buffers.ForThisThread(_base with { Netlist = ToleranceModel.Apply(_base.Netlist, values) }));
        return new SweepPoint(index, values, StudyOutcome.From(r));
    }
}
