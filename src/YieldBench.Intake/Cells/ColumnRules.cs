using YieldBench.Core.Lots;

namespace YieldBench.Intake;

/// <summary>An explicit mapping of one header to one field (from --column or a mapping file).</summary>
internal sealed record MappingRule(string FieldName, FieldDef? LotField, FieldDef? LogField, ColumnUnit Unit, string Header, string Origin, int? Line)
{
    public bool Matches(string header) =>
        string.Equals(header.Trim(), Header, StringComparison.OrdinalIgnoreCase)
        || HeaderText.Normalise(header) == HeaderText.Normalise(Header);

    public FieldDef? For(TableKind kind) => kind == TableKind.Lots ? LotField : LogField;

    /// <summary>Set once a sheet used the rule, so unused rules can be reported.</summary>
    public bool Used { get; set; }
}

/// <summary>Checks one explicit mapping as typed on a command line, before anything is read.</summary>
public static class ColumnMapping
{
    /// <summary>
    /// What is wrong with a "FIELD=HEADER" mapping, or null when it is one: the same words intake reports for a bad
    /// mapping line (an unknown field's message lists every field name).
    /// </summary>
    public static string? Problem(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        int eq = text.IndexOf('=');
        string field = eq > 0 ? text[..eq].Trim() : "";
        string header = eq > 0 ? text[(eq + 1)..].Trim() : "";
        if (field.Length == 0 || header.Length == 0)
        {
            return $"'{TextSettling.ForDisplay(text)}': " + IntakeMessages.MappingLineNotUnderstood();
        }

        return ColumnRules.FieldAliases.ContainsKey(field)
            ? null
            : IntakeMessages.MappingUnknownField(TextSettling.ForDisplay(field), ColumnRules.FieldAliases.Keys.Order(StringComparer.Ordinal));
    }
}

/// <summary>Explicit column mappings and the synonym indexes the header matcher uses.</summary>
internal static class ColumnRules
{
    /// <summary>Largest mapping file read, bytes (1 MiB: thousands of mapping lines).</summary>
    public const long MaxMappingFileBytes = 1L << 20;

    public static readonly IReadOnlyDictionary<string, FieldDef> LotIndex = BuildIndex(Fields.Lots);

    public static readonly IReadOnlyDictionary<string, FieldDef> LogIndex = BuildIndex(Fields.Log);

    // Sugar scale words a header may end with after the field's name, as a unit written without brackets
    // ("Mostgewicht °Oe", "Start sugar °Bx").
    private static readonly HashSet<string> TrailingScaleWords = ["bx", "brix", "sg", "oe", "oechsle", "kmw", "babo", "be", "baume", "bau"];

    /// <summary>
    /// The field a header names, or null: its field key (brackets and unit words dropped), else its whole normalised
    /// text, else — for a sugar field only — its field key without a trailing scale word ("Mostgewicht °Oe" is
    /// "mostgewicht"; the scale itself is read from the header as before).
    /// </summary>
    public static FieldDef? Find(string header, TableKind kind)
    {
        var index = kind == TableKind.Lots ? LotIndex : LogIndex;
        string key = HeaderText.FieldKey(header);
        if (index.TryGetValue(key, out var field) || index.TryGetValue(HeaderText.Normalise(header), out field))
        {
            return field;
        }

        if (kind == TableKind.Lots && QuantityWithUnit(key, header) is { } quantity)
        {
            return quantity;
        }

        int last = key.LastIndexOf(' ');
        return last > 0 && TrailingScaleWords.Contains(key[(last + 1)..]) && index.TryGetValue(key[..last], out field) && field.Kind == FieldKind.Sugar
            ? field
            : null;
    }

    /// <summary>
    /// A lots table's must or sugar named by a bare word with a unit of volume or mass, which says what is meant: "Must
    /// (gal)", "Must vol (gal)" (whose "vol" is dropped as a unit word), "Juice (L)" are the must volume; "Sugar (lb)",
    /// "Sucrose kg" the sugar added (a bare "Sugar" stays too vague). A header naming a sugar scale or g/L ("Must g/L")
    /// is none of these.
    /// </summary>
    private static FieldDef? QuantityWithUnit(string key, string header)
    {
        if (HeaderText.UnitFromHeader(header, FieldKind.Sugar) != ColumnUnit.None)
        {
            return null;
        }

        if (key is "must" or "juice" or "must juice" or "juice must" && HeaderText.UnitFromHeader(header, FieldKind.Volume) != ColumnUnit.None)
        {
            return Fields.Lots.First(f => f.Name == "must_volume_l");
        }

        return key is "sugar" or "cane sugar" or "beet sugar" && HeaderText.UnitFromHeader(header, FieldKind.Mass) is ColumnUnit.Kilogram or ColumnUnit.Pound
            ? Fields.Lots.First(f => f.Name == "sugar_added_kg")
            : null;
    }

    private static Dictionary<string, FieldDef> BuildIndex(IEnumerable<FieldDef> fields)
    {
        var index = new Dictionary<string, FieldDef>(StringComparer.Ordinal);
        foreach (var f in fields)
        {
            // The canonical name itself is always a synonym ("starting_sugar" → "starting sugar").
            foreach (var s in f.Synonyms.Prepend(f.Name))
            {
                index.TryAdd(HeaderText.Normalise(s), f);
            }
        }

        return index;
    }

    /// <summary>Names accepted on the left of a mapping: canonical fields plus unit-bearing aliases.</summary>
    public static IReadOnlyDictionary<string, (string Field, ColumnUnit Unit)> FieldAliases { get; } = BuildAliases();

