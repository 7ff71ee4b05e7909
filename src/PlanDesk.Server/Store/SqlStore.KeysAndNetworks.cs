using Dapper;
using NodaTime;

namespace PlanDesk.Server.Store;

internal abstract partial class SqlStore
{
    private sealed class KeyRow
    {
        public string KeyId { get; set; } = "";
        public string KeyHash { get; set; } = "";
        public string Role { get; set; } = "";
        public string? PlantId { get; set; }
        public string Label { get; set; } = "";
        public long CreatedAt { get; set; }
        public long? RevokedAt { get; set; }

        public ApiKeyRecord ToRecord() =>
            new(KeyId, KeyHash, Enum.Parse<Role>(Role, ignoreCase: true), PlantId, Label, At(CreatedAt), At(RevokedAt));
    }

    private const string KeyColumns = "key_id, key_hash, role, plant_id, label, created_at, revoked_at";

    public async Task AddKeyAsync(ApiKeyRecord key)
    {
        await using var connection = await OpenAsync();
        await connection.ExecuteAsync(
            $"INSERT INTO api_keys ({KeyColumns}) VALUES (@KeyId, @KeyHash, @Role, @PlantId, @Label, @CreatedAt, NULL)",
            new { key.KeyId, key.KeyHash, Role = key.Role.ToString().ToLowerInvariant(), key.PlantId, key.Label, CreatedAt = Ms(key.CreatedAt) });
    }

    public async Task<ApiKeyRecord?> FindKeyAsync(string keyId)
    {
        await using var connection = await OpenAsync();
        var row = await connection.QuerySingleOrDefaultAsync<KeyRow>($"SELECT {KeyColumns} FROM api_keys WHERE key_id = @keyId", new { keyId });
        return row?.ToRecord();
    }

    public async Task<IReadOnlyList<ApiKeyRecord>> ListKeysAsync()
    {
        await using var connection = await OpenAsync();
        var rows = await connection.QueryAsync<KeyRow>($"SELECT {KeyColumns} FROM api_keys ORDER BY created_at, key_id");
        return rows.Select(r => r.ToRecord()).ToList();
    }

    public async Task<bool> RevokeKeyAsync(string keyId, Instant at)
    {
        await using var connection = await OpenAsync();
        await connection.ExecuteAsync(
            "UPDATE api_keys SET revoked_at = @at WHERE key_id = @keyId AND revoked_at IS NULL", new { keyId, at = Ms(at) });
        return await connection.ExecuteScalarAsync<long>("SELECT COUNT(*) FROM api_keys WHERE key_id = @keyId", new { keyId }) > 0;
    }

    private sealed class NetworkRow
    {
        public string NetworkId { get; set; } = "";
        public long Version { get; set; }
        public string Name { get; set; } = "";
        public long UploadedAt { get; set; }
        public string UploadedBy { get; set; } = "";
        public string? Document { get; set; }
    }

    private sealed class NetworkPlantRow
    {
        public string NetworkId { get; set; } = "";
        public long Version { get; set; }
        public string PlantId { get; set; } = "";
        public string PlantName { get; set; } = "";
    }

    public async Task<NetworkVersionRecord> AddNetworkVersionAsync(
        string networkId, string name, string document, IReadOnlyList<NetworkPlantRecord> plants, Instant at, string keyId)
    {
        at = Stored(at);
        await using var connection = await OpenAsync();
        await using var transaction = await BeginWriteAsync(connection, "network_versions");
        var version = await connection.ExecuteScalarAsync<long>(
            "SELECT COALESCE(MAX(version), 0) + 1 FROM network_versions WHERE network_id = @networkId", new { networkId }, transaction);
        await connection.ExecuteAsync(
            "INSERT INTO network_versions (network_id, version, name, document, uploaded_at, uploaded_by) " +
            "VALUES (@networkId, @version, @name, @document, @at, @keyId)",
            new { networkId, version, name, document, at = Ms(at), keyId }, transaction);
        foreach (var plant in plants)
        {
            await connection.ExecuteAsync(
                "INSERT INTO network_plants (network_id, version, plant_id, plant_name) VALUES (@networkId, @version, @PlantId, @PlantName)",
                new { networkId, version, plant.PlantId, plant.PlantName }, transaction);
        }
        await transaction.CommitAsync();
        return new NetworkVersionRecord(networkId, (int)version, name, plants, at, keyId, document);
    }

    public async Task<IReadOnlyList<NetworkVersionRecord>> ListNetworkVersionsAsync(string? networkId = null)
    {
        await using var connection = await OpenAsync();
        var filter = networkId is null ? "" : " WHERE network_id = @networkId";
        var rows = await connection.QueryAsync<NetworkRow>(
            $"SELECT network_id, version, name, uploaded_at, uploaded_by FROM network_versions{filter} ORDER BY network_id, version",
            new { networkId });
        var plants = await connection.QueryAsync<NetworkPlantRow>(
            $"SELECT network_id, version, plant_id, plant_name FROM network_plants{filter} ORDER BY plant_id", new { networkId });
        var byVersion = plants.ToLookup(p => (p.NetworkId, p.Version));
        return rows.Select(r => ToRecord(r, byVersion[(r.NetworkId, r.Version)])).ToList();
    }

    public async Task<NetworkVersionRecord?> GetNetworkVersionAsync(string networkId, int? version)
    {
        await using var connection = await OpenAsync();
        var row = await connection.QuerySingleOrDefaultAsync<NetworkRow>(
            "SELECT network_id, version, name, uploaded_at, uploaded_by, document FROM network_versions " +
            "WHERE network_id = @networkId AND version = COALESCE(@version, " +
            "(SELECT MAX(version) FROM network_versions WHERE network_id = @networkId))",
            new { networkId, version = (long?)version });
        if (row is null)
        {
            return null;
        }
        var plants = await connection.QueryAsync<NetworkPlantRow>(
            "SELECT network_id, version, plant_id, plant_name FROM network_plants WHERE network_id = @networkId AND version = @Version ORDER BY plant_id",
            new { networkId, row.Version });
        return ToRecord(row, plants);
    }

    public async Task<NetworkVersionRecord?> LatestNetworkWithPlantAsync(string plantId)
    {
        await using var connection = await OpenAsync();
        var latest = await connection.QueryFirstOrDefaultAsync<NetworkPlantRow>(
            "SELECT p.network_id, p.version, p.plant_id, p.plant_name FROM network_plants p " +
            "JOIN network_versions n ON n.network_id = p.network_id AND n.version = p.version " +
            "WHERE p.plant_id = @plantId ORDER BY n.uploaded_at DESC, p.version DESC",
            new { plantId });
        return latest is null ? null : await GetNetworkVersionAsync(latest.NetworkId, (int)latest.Version);
    }

    private static NetworkVersionRecord ToRecord(NetworkRow row, IEnumerable<NetworkPlantRow> plants) =>
        new(row.NetworkId, (int)row.Version, row.Name,
            plants.Select(p => new NetworkPlantRecord(p.PlantId, p.PlantName)).ToList(),
            At(row.UploadedAt), row.UploadedBy, row.Document);
}
