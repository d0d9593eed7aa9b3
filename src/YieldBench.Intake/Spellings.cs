using YieldBench.Core.Lots;

namespace YieldBench.Intake;

/// <summary>
/// How strain codes, vessel types, varieties and blocks are spelt in every output: settled once, here. Spellings that differ only in
/// case, spaces or punctuation ("RC-11", "rc-11", "RC 11") are one; each group takes its most used spelling (the first
/// read on a tie), so a typing habit never splits one strain into several and every file names it the same way.
/// </summary>
public static class Spellings
{
    /// <summary>The text spellings are compared by: its letters and digits, upper case ("rc 11" → "RC11").</summary>
    public static string Key(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        return string.Create(text.Count(char.IsLetterOrDigit), text, static (span, t) =>
        {
            int i = 0;
            foreach (char c in t)
            {
                if (char.IsLetterOrDigit(c))
                {
                    span[i++] = char.ToUpperInvariant(c);
                }
            }
        });
    }

    /// <summary>
    /// The spelling among <paramref name="known"/> that <paramref name="text"/> is (same <see cref="Key"/>), or null
    /// when none is; for matching what a user types ("yb-r12") against the strains a review read ("YB-R12").
    /// </summary>
    public static string? Settle(string text, IEnumerable<string> known)
    {
        ArgumentNullException.ThrowIfNull(known);
        string key = Key(text);
        if (key.Length == 0)
        {
            return null;
        }

        string? match = null;
        foreach (var k in known)
        {
            if (string.Equals(k, text, StringComparison.Ordinal))
            {
                return k;
            }

            match ??= Key(k) == key ? k : null;
        }

        return match;
    }

    /// <summary>
    /// Gives every lot's strain, vessel, variety and block the most used spelling of its group, with one <c>spelling-unified</c>
    /// warning per group that had more than one spelling.
    /// </summary>
    internal static void Unify(List<Lot> lots, IssueSink sink)
    {
        var fields = new (string, Func<Lot, string?>, Func<Lot, string, Lot>)[]
        {
            ("strain", l => l.Strain, (l, v) => l with { Strain = v }),
            ("vessel", l => l.Vessel, (l, v) => l with { Vessel = v }),
            ("variety", l => l.Variety, (l, v) => l with { Variety = v }),
            ("block", l => l.Block, (l, v) => l with { Block = v }),
        };
        foreach (var (field, get, set) in fields)
        {
            // Each distinct spelling once, in order of first use, with its count and the first lot that uses it.
            var spellings = new Dictionary<string, (int Count, int First)>(StringComparer.Ordinal);
            for (int i = 0; i < lots.Count; i++)
            {
                if (get(lots[i]) is { } v)
                {
                    spellings[v] = spellings.TryGetValue(v, out var seen) ? (seen.Count + 1, seen.First) : (1, i);
                }
            }

            // Groups of spellings by key, in order of the group's first use; spellings in order of first use.
            var groups = new Dictionary<string, List<(string Text, int Count, int First)>>(StringComparer.Ordinal);
            var order = new List<string>();
            foreach (var (text, (count, first)) in spellings.OrderBy(x => x.Value.First))
            {
                string key = Key(text);
                if (!groups.TryGetValue(key, out var list))
                {
                    groups[key] = list = [];
                    order.Add(key);
                }

                list.Add((text, count, first));
            }

            var replace = new Dictionary<string, string>(StringComparer.Ordinal);
            var warnings = new List<(int FirstLot, string Kept, int Count, List<(string, int)> Others)>();
            foreach (var key in order)
            {
                var group = groups[key];
                if (group.Count < 2)
                {
                    continue;
                }

                // The most used spelling; on a tie the first read.
                var kept = group[0];
                foreach (var g in group)
                {
                    kept = g.Count > kept.Count ? g : kept;
                }

                foreach (var g in group)
                {
                    if (g.Text != kept.Text)
                    {
                        replace[g.Text] = kept.Text;
                    }
                }

                warnings.Add((group[0].First, kept.Text, kept.Count, group.Where(g => g.Text != kept.Text).Select(g => (g.Text, g.Count)).ToList()));
            }

            for (int i = 0; replace.Count > 0 && i < lots.Count; i++)
            {
                var lot = lots[i];
                if (get(lot) is { } v && replace.TryGetValue(v, out var kept))
                {
                    lots[i] = set(lot, kept);
                }
            }

            foreach (var (firstLot, kept, count, others) in warnings)
            {
                // The group's first lot: after unifying, the first that bears the kept spelling.
                var first = lots[firstLot].Source;
                sink.Warning(first?.File ?? "", first?.Sheet, null, field, kept, IssueCodes.SpellingUnified, IntakeMessages.SpellingUnified(field, kept, count, others));
            }
        }
    }
}
