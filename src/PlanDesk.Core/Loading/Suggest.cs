namespace PlanDesk.Core.Loading;

/// <summary>"Did you mean" for ids, field names and time zones.</summary>
internal static class Suggest
{
    /// <summary>The candidate closest to <paramref name="given"/> by edit distance (case ignored), when it is close enough
    /// to be a plausible typo: at most a third of the length apart, and never more than 3 edits.</summary>
    public static string? Closest(string given, IEnumerable<string> candidates)
    {
        var allowed = Math.Min(3, Math.Max(1, given.Length / 3));
        string? best = null;
        var bestDistance = int.MaxValue;
        foreach (var candidate in candidates)
        {
            var distance = Distance(given.ToLowerInvariant(), candidate.ToLowerInvariant());
            if (distance < bestDistance)
            {
                best = candidate;
                bestDistance = distance;
            }
        }
        return bestDistance <= allowed ? best : null;
    }

    /// <summary>"did you mean 'x'? " or "" — to put in front of a list of valid values.</summary>
    public static string DidYouMean(string given, IEnumerable<string> candidates) =>
        Closest(given, candidates) is { } near ? $"did you mean '{near}'? " : "";

    /// <summary>A list for a message: quoted and comma-separated, shortened after <paramref name="max"/> entries.</summary>
    public static string List(IEnumerable<string> values, int max = 10)
    {
        var all = values.ToList();
        if (all.Count == 0)
        {
            return "(none)";
        }
        var shown = string.Join(", ", all.Take(max));
        return all.Count > max ? $"{shown} and {all.Count - max} more" : shown;
    }

    // Levenshtein distance with two rows.
    private static int Distance(string a, string b)
    {
        var previous = new int[b.Length + 1];
        var current = new int[b.Length + 1];
        for (var j = 0; j <= b.Length; j++)
        {
            previous[j] = j;
        }
        for (var i = 1; i <= a.Length; i++)
        {
            current[0] = i;
            for (var j = 1; j <= b.Length; j++)
            {
                var substitution = previous[j - 1] + (a[i - 1] == b[j - 1] ? 0 : 1);
                current[j] = Math.Min(substitution, Math.Min(previous[j] + 1, current[j - 1] + 1));
            }
            (previous, current) = (current, previous);
        }
        return previous[b.Length];
    }
}
