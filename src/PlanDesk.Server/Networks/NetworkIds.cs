using System.Text.RegularExpressions;

namespace PlanDesk.Server.Networks;

/// <summary>The shape of a network id in the service: 1 to 64 lower-case letters, digits and hyphens.</summary>
public static partial class NetworkIds
{
    public static bool IsValid(string networkId) => Shape().IsMatch(networkId);

    [GeneratedRegex("^[a-z0-9][a-z0-9-]{0,63}$")]
    private static partial Regex Shape();
}
