using System.Net;
using System.Net.Http.Json;
using System.Text;
using System.Text.Json;
using NodaTime;
using PlanDesk.Core.Model;

namespace PlanDesk.Cli.LoadTest;

/// <summary>Prepares a server for the load test through its own API, as a scheduler would: uploads the network,
/// solves its default day, publishes the plan and creates one key per plant.</summary>
internal static class LoadTestSetup
{
    public const string NetworkId = "load-test";

    public sealed record Prepared(LocalDate Date, IReadOnlyList<(string PlantId, string Key)> PlantKeys);

    public static async Task<Prepared> PrepareAsync(HttpClient scheduler, Network network, string networkJson, TextWriter log, CancellationToken stop)
    {
        var date = network.DefaultStartDate ?? throw new LoadTestException(
            "the network file gives no horizon.startDate; add one so the load test knows which day to plan");
        await ExpectAsync(await scheduler.PostAsync($"/api/networks/{NetworkId}/versions", Json(networkJson), stop), HttpStatusCode.Created, "upload the network");
        var submitted = await ExpectAsync(
            await scheduler.PostAsync("/api/plans", Json($$"""{ "networkId": "{{NetworkId}}", "startDate": "{{date:uuuu-MM-dd}}", "days": 1 }"""), stop),
            HttpStatusCode.Accepted, "submit the solve");
        var jobId = submitted.GetProperty("jobId").GetInt64();
        await log.WriteLineAsync($"solving {network.Name} for {date:uuuu-MM-dd} (job {jobId}) ...");
        while (true)
        {
            var job = await ExpectAsync(await scheduler.GetAsync($"/api/jobs/{jobId}", stop), HttpStatusCode.OK, "read the job");
            var state = job.GetProperty("state").GetString();
            if (state == "succeeded")
            {
                break;
            }
            if (state is "failed" or "cancelled")
            {
                throw new LoadTestException($"the solve {state}: {job.GetProperty("message").GetString()}");
            }
            await Task.Delay(250, stop);
        }
        await ExpectAsync(await scheduler.PostAsync($"/api/plans/{jobId}/publish", Json("""{ "note": "load test" }"""), stop), HttpStatusCode.Created, "publish");
        var keys = new List<(string, string)>();
        foreach (var plant in network.Plants)
        {
            var created = await ExpectAsync(
                await scheduler.PostAsJsonAsync("/api/keys", new { role = "plant", plantId = plant.Id.Value, label = "load test" }, stop),
                HttpStatusCode.Created, $"create a key for plant {plant.Id}");
            keys.Add((plant.Id.Value, created.GetProperty("key").GetString()!));
        }
        return new Prepared(date, keys);
    }

    private static StringContent Json(string json) => new(json, Encoding.UTF8, "application/json");

    private static async Task<JsonElement> ExpectAsync(HttpResponseMessage response, HttpStatusCode expected, string what)
    {
        var body = await response.Content.ReadAsStringAsync();
        if (response.StatusCode != expected)
        {
            throw new LoadTestException($"could not {what}: the server answered {(int)response.StatusCode}: {body}");
        }
        return JsonDocument.Parse(body).RootElement.Clone();
    }
}

/// <summary>The load test cannot go on; the message says why.</summary>
internal sealed class LoadTestException(string message) : Exception(message);
