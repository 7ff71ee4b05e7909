using System.Buffers.Text;
using System.Security.Cryptography;
using System.Text;
using NodaTime;
using PlanDesk.Server.Store;

namespace PlanDesk.Server.Auth;

/// <summary>
/// API keys look like <c>pdk_3f9c02ab71_&lt;43 characters&gt;</c>: a prefix, a key id used to find the stored
/// record, and 32 random bytes. Only the SHA-256 of the whole key is stored, so a key is shown once, at creation.
/// </summary>
public static class ApiKeys
{
    private const string Prefix = "pdk";

    /// <summary>A new key and the record to store for it.</summary>
    public static (string Key, ApiKeyRecord Record) Create(Role role, string? plantId, string label, Instant now)
    {
        var keyId = Convert.ToHexStringLower(RandomNumberGenerator.GetBytes(5));
        var secret = Base64Url.EncodeToString(RandomNumberGenerator.GetBytes(32));
        var key = $"{Prefix}_{keyId}_{secret}";
        // Whole milliseconds, as the store keeps instants.
        var created = Instant.FromUnixTimeMilliseconds(now.ToUnixTimeMilliseconds());
        return (key, new ApiKeyRecord(keyId, Hash(key), role, plantId, label, created, null));
    }

    public static string Hash(string key) => Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(key)));

    /// <summary>The key id part of a presented key, or null when it does not have the key shape.</summary>
    public static string? KeyIdOf(string presented)
    {
        var parts = presented.Split('_', 3);
        return parts.Length == 3 && parts[0] == Prefix && parts[1].Length == 10 && parts[2].Length > 0 ? parts[1] : null;
    }

    /// <summary>True when the presented key hashes to the stored hash; compared in constant time.</summary>
    public static bool Matches(ApiKeyRecord record, string presented) =>
        CryptographicOperations.FixedTimeEquals(Encoding.ASCII.GetBytes(Hash(presented)), Encoding.ASCII.GetBytes(record.KeyHash));

    /// <summary>Checks the role and plant of a key to be created; null when they fit together, else the fix.</summary>
    public static string? CheckRoleAndPlant(Role role, string? plantId) => (role, string.IsNullOrWhiteSpace(plantId)) switch
    {
        (Role.Plant, true) => "a plant key needs the plant it is for: give the plant id (--plant ID, or plantId in the request)",
        (not Role.Plant, false) => $"only plant keys are tied to a plant; leave out the plant for a {role.ToString().ToLowerInvariant()} key",
        _ => null,
    };
}
