using System.Net;
using System.Net.Http.Json;
using System.Text;
using System.Text.Json;
using NodaTime;
using PlanDesk.Server.Hosting;
using PlanDesk.Server.Plans;
using PlanDesk.Server.Reports;
using PlanDesk.Server.Targets;

namespace PlanDesk.Server.Tests.Infrastructure;

/// <summary>The calls tests make again and again, each failing with the server's answer when it is not the expected one.</summary>
public static class TestApi
{
    public const string NetworkId = "vale";
    public static readonly LocalDate Day = new(2027, 3, 26);

    public static string TwoPlantNetworkJson { get; } = File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "TestData", "two-plants.json"));

    public static StringContent JsonBody(string json) => new(json, Encoding.UTF8, "application/json");

    public static StringContent JsonBody<T>(T value) => JsonBody(JsonSerializer.Serialize(value, ServerJson.Options));

    public static async Task<T> ReadAsync<T>(HttpResponseMessage response, HttpStatusCode expected)
    {
        var body = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == expected, $"expected {(int)expected}, got {(int)response.StatusCode}: {body}");
        return JsonSerializer.Deserialize<T>(body, ServerJson.Options)!;
    }

    public static async Task UploadNetworkAsync(HttpClient scheduler, string networkId = NetworkId)
    {
        var response = await scheduler.PostAsync($"/api/networks/{networkId}/versions", JsonBody(TwoPlantNetworkJson));
        var body = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, $"upload failed ({(int)response.StatusCode}): {body}");
    }

    public static async Task<JobResponse> SubmitAsync(HttpClient scheduler, LocalDate startDate, int days = 1, string networkId = NetworkId)
    {
        var response = await scheduler.PostAsync("/api/plans", JsonBody(new SolveRequest { NetworkId = networkId, StartDate = startDate, Days = days }));
        return await ReadAsync<JobResponse>(response, HttpStatusCode.Accepted);
    }

    /// <summary>Polls the job until it reaches <paramref name="state"/> (or any finished state when null); fails after 30 s.</summary>
    public static async Task<JobResponse> WaitForJobAsync(HttpClient client, long jobId, string? state = null)
    {
        var deadline = DateTime.UtcNow.AddSeconds(30);
        while (true)
        {
            var job = await ReadAsync<JobResponse>(await client.GetAsync($"/api/jobs/{jobId}"), HttpStatusCode.OK);
            if (state is null ? Store.JobState.IsFinished(job.State) : job.State == state)
            {
                return job;
            }
            Assert.True(DateTime.UtcNow < deadline, $"job {jobId} did not reach {state ?? "a finished state"} in 30 s; it is {job.State}: {job.Message}");
            await Task.Delay(25);
        }
    }

    public static async Task<long> SolveAsync(HttpClient scheduler, LocalDate startDate, int days = 1)
    {
        var job = await SubmitAsync(scheduler, startDate, days);
        var finished = await WaitForJobAsync(scheduler, job.JobId);
        Assert.True(finished.State == Store.JobState.Succeeded, $"job {job.JobId} {finished.State}: {finished.Message}");
        return job.JobId;
    }

    public static async Task<PublicationResponse> PublishAsync(HttpClient scheduler, long planId) =>
        await ReadAsync<PublicationResponse>(await scheduler.PostAsync($"/api/plans/{planId}/publish", JsonBody("{}")), HttpStatusCode.Created);

    public static HttpRequestMessage Acknowledgement(string plantId, LocalDate date, int version, string idempotencyKey, string? by = "night shift") =>
        new(HttpMethod.Post, $"/api/plants/{plantId}/targets/{date:uuuu-MM-dd}/acknowledgements")
        {
            Content = JsonBody(new AcknowledgementRequest { Version = version, AcknowledgedBy = by }),
            Headers = { { "Idempotency-Key", idempotencyKey } },
        };

    public static HttpRequestMessage Actuals(string plantId, ActualsRequest report, string idempotencyKey) =>
        new(HttpMethod.Post, $"/api/plants/{plantId}/actuals") { Content = JsonBody(report), Headers = { { "Idempotency-Key", idempotencyKey } } };

    /// <summary>Hours of plausible actuals starting at <paramref name="firstHour"/>.</summary>
    public static ActualsRequest SomeActuals(Instant firstHour, int hours, double influentM3 = 480) => new()
    {
        Hours = Enumerable.Range(0, hours).Select(h => new ActualsHour
        {
            HourStart = firstHour + Duration.FromHours(h),
            InfluentM3 = influentM3,
            EnergyImportedKWh = 150,
            OutfallM3 = 300,
            OutfallTotalNitrogenKg = 3.5,
        }).ToList(),
    };
}
