namespace NightSim.Netlist;

/// <summary>
/// Validated, typed parameter values of one part (SI units). Built by the netlist loader from the part's JSON and its
/// <see cref="ParameterSpec"/> list, defaults applied; device factories read it. Immutable.
/// </summary>
public sealed class PartParameters
{
    private readonly Dictionary<string, double> _numbers;
    private readonly Dictionary<string, string> _texts;
    private readonly Dictionary<string, bool> _flags;
    private readonly Dictionary<string, IReadOnlyList<(double X, double Y)>> _points;
    private readonly Dictionary<string, PartParameters> _objects;

    public PartParameters(
        IReadOnlyDictionary<string, double>? numbers = null,
        IReadOnlyDictionary<string, string>? texts = null,
        IReadOnlyDictionary<string, bool>? flags = null,
        IReadOnlyDictionary<string, IReadOnlyList<(double X, double Y)>>? points = null,
        IReadOnlyDictionary<string, PartParameters>? objects = null)
    {
        _numbers = numbers is null ? [] : new Dictionary<string, double>(numbers, StringComparer.Ordinal);
        _texts = texts is null ? [] : new Dictionary<string, string>(texts, StringComparer.Ordinal);
        _flags = flags is null ? [] : new Dictionary<string, bool>(flags, StringComparer.Ordinal);
        _points = points is null ? [] : new Dictionary<string, IReadOnlyList<(double X, double Y)>>(points, StringComparer.Ordinal);
        _objects = objects is null ? [] : new Dictionary<string, PartParameters>(objects, StringComparer.Ordinal);
    }

    public static PartParameters Empty { get; } = new();

    /// <summary>True when the parameter was given (or has a default).</summary>
    public bool Has(string name) =>
        _numbers.ContainsKey(name) || _texts.ContainsKey(name) || _flags.ContainsKey(name) || _points.ContainsKey(name) || _objects.ContainsKey(name);

    /// <summary>A number in SI units; throws <see cref="KeyNotFoundException"/> if absent (the loader guarantees required ones).</summary>
    public double Number(string name) => _numbers.TryGetValue(name, out double v) ? v : throw new KeyNotFoundException($"parameter '{name}' is not set");

    /// <summary>A number in SI units, or <paramref name="fallback"/> when absent.</summary>
    public double Number(string name, double fallback) => _numbers.TryGetValue(name, out double v) ? v : fallback;

    public double? OptionalNumber(string name) => _numbers.TryGetValue(name, out double v) ? v : null;

    public string Text(string name, string fallback = "") => _texts.TryGetValue(name, out string? v) ? v : fallback;

    public bool Flag(string name, bool fallback = false) => _flags.TryGetValue(name, out bool v) ? v : fallback;

    public IReadOnlyList<(double X, double Y)>? Points(string name) => _points.TryGetValue(name, out var v) ? v : null;

    public PartParameters? Object(string name) => _objects.TryGetValue(name, out PartParameters? v) ? v : null;

    /// <summary>Names of all parameters present.</summary>
    public IEnumerable<string> Names => _numbers.Keys.Concat(_texts.Keys).Concat(_flags.Keys).Concat(_points.Keys).Concat(_objects.Keys);

    /// <summary>A copy with one number replaced (sweeps and tolerance spreads).</summary>
    public PartParameters WithNumber(string name, double value)
    {
        var numbers = new Dictionary<string, double>(_numbers, StringComparer.Ordinal) { [name] = value };
        return new PartParameters(numbers, _texts, _flags, _points, _objects);
    }
}
