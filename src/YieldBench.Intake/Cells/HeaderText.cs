using System.Text;
using System.Text.RegularExpressions;

namespace YieldBench.Intake;

/// <summary>Header normalisation and unit detection from header text.</summary>
internal static partial class HeaderText
{
    // Words that only carry a unit; they are dropped before a header is matched against field synonyms.
    private static readonly HashSet<string> UnitWords =
    [
        "pct", "percent", "v", "vol", "l", "hl", "kl", "kilolitre", "kilolitres", "kiloliter", "kiloliters", "gal", "gals", "gallon", "gallons", "kg", "kgs", "lb", "lbs", "g", "mg",
        "n", "gl", "mgl", "c", "f", "deg", "degc", "degf", "celsius", "fahrenheit", "in", "litre", "litres", "liter",
        "liters", "lt", "ltr", "hectolitre", "hectolitres", "hectoliter", "hectoliters", "kilogram", "kilograms", "grams",
        "pounds", "w", "ml", "per", "units", "unit", "u s", "us",
    ];

    /// <summary>Lower case, accents folded, '%' kept as the word "pct", everything else not a letter or digit a space.</summary>
    public static string Normalise(string text)
    {
        var sb = new StringBuilder(text.Length + 8);
        foreach (char raw in text.Trim())
        {
            char c = char.ToLowerInvariant(raw);
            string? folded = c switch
            {
                'é' or 'è' or 'ê' or 'ë' => "e",
                'á' or 'à' or 'â' or 'ä' or 'å' or 'ã' => "a",
                'ó' or 'ò' or 'ô' or 'ö' or 'õ' or 'ø' => "o",
                'ú' or 'ù' or 'û' or 'ü' => "u",
                'í' or 'ì' or 'î' or 'ï' => "i",
                'ñ' => "n",
                'ç' => "c",
                'ß' => "ss",
                '%' => " pct ",
                '₂' => "2",
                _ => null,
            };
            if (folded is not null)
            {
                sb.Append(folded);
            }
            else if (c is (>= 'a' and <= 'z') or (>= '0' and <= '9'))
            {
                sb.Append(c);
            }
            else
            {
                sb.Append(' ');
            }
        }

        return CollapseSpaces(sb.ToString());
    }

    /// <summary>
    /// The header reduced to the words that name the field: bracketed text and unit words removed. When nothing is
    /// left, the header without its brackets ("Vol (gal)" → "vol", a word that is also a unit), or failing that the full
    /// normalised text (a header that is only a unit, such as "(°Bx)").
    /// </summary>
    public static string FieldKey(string header)
    {
        string withoutBrackets = Brackets().Replace(header, " ");
        string norm = Normalise(withoutBrackets);
        var words = norm.Split(' ', StringSplitOptions.RemoveEmptyEntries).Where(w => !UnitWords.Contains(w)).ToArray();
        string key = string.Join(' ', words);
        return key.Length > 0 ? key : norm.Length > 0 ? norm : Normalise(header);
    }

    // Scale and unit words a units row under the header may hold besides the unit words above.
    private static readonly HashSet<string> UnitRowWords =
    [
        "bx", "brix", "sg", "oe", "oechsle", "kmw", "babo", "be", "baume", "bau", "ppm", "abv", "gpl", "hl", "degrees", "s", "ntu",
    ];

    /// <summary>True when the header has a % sign or the word percent (e.g. "RS %", "Residual sugar (%)").</summary>
    public static bool IsPercentHeader(string header) =>
        (" " + Normalise(header) + " ").Contains(" pct ", StringComparison.Ordinal) || Normalise(header).Split(' ').Contains("percent");

    /// <summary>True when the text names only units ("°Bx", "% v/v", "g/L", "(gal)"), no field words or numbers.</summary>
    public static bool IsUnitOnly(string text)
    {
        var words = Normalise(text).Split(' ', StringSplitOptions.RemoveEmptyEntries);
        return words.Length > 0 && words.All(w => UnitWords.Contains(w) || UnitRowWords.Contains(w));
    }

