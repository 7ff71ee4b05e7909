namespace PlanDesk.Planning.Tests.Fixtures;

/// <summary>Files of the repository the tests run in.</summary>
internal static class Repository
{
    /// <summary>The folder holding PlanDesk.sln, found upwards from the test binaries.</summary>
    public static string Root { get; } = FindRoot();

    public static string Network(string fileName) => Path.Combine(Root, "networks", fileName);

    private static string FindRoot()
    {
        for (var folder = new DirectoryInfo(AppContext.BaseDirectory); folder is not null; folder = folder.Parent)
        {
            if (File.Exists(Path.Combine(folder.FullName, "PlanDesk.sln")))
            {
                return folder.FullName;
            }
        }
        throw new InvalidOperationException($"no PlanDesk.sln above {AppContext.BaseDirectory}");
    }
}
