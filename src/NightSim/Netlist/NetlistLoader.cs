using System.Globalization;
using System.Text;
using NightSim.Devices;
using NightSim.Text;
using NightSim.Units;

namespace NightSim.Netlist;

/// <summary>
/// Reads a netlist JSON file (comments and trailing commas allowed), validates it against <see cref="PartCatalog"/>
/// and reports every problem at once, each with file, line:column, JSON path, part id and a hint.
/// </summary>
/// <remarks>
/// Format: top level { "$schema", "name", "description", "parts": [ … ] }; a part is { "id", "kind", "nodes": [ … ] }
/// for two-terminal kinds or { "id", "kind", "pins": { pin: node } } for multi-pin kinds, and its parameters are the
/// other keys ("value": "4k7"). Ground is written "gnd" (any case) and is normalised to "gnd"; a bare "0" is also taken as ground.
/// Checks: JSON syntax, unknown kind, missing or extra pins, unknown parameter (nearest valid name), bad value, value
/// out of its physical range, duplicate id, a node with a single connection, no ground, a loop of voltage sources, and
/// a node with no DC path to ground.
/// </remarks>
public static class NetlistLoader
{
    private static readonly string[] s_topLevelKeys = ["$schema", "name", "description", "parts"];

    /// <summary>Loads and validates the file at <paramref name="path"/>; throws <see cref="NetlistException"/> with
    /// every problem when it is not valid.</summary>
    public static NetlistDefinition Load(string path)
    {
        NetlistLoadResult result = Read(path);
        return result.IsValid ? result.Definition! : throw new NetlistException(result.Errors);
    }

    /// <summary>Loads and validates JSON text; <paramref name="fileName"/> is used in messages.</summary>
    public static NetlistDefinition LoadText(string json, string fileName = "netlist.json")
    {
        NetlistLoadResult result = ReadText(json, fileName);
        return result.IsValid ? result.Definition! : throw new NetlistException(result.Errors);
    }

    /// <summary>Reads and validates the file at <paramref name="path"/> without throwing for bad input.</summary>
    public static NetlistLoadResult Read(string path)
    {
        byte[]? bytes;
        string? tooBig;
        try
        {
            bytes = Utf8Check.ReadBounded(path, InputLimits.MaxInputBytes, out tooBig);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            string message = Directory.Exists(path) ? "this is a folder, not a netlist file"
                : ex is FileNotFoundException or DirectoryNotFoundException ? "file not found"
                : "cannot read the file: " + ex.Message.TrimEnd('.');
            return new NetlistLoadResult(null, [new NetlistError(path, 0, 0, "$", null, message, "check the path")], []);
        }
        if (bytes is null)
            return new NetlistLoadResult(null, [new NetlistError(path, 0, 0, "$", null, "the file " + tooBig, "give a netlist JSON file; an input file may hold at most 64 MB")], []);
        return ReadUtf8(bytes, path);
    }

    /// <summary>Reads and validates JSON text without throwing for bad input.</summary>
    public static NetlistLoadResult ReadText(string json, string fileName = "netlist.json") => ReadUtf8(Encoding.UTF8.GetBytes(json), fileName);

    private static NetlistLoadResult ReadUtf8(byte[] utf8, string file)
    {
        var session = new Session(file);
        if ((Utf8Check.Problem(utf8) ?? JsonEscapeCheck.Problem(utf8)) is { } bad)
        {
            session.Error(bad.Line, bad.Column, "$", null, bad.Message, bad.Hint);
            return session.Result(null);
        }
        JsonTree? root = JsonTree.Parse(utf8, out var syntax);
        if (root is null)
        {
            (string message, int line, int column) = syntax!.Value;
            session.Error(line, column, "$", null, message, message == "the file is empty"
                ? "write a netlist: { \"name\": \"my-circuit\", \"parts\": [ … ] }"
                : message.Contains("end of data", StringComparison.Ordinal) || message.Contains("depth to be zero", StringComparison.Ordinal)
                    ? "the file ends before the JSON does: is it complete (cut short while copying or saving)? else check the closing brackets"
                    : "check brackets, quotes and commas near this position");
            return session.Result(null);
        }
        return session.Result(session.ReadNetlist(root));
    }

    private sealed record NodeRef(string Node, string PartId, int PartIndex, string Path, int Line, int Column);

    private sealed class Session(string file)
    {
        private readonly List<NetlistError> _errors = [];
        private readonly List<NetlistError> _warnings = [];
        private readonly List<NodeRef> _nodeRefs = [];
        private readonly HashSet<string> _privateNodes = [];
        // Nodes named on a misspelt pin: the pin error explains why they lack a connection.
        private readonly HashSet<string> _nodesOnBadPins = new(StringComparer.Ordinal);
        private readonly Dictionary<string, string> _squeezedIds = new(StringComparer.Ordinal);

        public void Error(int line, int column, string path, string? partId, string message, string? hint) =>
            _errors.Add(new NetlistError(file, line, column, path, partId, message, hint));

        private void Error(JsonTree at, string path, string? partId, string message, string? hint) =>
            Error(at.Line, at.Column, path, partId, message, hint);