    /// <summary>The unit a header states for a field of the given kind, or <see cref="ColumnUnit.None"/>.</summary>
    public static ColumnUnit UnitFromHeader(string header, FieldKind kind)
    {
        string norm = " " + Normalise(header) + " ";
        bool Has(string w) => norm.Contains(" " + w + " ", StringComparison.Ordinal);
        bool degreeLetter(char letter) => DegreeLetter().Matches(header).Any(m => char.ToLowerInvariant(m.Groups[1].Value[0]) == letter);

        switch (kind)
        {
            case FieldKind.Sugar:
                if (Has("brix") || Has("bx"))
                {
                    return ColumnUnit.Brix;
                }

                if (Has("oechsle") || Has("oe"))
                {
                    return ColumnUnit.Oechsle;
                }

                if (Has("kmw") || Has("babo") || Has("klosterneuburger"))
                {
                    return ColumnUnit.Kmw;
                }

                if (Has("baume") || Has("be") || Has("bau"))
                {
                    return ColumnUnit.Baume;
                }

                if (Has("sg") || Has("specific gravity") || Has("gravity") || Has("density") || Has("fg"))
                {
                    return ColumnUnit.SpecificGravity;
                }

                if ((Has("potentiel") || Has("potential") || Has("probable") || Has("potencial") || Has("potenziale") || Has("tap") || Has("tavp"))
                    && !Has("sugar") && !Has("g l") && !Has("gl") && !Has("gpl"))
                {
                    // "Degré potentiel", "Potential alcohol": must sugar as the alcohol it could give (% vol).
                    return ColumnUnit.PotentialAlcohol;
                }

                return Has("g l") || Has("gl") || Has("gpl") ? ColumnUnit.SugarGramsPerLitre : ColumnUnit.None;
            case FieldKind.Alcohol:
                if (Has("g l") || Has("gl"))
                {
                    return ColumnUnit.AlcoholGramsPerLitre;
                }

                return Has("pct") || Has("abv") || Has("v v") || Has("vol") ? ColumnUnit.PercentVolume : ColumnUnit.None;
            case FieldKind.Temperature:
                if (Has("f") || Has("degf") || Has("fahrenheit") || degreeLetter('f'))
                {
                    return ColumnUnit.Fahrenheit;
                }

                return Has("c") || Has("degc") || Has("celsius") || degreeLetter('c') ? ColumnUnit.Celsius : ColumnUnit.None;
            case FieldKind.Volume:
                if (Has("kl") || Has("kilolitre") || Has("kilolitres") || Has("kiloliter") || Has("kiloliters"))
                {
                    return ColumnUnit.Kilolitre;
                }

                if (Has("hl") || Has("hectolitre") || Has("hectolitres") || Has("hectoliter") || Has("hectoliters"))
                {
                    return ColumnUnit.Hectolitre;
                }

                if (Has("gal") || Has("gals") || Has("gallon") || Has("gallons"))
                {
                    return ColumnUnit.UsGallon;
                }

                return Has("l") || Has("litre") || Has("litres") || Has("liter") || Has("liters") || Has("lt") || Has("ltr")
                    ? ColumnUnit.Litre
                    : ColumnUnit.None;
            case FieldKind.Mass:
                if (Has("kg") || Has("kgs") || Has("kilogram") || Has("kilograms"))
                {
                    return ColumnUnit.Kilogram;
                }

                if (Has("lb") || Has("lbs") || Has("pound") || Has("pounds"))
                {
                    return ColumnUnit.Pound;
                }

                return Has("g") || Has("grams") ? ColumnUnit.Gram : ColumnUnit.None;
            default:
                return ColumnUnit.None;
        }
    }

    /// <summary>The text with bracketed parts ("(SG)", "[°C]") replaced by spaces.</summary>
    public static string WithoutBrackets(string text) => Brackets().Replace(text, " ");

    private static string CollapseSpaces(string s)
    {
        var sb = new StringBuilder(s.Length);
        bool space = false;
        foreach (char c in s)
        {
            if (c == ' ')
            {
                space = sb.Length > 0;
                continue;
            }

            if (space)
            {
                sb.Append(' ');
                space = false;
            }

            sb.Append(c);
        }

        return sb.ToString();
    }

    [GeneratedRegex(@"\([^)]*\)|\[[^\]]*\]|\{[^}]*\}")]
    private static partial Regex Brackets();

    [GeneratedRegex(@"°\s*([A-Za-z])")]
    private static partial Regex DegreeLetter();
}
