namespace PlanDesk.Server.Tests.Infrastructure;

/// <summary>The repository the tests run from, found by walking up to PlanDesk.sln.</summary>
internal static class Repository
{
    public static string Root { get; } = Find();

    private static string Find()
    {
        for (var folder = new DirectoryInfo(AppContext.BaseDirectory); folder is not null; folder = folder.Parent)
        {
            if (File.Exists(Path.Combine(folder.FullName, "PlanDesk.sln")))
            {
                return folder.FullName;
            }
        }
        throw new InvalidOperationException($"PlanDesk.sln not found above {AppContext.BaseDirectory}");
    }
}