        private void Warning(int line, int column, string path, string? partId, string message, string? hint) =>
            _warnings.Add(new NetlistError(file, line, column, path, partId, message, hint) { IsWarning = true });

        public NetlistLoadResult Result(NetlistDefinition? definition)
        {
            List<NetlistError> errors = [.. _errors.OrderBy(e => e.Line).ThenBy(e => e.Column)];
            return new NetlistLoadResult(errors.Count == 0 ? definition : null, errors, _warnings);
        }

        public NetlistDefinition? ReadNetlist(JsonTree root)
        {
            if (root.Kind != JsonTreeKind.Object)
            {
                Error(root, "$", null, $"a netlist is a JSON object, not {root.Describe()}", "start the file with { \"name\": …, \"parts\": [ … ] }");
                return null;
            }
            foreach (JsonTreeProperty p in root.Properties)
            {
                if (!s_topLevelKeys.Contains(p.Name))
                {
                    UnknownKey(p, "$." + p.Name, null, s_topLevelKeys, "unknown top-level key {0}");
                }
            }
            DuplicateKeys(root, "$", null);

            string name = "";
            JsonTreeProperty? nameProp = root.Property("name");
            if (nameProp is null)
            {
                Error(root, "$", null, "missing \"name\"", "add \"name\": \"my-circuit\"");
            }
            else if (nameProp.Value.Kind != JsonTreeKind.String || string.IsNullOrWhiteSpace(nameProp.Value.Text))
            {
                Error(nameProp.Value, "$.name", null, $"\"name\" must be a non-empty string, not {nameProp.Value.Describe()}", "write e.g. \"name\": \"porch-light\"");
            }
            else
            {
                name = DisplayText.Clean(nameProp.Value.Text!);
            }

            string? description = null;
            if (root.Property("description") is { } descProp)
            {
                if (descProp.Value.Kind == JsonTreeKind.String) description = DisplayText.Clean(descProp.Value.Text!);
                else Error(descProp.Value, "$.description", null, $"\"description\" must be a string, not {descProp.Value.Describe()}", null);
            }
            if (root.Property("$schema") is { } schemaProp && schemaProp.Value.Kind != JsonTreeKind.String)
            {
                Error(schemaProp.Value, "$.$schema", null, "\"$schema\" must be a string", "write \"$schema\": \"./netlist.schema.json\"");
            }

            JsonTreeProperty? partsProp = root.Property("parts");
            if (partsProp is null)
            {
                Error(root, "$", null, "missing \"parts\"", "add \"parts\": [ { \"id\": \"R1\", \"kind\": \"resistor\", \"nodes\": [\"a\", \"0\"], \"value\": \"10k\" } ]");
                return null;
            }
            if (partsProp.Value.Kind != JsonTreeKind.Array)
            {
                Error(partsProp.Value, "$.parts", null, $"\"parts\" must be a list, not {partsProp.Value.Describe()}", "write \"parts\": [ … ]");
                return null;
            }
            if (partsProp.Value.Items.Count == 0)
            {
                Error(partsProp.Value, "$.parts", null, "the netlist has no parts", "add at least a source and a load");
                return null;
            }

            if (partsProp.Value.Items.Count > InputLimits.MaxParts)
            {
                Error(partsProp.Value, "$.parts", null, $"the netlist has {partsProp.Value.Items.Count} parts, more than the limit of {InputLimits.MaxParts} parts",
                    "split the circuit, or simulate the part of it that matters");
                return null;
            }
            var parts = new List<PartDefinition>();
            var ids = new Dictionary<string, JsonTree>(StringComparer.Ordinal);
            var kinds = new List<PartKind?>();
            for (int i = 0; i < partsProp.Value.Items.Count; i++)
            {
                (PartDefinition? part, PartKind? kind) = ReadPart(partsProp.Value.Items[i], i, ids);
                kinds.Add(kind);
                if (part is not null) parts.Add(part);
            }

            CheckNodes(partsProp.Value, kinds);
            return new NetlistDefinition(name, description, parts, file);
        }

