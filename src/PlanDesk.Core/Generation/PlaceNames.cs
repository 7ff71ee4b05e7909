namespace PlanDesk.Core.Generation;

/// <summary>
/// Invented place names for a generated region, built from syllables, and ids made from them.
/// Every name handed out is new, so ids stay unique across the whole file.
/// </summary>
internal sealed class PlaceNames(SeededRandom random)
{
    private static readonly string[] Heads =
    [
        "Ash", "Brack", "Cald", "Dunn", "Elder", "Fen", "Gorse", "Hollin", "Ivel", "Kes", "Lark", "Mell", "Nether",
        "Oaken", "Pen", "Quarrel", "Rook", "Sel", "Thorn", "Umber", "Vell", "Wren", "Yarrow", "Alder", "Birch",
        "Colt", "Drey", "Esk", "Fallow", "Glen", "Hart", "Marl", "Orrin", "Ply", "Roan", "Sedge", "Tarn", "Wold",
    ];

    private static readonly string[] Tails =
    [
        "moor", "wick", "ford", "ley", "by", "stead", "brook", "holm", "thwaite", "combe", "ridge", "field",
        "mere", "dale", "haven", "cote", "hurst", "well",
    ];

    private readonly HashSet<string> used = new(StringComparer.Ordinal);

    /// <summary>A place name not handed out before in this region.</summary>
    public string Next()
    {
        for (var attempt = 0; attempt < 1000; attempt++)
        {
            var name = random.Pick(Heads) + random.Pick(Tails);
            if (used.Add(name))
            {
                return name;
            }
        }
        // More names asked for than syllables allow: number them rather than loop forever.
        var fallback = random.Pick(Heads) + random.Pick(Tails) + " " + (used.Count + 1);
        used.Add(fallback);
        return fallback;
    }

    /// <summary>Lower-case id from a name: letters and digits kept, runs of anything else become one hyphen.</summary>
    public static string Slug(string name)
    {
        var chars = new List<char>();
        foreach (var c in name.ToLowerInvariant())
        {
            if (char.IsAsciiLetterOrDigit(c))
            {
                chars.Add(c);
            }
            else if (chars.Count > 0 && chars[^1] != '-')
            {
                chars.Add('-');
            }
        }
        return new string(chars.ToArray()).Trim('-');
    }
}