    private static Dictionary<string, (string, ColumnUnit)> BuildAliases()
    {
        var a = new Dictionary<string, (string, ColumnUnit)>(StringComparer.OrdinalIgnoreCase);
        foreach (var f in Fields.All)
        {
            a.TryAdd(f.Name, (f.Name, ColumnUnit.None));
            if (f.Kind == FieldKind.Volume && f.Name.EndsWith("_l", StringComparison.Ordinal))
            {
                string stem = f.Name[..^2];
                a.TryAdd(stem + "_hl", (f.Name, ColumnUnit.Hectolitre));
                a.TryAdd(stem + "_gal", (f.Name, ColumnUnit.UsGallon));
                a.TryAdd(stem + "_kl", (f.Name, ColumnUnit.Kilolitre));
            }
            else if (f.Kind == FieldKind.Mass && f.Name.EndsWith("_kg", StringComparison.Ordinal))
            {
                string stem = f.Name[..^3];
                a.TryAdd(stem + "_lb", (f.Name, ColumnUnit.Pound));
                a.TryAdd(stem + "_g", (f.Name, ColumnUnit.Gram));
            }
            else if (f.Kind == FieldKind.Temperature && f.Name.EndsWith("_c", StringComparison.Ordinal))
            {
                a.TryAdd(f.Name[..^2] + "_f", (f.Name, ColumnUnit.Fahrenheit));
            }
        }

        foreach (var (stem, field) in new[] { ("starting", "starting_sugar"), ("final", "final_sugar"), ("sugar", "sugar") })
        {
            a.TryAdd(stem + "_brix", (field, ColumnUnit.Brix));
            a.TryAdd(stem + "_sg", (field, ColumnUnit.SpecificGravity));
            a.TryAdd(stem + "_baume", (field, ColumnUnit.Baume));
            a.TryAdd(stem + "_oechsle", (field, ColumnUnit.Oechsle));
            a.TryAdd(stem + "_kmw", (field, ColumnUnit.Kmw));
            a.TryAdd(stem + (stem == "sugar" ? "_gl" : "_sugar_gl"), (field, ColumnUnit.SugarGramsPerLitre));
        }

        a.TryAdd("final_alcohol_gl", ("final_abv", ColumnUnit.AlcoholGramsPerLitre));
        return a;
    }

    /// <summary>Parses "FIELD=HEADER" texts from --column and the mapping file; problems become issues.</summary>
    public static List<MappingRule> Parse(IntakeOptions options, string? mappingDisplayPath, string? mappingFullPath, IssueSink sink)
    {
        var rules = new List<MappingRule>();
        foreach (var text in options.ColumnMappings)
        {
            AddRule(text, "--column", null, sink, rules);
        }

        if (mappingFullPath is not null && mappingDisplayPath is not null)
        {
            if (!File.Exists(mappingFullPath))
            {
                sink.Error(mappingDisplayPath, null, null, null, null, IssueCodes.MappingFileNotFound, IntakeMessages.MappingFileNotFound());
                return rules;
            }

            // Checked from the directory entry before opening: a pipe would block the open, a device would never end.
            long length = SourceFiles.EntryLength(mappingFullPath);
            if (length == 0 || length > MaxMappingFileBytes)
            {
                sink.Error(mappingDisplayPath, null, null, null, null, IssueCodes.MappingFileRefused, IntakeMessages.MappingFileRefused(length, MaxMappingFileBytes));
                return rules;
            }

            using var stream = SourceFiles.OpenShared(mappingFullPath);
            using var reader = new StreamReader(stream, System.Text.Encoding.UTF8, detectEncodingFromByteOrderMarks: true);
            int lineNo = 0;
            while (reader.ReadLine() is { } line)
            {
                lineNo++;
                string content = line;
                int hash = content.IndexOf('#');
                if (hash >= 0)
                {
                    content = content[..hash];
                }

                if (content.Trim().Length == 0)
                {
                    continue;
                }

                AddRule(content, mappingDisplayPath, lineNo, sink, rules);
            }
        }

        return rules;
    }

    private static void AddRule(string text, string origin, int? line, IssueSink sink, List<MappingRule> rules)
    {
        int eq = text.IndexOf('=');
        string field = eq > 0 ? text[..eq].Trim() : "";
        string header = eq > 0 ? text[(eq + 1)..].Trim() : "";
        if (field.Length == 0 || header.Length == 0)
        {
            sink.Error(origin, null, line, null, text.Trim(), IssueCodes.MappingNotUnderstood, IntakeMessages.MappingLineNotUnderstood());
            return;
        }

        if (!FieldAliases.TryGetValue(field, out var alias))
        {
            sink.Error(origin, null, line, null, field, IssueCodes.MappingUnknownField, IntakeMessages.MappingUnknownField(field, FieldAliases.Keys.Order(StringComparer.Ordinal)));
            return;
        }

        var lotField = Fields.Lots.FirstOrDefault(f => f.Name == alias.Field);
        var logField = Fields.Log.FirstOrDefault(f => f.Name == alias.Field);
        rules.Add(new MappingRule(alias.Field, lotField, logField, alias.Unit, header, origin, line));
    }

    /// <summary>Issues for rules no sheet used.</summary>
    public static void ReportUnused(IEnumerable<MappingRule> rules, IssueSink sink)
    {
        foreach (var r in rules.Where(r => !r.Used))
        {
            sink.Warning(r.Origin, null, r.Line, r.Header, r.Header, IssueCodes.MappedHeaderNotFound, IntakeMessages.MappedHeaderNotFound(r.FieldName));
        }
    }

    /// <summary>A bad value of a critical field leaves its row out (error); of another field, only the value (warning).</summary>
    internal static IssueSeverity SeverityOf(FieldDef f) => f.Critical ? IssueSeverity.Error : IssueSeverity.Warning;
}