        private (PartDefinition? Part, PartKind? Kind) ReadPart(JsonTree node, int index, Dictionary<string, JsonTree> ids)
        {
            string path = $"$.parts[{index}]";
            if (node.Kind != JsonTreeKind.Object)
            {
                Error(node, path, null, $"a part is a JSON object, not {node.Describe()}", "write { \"id\": \"R1\", \"kind\": \"resistor\", … }");
                return (null, null);
            }
            DuplicateKeys(node, path, null);

            string? id = null;
            JsonTreeProperty? idProp = node.Property("id");
            if (idProp is null)
            {
                Error(node, path, null, "missing \"id\"", "give every part a unique id, e.g. \"id\": \"R1\"");
            }
            else if (idProp.Value.Kind != JsonTreeKind.String || string.IsNullOrWhiteSpace(idProp.Value.Text))
            {
                Error(idProp.Value, path + ".id", null, $"\"id\" must be a non-empty string, not {idProp.Value.Describe()}", "write e.g. \"id\": \"R1\"");
            }
            else
            {
                id = idProp.Value.Text!;
                string squeezed = string.Concat(id.Where(c => !char.IsWhiteSpace(c)));
                if (id.Any(char.IsControl))
                {
                    Error(idProp.Value, path + ".id", null, $"id \"{Printable(id)}\" holds a control character (shown as �)",
                        "use letters, digits, '-' and '_' in ids, e.g. \"R1\"");
                }
                else if (id != id.Trim())
                {
                    Error(idProp.Value, path + ".id", null, $"id \"{Clip(id)}\" starts or ends with a space", $"write \"{Clip(id.Trim())}\"");
                }
                else if (ids.TryGetValue(id, out JsonTree? first))
                {
                    Error(idProp.Value, path + ".id", id, $"duplicate id \"{id}\" (first used on line {first.Line})", "give each part its own id, e.g. \"" + id + "b\"");
                }
                else if (_squeezedIds.TryGetValue(squeezed, out string? similar))
                {
                    Error(idProp.Value, path + ".id", id, $"id \"{Clip(id)}\" differs from \"{Clip(similar)}\" only by spaces",
                        "give each part a clearly different id, without spaces");
                }
                else
                {
                    ids[id] = idProp.Value;
                    _squeezedIds[squeezed] = id;
                }
            }
            string partId = id ?? $"#{index}";

            PartKind? kind = null;
            JsonTreeProperty? kindProp = node.Property("kind");
            string knownKinds = string.Join(", ", PartCatalog.All.Select(k => k.Name));
            if (kindProp is null)
            {
                Error(node, path, id, "missing \"kind\"", "known kinds: " + knownKinds);
            }
            else if (kindProp.Value.Kind != JsonTreeKind.String)
            {
                Error(kindProp.Value, path + ".kind", id, $"\"kind\" must be a string, not {kindProp.Value.Describe()}", "known kinds: " + knownKinds);
            }
            else
            {
                kind = PartCatalog.Find(kindProp.Value.Text!);
                if (kind is null)
                {
                    string? near = kindProp.Value.Text!.Length <= 64 ? NearestName.Find(kindProp.Value.Text!, PartCatalog.All.Select(k => k.Name)) : null;
                    Error(kindProp.Value, path + ".kind", id, $"unknown kind \"{Printable(kindProp.Value.Text!)}\"",
                        (near is null ? "" : $"did you mean \"{near}\"? ") + "known kinds: " + knownKinds);
                }
            }

            if (kind is null)
            {
                CollectLooseNodes(node, path, partId, index);
                return (null, null);
            }

            Dictionary<string, string>? pins = ReadPins(node, path, partId, index, kind);
            var reserved = new HashSet<string>(StringComparer.Ordinal) { "id", "kind", "nodes", "pins" };
            PartParameters? parameters = ReadParameters(kind.Parameters, node, path, partId, reserved, "a " + kind.Name);
            if (pins is null || parameters is null || id is null) return (null, kind);

            var location = new SourceLocation(file, path, node.Line, node.Column);
            var part = new PartDefinition(id, kind.Name, pins, parameters, location);
            int before = _errors.Count;
            CheckShortedPins(node, path, id, kind, pins);
            if (kind.Check is not null)
            {
                foreach (string message in kind.Check(part))
                {
                    (string m, string? h) = SplitHint(message);
                    Error(node, path, id, m, h);
                }
            }
            if (_errors.Count == before)
            {
                try
                {
                    _ = kind.Create(part).ToList();
                }
                catch (ArgumentException ex)
                {
                    string m = ex.Message;
                    int cut = m.IndexOf(" (Parameter", StringComparison.Ordinal);
                    if (cut > 0) m = m[..cut];
                    (string msg, string? hint) = SplitHint(m);
                    Error(node, path, id, msg, hint ?? "check the part's parameters against each other");
                }
            }
            return (_errors.Count == before ? part : null, kind);
        }

        /// <summary>A part with every pin on one node does nothing (warning); for a relay coil or a current source it
        /// cannot work at all (error). Voltage sources are left to the source-loop check.</summary>
        private void CheckShortedPins(JsonTree node, string path, string id, PartKind kind, Dictionary<string, string> pins)
        {
            if (kind.IsVoltageSource) return;
            List<string> group = [.. kind.PinsThatMustDiffer.Where(pins.ContainsKey)];
            if (group.Count >= 2 && group.Select(p => pins[p]).Distinct().Count() == 1)
            {
                Error(node, path, id, $"pins {string.Join(" and ", group)} of {id} are both on node \"{Shown(pins[group[0]])}\": shorted, the part cannot work",
                    "connect them to different nodes");
                return;
            }
            if (pins.Count >= 2 && pins.Values.Distinct().Count() == 1)
            {
                Warning(node.Line, node.Column, path, id, $"every pin of {id} is on node \"{Shown(pins.Values.First())}\": the part is shorted and does nothing",
                    "check the node names");
            }
        }

        /// <summary>Ground as the user writes it.</summary>
        private static string Shown(string node) => Ground.Is(node) ? Ground.Node : node;

