using PlanDesk.Core.Model;

namespace PlanDesk.Core.Loading;

/// <summary>
/// One thing wrong with a network file, located precisely enough for a person to fix it.
/// </summary>
/// <param name="File">The file as the user named it (the network file or one of its CSV files).</param>
/// <param name="Location">A JSON path such as <c>$.plants[1].stages[0].recoveryFraction</c>, a CSV place such as
/// <c>line 14, column 'larkmoor'</c>, or <c>line 3, column 17</c> for JSON syntax; empty for the whole file.</param>
/// <param name="What">What is wrong, with the value found.</param>
/// <param name="Fix">What would be valid.</param>
public sealed record LoadProblem(string File, string Location, string What, string Fix)
{
    /// <summary>One line: <c>file: location: what is wrong; what would be valid</c>.</summary>
    public override string ToString()
    {
        var place = Location.Length == 0 ? File : $"{File}: {Location}";
        return Fix.Length == 0 ? $"{place}: {What}" : $"{place}: {What}; {Fix}";
    }
}

/// <summary>The network read from a file, or every problem found in it (never both).</summary>
public sealed record NetworkLoadResult(Network? Network, IReadOnlyList<LoadProblem> Problems)
{
    public bool Succeeded => Network is not null;
}
