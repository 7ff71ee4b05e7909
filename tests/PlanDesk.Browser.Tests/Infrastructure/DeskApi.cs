using System.Net.Http.Headers;
using System.Net.Http.Json;
using System.Text.Json;
using System.Text.Json.Nodes;
using Microsoft.Extensions.DependencyInjection;
using PlanDesk.Server.Auth;
using PlanDesk.Server.Store;

namespace PlanDesk.Browser.Tests.Infrastructure;

/// <summary>Arranges what a browser test needs through the same REST API the desk uses: keys, networks, solves,
/// publications and actuals.</summary>
public sealed class DeskApi(DeskServer server)
{
    private static readonly TimeSpan SolveWait = TimeSpan.FromSeconds(90);

    public async Task<string> AddKeyAsync(Role role, string? plantId = null)
    {
        var (key, record) = ApiKeys.Create(role, plantId, $"browser test {role}", DeskServer.Now);
        await server.Services.GetRequiredService<IPlanDeskStore>().AddKeyAsync(record);
        return key;
    }

    public HttpClient Client(string key)
    {
        var client = new HttpClient { BaseAddress = server.BaseAddress };
        client.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", key);
        return client;
    }

    /// <summary>Uploads a network under a fresh id (so tests never share one) and returns that id.</summary>
    public async Task<string> UploadAsync(string schedulerKey, JsonNode network, string idPrefix)
    {
        var networkId = $"{idPrefix}-{Guid.NewGuid():N}"[..(idPrefix.Length + 9)];
        using var client = Client(schedulerKey);
        var response = await client.PostAsync($"/api/networks/{networkId}/versions",
            new StringContent(network.ToJsonString(), System.Text.Encoding.UTF8, "application/json"));
        await EnsureAsync(response, "upload the network");
        return networkId;
    }

    /// <summary>Submits a solve and waits until the job has ended; returns the plan id.</summary>
    public async Task<long> SolveAsync(string schedulerKey, string networkId, string startDate, int days, double timeLimitSeconds)
    {
        using var client = Client(schedulerKey);
        var response = await client.PostAsJsonAsync("/api/plans",
            new { networkId, startDate, days, options = new { timeLimitSeconds } });
        await EnsureAsync(response, "submit the solve");
        var jobId = (await response.Content.ReadFromJsonAsync<JsonObject>())!["jobId"]!.GetValue<long>();
        var deadline = DateTime.UtcNow + SolveWait;
        while (DateTime.UtcNow < deadline)
        {
            var job = (await client.GetFromJsonAsync<JsonObject>($"/api/jobs/{jobId}"))!;
            var state = job["state"]!.GetValue<string>();
            if (state == "succeeded")
            {
                return jobId;
            }
            Assert.True(state is "queued" or "running", $"solve {jobId} ended {state}: {job["message"]}");
            await Task.Delay(250);
        }
        throw new TimeoutException($"solve {jobId} did not finish within {SolveWait.TotalSeconds} s");
    }

    public async Task PublishAsync(string schedulerKey, long planId)
    {
        using var client = Client(schedulerKey);
        await EnsureAsync(await client.PostAsJsonAsync($"/api/plans/{planId}/publish", new { }), "publish");
    }

    public async Task<JsonObject> GetAsync(string key, string path)
    {
        using var client = Client(key);
        var response = await client.GetAsync(path);
        await EnsureAsync(response, $"GET {path}");
        return (await response.Content.ReadFromJsonAsync<JsonObject>())!;
    }

    public async Task<JsonArray> GetListAsync(string key, string path)
    {
        using var client = Client(key);
        return (await client.GetFromJsonAsync<JsonArray>(path))!;
    }

    public async Task ReportActualsAsync(string plantKey, string plantId, object hours)
    {
        using var client = Client(plantKey);
        using var request = new HttpRequestMessage(HttpMethod.Post, $"/api/plants/{plantId}/actuals") { Content = JsonContent.Create(new { hours }) };
        request.Headers.Add("Idempotency-Key", Guid.NewGuid().ToString());
        await EnsureAsync(await client.SendAsync(request), "report actuals");
    }

    private static async Task EnsureAsync(HttpResponseMessage response, string what)
    {
        if (!response.IsSuccessStatusCode)
        {
            var body = await response.Content.ReadAsStringAsync();
            Assert.Fail($"could not {what}: HTTP {(int)response.StatusCode} {body}");
        }
    }

    public static JsonNode ReadNetwork(string fileName) =>
        JsonNode.Parse(File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "TestData", fileName)))!;

    public static readonly JsonSerializerOptions Web = new(JsonSerializerDefaults.Web);
}