        private static (string Message, string? Hint) SplitHint(string message)
        {
            int at = message.IndexOf("hint:", StringComparison.Ordinal);
            if (at < 0) return (message.TrimEnd('.', ' '), null);
            return (message[..at].TrimEnd('.', ' ', ';'), message[(at + 5)..].Trim());
        }

        private void CollectLooseNodes(JsonTree node, string path, string partId, int index)
        {
            if (node.Property("nodes") is { Value.Kind: JsonTreeKind.Array } nodes)
            {
                for (int i = 0; i < nodes.Value.Items.Count; i++)
                {
                    JsonTree item = nodes.Value.Items[i];
                    if (item.Kind == JsonTreeKind.String && !string.IsNullOrWhiteSpace(item.Text))
                        _nodeRefs.Add(new NodeRef(Ground.Normalize(item.Text!), partId, index, $"{path}.nodes[{i}]", item.Line, item.Column));
                }
            }
            if (node.Property("pins") is { Value.Kind: JsonTreeKind.Object } pins)
            {
                foreach (JsonTreeProperty p in pins.Value.Properties)
                {
                    if (p.Value.Kind == JsonTreeKind.String && !string.IsNullOrWhiteSpace(p.Value.Text))
                        _nodeRefs.Add(new NodeRef(Ground.Normalize(p.Value.Text!), partId, index, $"{path}.pins.{p.Name}", p.Value.Line, p.Value.Column));
                }
            }
        }

