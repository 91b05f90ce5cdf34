namespace NightSim.Netlist;

/// <summary>What a parameter value looks like in the netlist.</summary>
public enum ParameterType
{
    /// <summary>A number, as a JSON number or an engineering string ("4k7", "100nF").</summary>
    Number,
    /// <summary>One word out of <see cref="ParameterSpec.Choices"/> (or free text when no choices are given).</summary>
    Text,
    /// <summary>true or false.</summary>
    Boolean,
    /// <summary>A list of [time, value] pairs, e.g. a piecewise-linear waveform: [[0, 0], ["1m", 5]].</summary>
    Points,
    /// <summary>A nested object whose fields are described by <see cref="ParameterSpec.Fields"/>.</summary>
    Object,
}

/// <summary>Describes one parameter of a part kind: name, type, unit, default and physical range.</summary>
/// <param name="Name">JSON name (camelCase), e.g. "value", "r10", "pullIn".</param>
/// <param name="Type">Value type.</param>
/// <param name="Unit">SI unit symbol for numbers ("Ω", "F", "V", "s", "lx", …), "" for dimensionless.</param>
/// <param name="Description">One line for help, schema and error hints.</param>
public sealed record ParameterSpec(string Name, ParameterType Type, string Unit, string Description)
{
    /// <summary>Default for numbers when the parameter is absent; null = none (then <see cref="Required"/> or optional).</summary>
    public double? Default { get; init; }

    /// <summary>Default for text parameters.</summary>
    public string? DefaultText { get; init; }

    /// <summary>Must be given.</summary>
    public bool Required { get; init; }

    /// <summary>Smallest physically sensible value (inclusive).</summary>
    public double Min { get; init; } = double.NegativeInfinity;

    /// <summary>Largest physically sensible value (inclusive).</summary>
    public double Max { get; init; } = double.PositiveInfinity;

    /// <summary>Allowed words for <see cref="ParameterType.Text"/>.</summary>
    public IReadOnlyList<string>? Choices { get; init; }

    /// <summary>Fields of an <see cref="ParameterType.Object"/> parameter.</summary>
    public IReadOnlyList<ParameterSpec>? Fields { get; init; }

    /// <summary>Unit of the first column of <see cref="ParameterType.Points"/> (default "s").</summary>
    public string PointsXUnit { get; init; } = "s";

    /// <summary>Number of parameters of the object when described as a group of mutually exclusive alternatives
    /// (e.g. a source is one of constant / pulse / sine / points). Names listed here exclude each other.</summary>
    public string? ExclusiveGroup { get; init; }

    public static ParameterSpec Number(string name, string unit, string description) => new(name, ParameterType.Number, unit, description);
    public static ParameterSpec Word(string name, string description, params string[] choices) => new(name, ParameterType.Text, "", description) { Choices = choices };
    public static ParameterSpec Flag(string name, string description) => new(name, ParameterType.Boolean, "", description);
    public static ParameterSpec PointList(string name, string yUnit, string description) => new(name, ParameterType.Points, yUnit, description);
    public static ParameterSpec Group(string name, string description, params ParameterSpec[] fields) => new(name, ParameterType.Object, "", description) { Fields = fields };
}