        private Dictionary<string, string>? ReadPins(JsonTree node, string path, string partId, int index, PartKind kind)
        {
            var pins = new Dictionary<string, string>(StringComparer.Ordinal);
            string pinList = string.Join(", ", kind.Pins);
            bool ok = true;
            if (kind.UsesNodeList)
            {
                if (node.Property("pins") is { } wrong)
                {
                    Error(wrong.Line, wrong.Column, path + ".pins", partId, $"a {kind.Name} lists its nodes as \"nodes\", not \"pins\"",
                        $"write \"nodes\": [{string.Join(", ", kind.Pins.Select(p => "\"<" + p + ">\""))}]");
                    return null;
                }
                JsonTreeProperty? nodesProp = node.Property("nodes");
                if (nodesProp is null)
                {
                    Error(node, path, partId, $"missing \"nodes\": a {kind.Name} has {kind.Pins.Count} pins ({pinList})",
                        $"write \"nodes\": [{string.Join(", ", kind.Pins.Select(p => "\"<" + p + ">\""))}]");
                    return null;
                }
                if (nodesProp.Value.Kind != JsonTreeKind.Array)
                {
                    Error(nodesProp.Value, path + ".nodes", partId, $"\"nodes\" must be a list of node names, not {nodesProp.Value.Describe()}",
                        $"write \"nodes\": [{string.Join(", ", kind.Pins.Select(p => "\"<" + p + ">\""))}]");
                    return null;
                }
                List<JsonTree> items = nodesProp.Value.Items;
                for (int i = 0; i < items.Count; i++)
                {
                    string itemPath = $"{path}.nodes[{i}]";
                    if (items[i].Kind != JsonTreeKind.String || string.IsNullOrWhiteSpace(items[i].Text))
                    {
                        Error(items[i], itemPath, partId, $"a node name must be a non-empty string, not {items[i].Describe()}", "ground is \"gnd\"");
                        ok = false;
                        continue;
                    }
                    string n = Ground.Normalize(items[i].Text!);
                    _nodeRefs.Add(new NodeRef(n, partId, index, itemPath, items[i].Line, items[i].Column));
                    if (i < kind.Pins.Count) pins[kind.Pins[i]] = n;
                }
                if (items.Count != kind.Pins.Count)
                {
                    string what = items.Count < kind.Pins.Count ? "missing pins" : "extra pins";
                    Error(nodesProp.Value, path + ".nodes", partId,
                        $"{what}: a {kind.Name} has {kind.Pins.Count} pins ({pinList}) but \"nodes\" lists {items.Count}",
                        $"list exactly {kind.Pins.Count} node names, in the order {pinList}");
                    ok = false;
                }
                return ok ? pins : null;
            }

            if (node.Property("nodes") is { } wrongList)
            {
                Error(wrongList.Line, wrongList.Column, path + ".nodes", partId, $"a {kind.Name} names its pins under \"pins\", not \"nodes\"",
                    $"write \"pins\": {{ {string.Join(", ", kind.Pins.Select(p => $"\"{p}\": \"<node>\""))} }}");
                return null;
            }
            JsonTreeProperty? pinsProp = node.Property("pins");
            if (pinsProp is null || pinsProp.Value.Kind != JsonTreeKind.Object)
            {
                JsonTree at = pinsProp?.Value ?? node;
                Error(at, pinsProp is null ? path : path + ".pins", partId,
                    pinsProp is null ? $"missing \"pins\": a {kind.Name} has pins {pinList}" : $"\"pins\" must be an object, not {pinsProp.Value.Describe()}",
                    $"write \"pins\": {{ {string.Join(", ", kind.Pins.Select(p => $"\"{p}\": \"<node>\""))} }}");
                return null;
            }
            DuplicateKeys(pinsProp.Value, path + ".pins", partId);
            foreach (JsonTreeProperty p in pinsProp.Value.Properties)
            {
                string pinPath = $"{path}.pins.{p.Name}";
                if (!kind.Pins.Contains(p.Name))
                {
                    string? near = NearestName.Find(p.Name, kind.Pins);
                    Error(p.Line, p.Column, pinPath, partId, $"extra pin \"{p.Name}\": a {kind.Name} has pins {pinList}",
                        near is null ? "remove it" : $"did you mean \"{near}\"?");
                    if (p.Value.Kind == JsonTreeKind.String && p.Value.Text is string bad) _nodesOnBadPins.Add(Ground.Normalize(bad));
                    ok = false;
                    continue;
                }
                if (p.Value.Kind != JsonTreeKind.String || string.IsNullOrWhiteSpace(p.Value.Text))
                {
                    Error(p.Value, pinPath, partId, $"a node name must be a non-empty string, not {p.Value.Describe()}", "ground is \"gnd\"");
                    ok = false;
                    continue;
                }
                string n = Ground.Normalize(p.Value.Text!);
                pins[p.Name] = n;
                _nodeRefs.Add(new NodeRef(n, partId, index, pinPath, p.Value.Line, p.Value.Column));
            }
            var missing = new List<string>();
            foreach (string pin in kind.Pins)
            {
                if (pins.ContainsKey(pin)) continue;
                // An optional pin left out stays absent: the kind decides what that means (a relay without that
                // contact, a timer with its control pin inside). Inventing a node here would leave it floating.
                if (kind.OptionalPins.Contains(pin)) continue;
                missing.Add(pin);
            }
            if (missing.Count > 0)
            {
                Error(pinsProp.Value, path + ".pins", partId,
                    $"missing {(missing.Count == 1 ? "pin" : "pins")} {string.Join(", ", missing.Select(m => "\"" + m + "\""))}: a {kind.Name} has pins {pinList}",
                    $"add {string.Join(", ", missing.Select(m => $"\"{m}\": \"<node>\""))}"
                        + (kind.OptionalPins.Count > 0 ? $" (optional pins: {string.Join(", ", kind.OptionalPins)})" : ""));
                ok = false;
            }
            return ok ? pins : null;
        }

        private void DuplicateKeys(JsonTree obj, string path, string? partId)
        {
            var seen = new HashSet<string>(StringComparer.Ordinal);
            foreach (JsonTreeProperty p in obj.Properties)
            {
                if (!seen.Add(p.Name))
                {
                    Error(p.Line, p.Column, $"{path}.{p.Name}", partId, $"\"{p.Name}\" is given twice", "keep one of them");
                }
            }
        }

        private void UnknownKey(JsonTreeProperty p, string path, string? partId, IEnumerable<string> valid, string what)
        {
            List<string> names = valid.ToList();
            string? successor = RetiredNames.Successor(p.Name, names);
            string? near = successor is null && p.Name.Length <= 64 ? NearestName.Find(p.Name, names) : null;
            string lead = successor is not null ? $"this parameter is now called \"{successor}\". "
                : near is not null ? $"did you mean \"{near}\"? " : "";
            if (path.Length > 80) path = path[..80] + "…";
            Error(p.Line, p.Column, path, partId, string.Format(CultureInfo.InvariantCulture, what, "\"" + Printable(p.Name) + "\""),
                lead + "valid: " + string.Join(", ", names));
        }

        private PartParameters? ReadParameters(IReadOnlyList<ParameterSpec> specs, JsonTree obj, string path, string partId,
            HashSet<string> reserved, string owner)
        {
            var numbers = new Dictionary<string, double>(StringComparer.Ordinal);
            var texts = new Dictionary<string, string>(StringComparer.Ordinal);
            var flags = new Dictionary<string, bool>(StringComparer.Ordinal);
            var points = new Dictionary<string, IReadOnlyList<(double X, double Y)>>(StringComparer.Ordinal);
            var objects = new Dictionary<string, PartParameters>(StringComparer.Ordinal);
            int before = _errors.Count;
            var given = new Dictionary<string, JsonTreeProperty>(StringComparer.Ordinal);

            foreach (JsonTreeProperty p in obj.Properties)
            {
                if (reserved.Contains(p.Name)) continue;
                string valuePath = $"{path}.{p.Name}";
                ParameterSpec? spec = specs.FirstOrDefault(s => s.Name == p.Name);
                if (spec is null)
                {
                    UnknownKey(p, valuePath, partId, specs.Select(s => s.Name), $"unknown parameter {{0}} for {owner}");
                    continue;
                }
                given.TryAdd(p.Name, p);
                JsonTree v = p.Value;
                switch (spec.Type)
                {
                    case ParameterType.Number:
                        if (ReadNumber(v, valuePath, partId, spec.Unit, spec) is { } number) numbers[spec.Name] = number;
                        break;
                    case ParameterType.Text:
                        if (v.Kind != JsonTreeKind.String)
                        {
                            Error(v, valuePath, partId, $"\"{spec.Name}\" must be a word, not {v.Describe()}", ChoicesHint(spec));
                        }
                        else if (spec.Choices is { Count: > 0 } choices)
                        {
                            string? match = choices.FirstOrDefault(c => c.Equals(v.Text, StringComparison.OrdinalIgnoreCase));
                            if (match is null)
                            {
                                string? near = NearestName.Find(v.Text!, choices);
                                Error(v, valuePath, partId, $"\"{v.Text}\" is not a valid {spec.Name}",
                                    (near is null ? "" : $"did you mean \"{near}\"? ") + ChoicesHint(spec));
                            }
                            else
                            {
                                texts[spec.Name] = match;
                            }
                        }
                        else
                        {
                            texts[spec.Name] = v.Text!;
                        }
                        break;
                    case ParameterType.Boolean:
                        if (v.Kind is JsonTreeKind.True or JsonTreeKind.False) flags[spec.Name] = v.Kind == JsonTreeKind.True;
                        else Error(v, valuePath, partId, $"\"{spec.Name}\" must be true or false, not {v.Describe()}", spec.Description);
                        break;
                    case ParameterType.Points:
                        if (ReadPoints(v, valuePath, partId, spec) is { } list) points[spec.Name] = list;
                        break;
                    case ParameterType.Object:
                        if (v.Kind != JsonTreeKind.Object)
                        {
                            Error(v, valuePath, partId, $"\"{spec.Name}\" must be an object, not {v.Describe()}",
                                $"write \"{spec.Name}\": {{ {string.Join(", ", (spec.Fields ?? []).Select(f => $"\"{f.Name}\": …"))} }}");
                        }
                        else
                        {
                            DuplicateKeys(v, valuePath, partId);
                            if (ReadParameters(spec.Fields ?? [], v, valuePath, partId, [], $"\"{spec.Name}\"") is { } nested) objects[spec.Name] = nested;
                        }
                        break;
                }
            }

            foreach (ParameterSpec spec in specs)
            {
                if (given.ContainsKey(spec.Name)) continue;
                if (spec.Required)
                {
                    string unit = spec.Unit.Length > 0 ? $" ({spec.Unit})" : "";
                    Error(obj, path, partId, $"missing required parameter \"{spec.Name}\"{unit}", $"add \"{spec.Name}\": {Explain(spec)}");
                    continue;
                }
                if (spec.ExclusiveGroup is not null) continue;
                if (spec.Default is { } d) numbers[spec.Name] = d;
                if (spec.DefaultText is { } t) texts[spec.Name] = t;
            }

            foreach (IGrouping<string, ParameterSpec> group in specs.Where(s => s.ExclusiveGroup is not null).GroupBy(s => s.ExclusiveGroup!))
            {
                List<JsonTreeProperty> present = group.Where(s => given.ContainsKey(s.Name)).Select(s => given[s.Name]).ToList();
                if (present.Count > 1)
                {
                    JsonTreeProperty second = present[1];
                    Error(second.Line, second.Column, $"{path}.{second.Name}", partId,
                        $"\"{present[0].Name}\" and \"{second.Name}\" exclude each other",
                        "give only one of " + string.Join(", ", group.Select(s => s.Name)));
                }
            }

            return _errors.Count == before ? new PartParameters(numbers, texts, flags, points, objects) : null;
        }

        private static string ChoicesHint(ParameterSpec spec) =>
            spec.Choices is { Count: > 0 } c ? "choose one of " + string.Join(", ", c.Select(x => "\"" + x + "\"")) : spec.Description;

        private double? ReadNumber(JsonTree v, string path, string partId, string unit, ParameterSpec? spec)
        {
            double value;
            string label = spec is null ? "value" : $"\"{spec.Name}\"";
            if (v.Kind == JsonTreeKind.Number)
            {
                value = double.Parse(v.Text!, NumberStyles.Float, CultureInfo.InvariantCulture);
            }
            else if (v.Kind == JsonTreeKind.String)
            {
                if (!EngineeringValue.TryParse(v.Text, unit, out value, out EngineeringValueError? error))
                {
                    Error(v, path, partId, $"bad value for {label}: {error!.Message}", error.Hint);
                    return null;
                }
            }
            else
            {
                Error(v, path, partId, $"{label} must be a number or an engineering value such as \"4k7\", not {v.Describe()}",
                    unit.Length > 0 ? $"write e.g. \"10k\" or \"100n{unit}\"" : "write a plain number, e.g. 0.5");
                return null;
            }
            if (!double.IsFinite(value))
            {
                Error(v, path, partId, $"{label} = {Clip(v.Text ?? "")} is too large to be a number (beyond ±1.8e308)",
                    "check the exponent; write the value in engineering notation, e.g. \"4k7\" or \"2.2M\"");
                return null;
            }
            if (spec is not null && (value < spec.Min || value > spec.Max || double.IsNaN(value)))
            {
                Error(v, path, partId, $"{label} = {EngineeringValue.Format(value, unit)} is outside its physical range {RangeText(spec)}",
                    $"\"{spec.Name}\" is {Explain(spec)}");
                return null;
            }
            return value;
        }

        /// <summary>The spec's description as a phrase: "the resistance, e.g. \"4k7\"".</summary>
        private static string Explain(ParameterSpec spec)
        {
            string d = spec.Description.TrimEnd('.');
            if (d.Length == 0) return spec.Name;
            bool acronym = d.Length > 1 && char.IsUpper(d[1]);
            return "the " + (acronym ? d : char.ToLowerInvariant(d[0]) + d[1..]);
        }

        private static string RangeText(ParameterSpec spec)
        {
            bool hasMin = !double.IsNegativeInfinity(spec.Min);
            bool hasMax = !double.IsPositiveInfinity(spec.Max);
            string min = EngineeringValue.Format(spec.Min, spec.Unit);
            string max = EngineeringValue.Format(spec.Max, spec.Unit);
            return hasMin && hasMax ? $"{min} … {max}" : hasMin ? $"≥ {min}" : hasMax ? $"≤ {max}" : "";
        }

        private IReadOnlyList<(double X, double Y)>? ReadPoints(JsonTree v, string path, string partId, ParameterSpec spec)
        {
            string example = $"write \"{spec.Name}\": [[0, 0], [\"1m\", 5]] as [{(spec.PointsXUnit == "s" ? "time" : "x")}, value] pairs";
            if (v.Kind != JsonTreeKind.Array)
            {
                Error(v, path, partId, $"\"{spec.Name}\" must be a list of [x, y] pairs, not {v.Describe()}", example);
                return null;
            }
            if (v.Items.Count == 0)
            {
                Error(v, path, partId, $"\"{spec.Name}\" needs at least one point", example);
                return null;
            }
            var list = new List<(double X, double Y)>();
            bool ok = true;
            for (int i = 0; i < v.Items.Count; i++)
            {
                JsonTree item = v.Items[i];
                string itemPath = $"{path}[{i}]";
                if (item.Kind != JsonTreeKind.Array || item.Items.Count != 2)
                {
                    Error(item, itemPath, partId, $"each point of \"{spec.Name}\" is a pair [x, y], not {item.Describe()}", example);
                    ok = false;
                    continue;
                }
                double? x = ReadNumber(item.Items[0], itemPath + "[0]", partId, spec.PointsXUnit, null);
                double? y = ReadNumber(item.Items[1], itemPath + "[1]", partId, spec.Unit, null);
                if (x is null || y is null)
                {
                    ok = false;
                    continue;
                }
                if (list.Count > 0 && !(x.Value > list[^1].X))
                {
                    Error(item.Items[0], itemPath + "[0]", partId,
                        $"point {i} of \"{spec.Name}\" is at {EngineeringValue.Format(x.Value, spec.PointsXUnit)}, not after {EngineeringValue.Format(list[^1].X, spec.PointsXUnit)}",
                        "list points in strictly increasing order");
                    ok = false;
                    continue;
                }
                list.Add((x.Value, y.Value));
            }
            return ok ? list : null;
        }

        /// <summary>Single-connection nodes that get a "did you mean" suggestion; the rest get the plain hint.</summary>
        private const int MaxNodeSuggestions = 50;

        private void CheckNodes(JsonTree partsArray, List<PartKind?> kinds)
        {
            var byNode = new Dictionary<string, List<NodeRef>>(StringComparer.Ordinal);
            foreach (NodeRef r in _nodeRefs)
            {
                if (!byNode.TryGetValue(r.Node, out List<NodeRef>? list)) byNode[r.Node] = list = [];
                list.Add(r);
            }

            if (!byNode.ContainsKey(Ground.Node))
            {
                Error(partsArray, "$.parts", null, "no part connects to ground",
                    "connect the supply's negative terminal (and every return) to \"gnd\"");
            }

            List<string> publicNodes = byNode.Keys.Where(n => n != Ground.Node && !_privateNodes.Contains(n)).ToList();
            if (byNode.ContainsKey(Ground.Node) && byNode.Count == 1 && _errors.Count == 0)
            {
                Error(partsArray, "$.parts", null, "every part connects only to ground: there is no circuit to simulate (\"0\" and \"gnd\" are the same node)",
                    "connect the parts between named nodes, e.g. \"nodes\": [\"in\", \"gnd\"]");
            }
            if (publicNodes.Count > InputLimits.MaxNodes)
            {
                Error(partsArray, "$.parts", null, $"the netlist has {publicNodes.Count} nodes, more than the limit of {InputLimits.MaxNodes} nodes",
                    "split the circuit, or simulate the part of it that matters");
            }
            int suggested = 0;
            foreach (string node in publicNodes)
            {
                List<NodeRef> refs = byNode[node];
                if (refs.Count == 1 && !_nodesOnBadPins.Contains(node))
                {
                    NodeRef r = refs[0];
                    // A misspelt ground ("0x", "gdn", "GND1") is far more likely than a near miss of another node. Each
                    // suggestion looks at every node: only the first few get one, so a netlist of many loose nodes stays linear.
                    string? near = Ground.LooksLike(node) ? Ground.Node
                        : ++suggested <= MaxNodeSuggestions ? NearestName.Find(node, publicNodes.Where(n => n != node)) : null;
                    Error(r.Line, r.Column, r.Path, r.PartId, $"node \"{node}\" has a single connection",
                        near == Ground.Node ? $"did you mean \"{Ground.Node}\"? ground is written \"{Ground.Node}\""
                        : near is not null ? $"did you mean \"{near}\"? every node needs at least two connections" : "connect it to another part, or check the spelling");
                }
            }
            foreach (IGrouping<string, string> same in publicNodes.GroupBy(n => n.ToLowerInvariant()).Where(g => g.Count() > 1))
            {
                NodeRef r = byNode[same.Skip(1).First()][0];
                Warning(r.Line, r.Column, r.Path, r.PartId, $"node names {string.Join(" and ", same.Select(n => "\"" + n + "\""))} differ only in case and are different nodes",
                    "use one spelling if they are meant to be the same node");
            }

            // Voltage-source loops: union of source terminals; a source joining two already joined nodes closes a loop.
            var sourceSets = new UnionFind();
            var sourcesIn = new Dictionary<string, List<string>>(StringComparer.Ordinal);
            foreach (IGrouping<int, NodeRef> part in _nodeRefs.GroupBy(r => r.PartIndex))
            {
                PartKind? kind = kinds[part.Key];
                if (kind is null || !kind.IsVoltageSource) continue;
                List<NodeRef> refs = part.ToList();
                if (refs.Count != 2) continue;
                string a = refs[0].Node, b = refs[1].Node;
                string ra = sourceSets.Find(a), rb = sourceSets.Find(b);
                if (ra == rb)
                {
                    List<string> others = sourcesIn.GetValueOrDefault(ra) ?? [];
                    JsonTree at = partsArray.Items[part.Key];
                    Error(at, $"$.parts[{part.Key}]", refs[0].PartId,
                        a == b ? $"both terminals of voltage source {refs[0].PartId} are on node \"{a}\""
                               : $"voltage sources form a loop: {refs[0].PartId} closes a loop with {string.Join(", ", others)} between \"{a}\" and \"{b}\"",
                        "ideal voltage sources cannot share a loop; remove one or put a resistance in series");
                    continue;
                }
                string root = sourceSets.Union(a, b);
                List<string> merged = [.. sourcesIn.GetValueOrDefault(ra) ?? [], .. sourcesIn.GetValueOrDefault(rb) ?? [], refs[0].PartId];
                sourcesIn[root] = merged;
            }

            // DC path to ground: union of nodes through parts that conduct at DC.
            if (!byNode.ContainsKey(Ground.Node)) return;
            var dc = new UnionFind();
            foreach (IGrouping<int, NodeRef> part in _nodeRefs.GroupBy(r => r.PartIndex))
            {
                PartKind? kind = kinds[part.Key];
                if (kind is not null && !kind.ConductsDc) continue;
                string first = part.First().Node;
                foreach (NodeRef r in part) dc.Union(first, r.Node);
            }
            string groundRoot = dc.Find(Ground.Node);
            foreach (IGrouping<string, string> island in byNode.Keys.Where(n => dc.Find(n) != groundRoot).GroupBy(dc.Find))
            {
                List<string> names = island.Where(n => !_privateNodes.Contains(n)).ToList();
                if (names.Count == 0) continue;
                NodeRef r = byNode[names[0]][0];
                string list = string.Join(", ", names.Select(n => "\"" + n + "\""));
                Error(r.Line, r.Column, r.Path, r.PartId,
                    names.Count == 1 ? $"node {list} has no DC path to ground" : $"nodes {list} have no DC path to ground",
                    $"they connect only through capacitors or current sources; add a leak resistor, e.g. {{ \"kind\": \"resistor\", \"nodes\": [\"{names[0]}\", \"gnd\"], \"value\": \"100M\" }}");
            }
        }
    }

    /// <summary>Disjoint sets of node names.</summary>
    private sealed class UnionFind
    {
        private readonly Dictionary<string, string> _parent = new(StringComparer.Ordinal);

        public string Find(string x)
        {
            if (!_parent.TryGetValue(x, out string? p))
            {
                _parent[x] = x;
                return x;
            }
            // Iterative with path compression: a long chain of unions must not exhaust the stack.
            string root = x;
            while (_parent[root] is var up && up != root) root = up;
            while (x != root)
            {
                string next = _parent[x];
                _parent[x] = root;
                x = next;
            }
            return root;
        }

        public string Union(string a, string b)
        {
            string ra = Find(a), rb = Find(b);
            if (ra != rb) _parent[rb] = ra;
            return ra;
        }
    }

    /// <summary>Text echoed in a message: control characters shown as �.</summary>
    private static string Printable(string text) => Clip(new string([.. text.Select(c => char.IsControl(c) ? '\uFFFD' : c)]));

    /// <summary>Long text echoed in a message is cut to its first 40 characters.</summary>
    private static string Clip(string text) => text.Length <= 40 ? text : text[..40] + "…";
}
