using System.Net;
using Microsoft.Extensions.DependencyInjection;
using PlanDesk.Server.Store;
using PlanDesk.Server.Tests.Infrastructure;
using static PlanDesk.Server.Tests.Infrastructure.TestApi;

namespace PlanDesk.Server.Tests;

/// <summary>
/// Every endpoint called by every kind of caller. Plant-scoped endpoints are called on plant 'ashby': "Plant" is
/// ashby's key, "OtherPlant" brindle's. Expected codes per caller: None, Viewer, OtherPlant, Plant, Scheduler.
/// </summary>
public sealed class AccessMatrixTests(ServedNetwork served) : IClassFixture<ServedNetwork>
{
    private const string Targets = "/api/plants/ashby/targets/2027-03-26";

    private static readonly int[] Read = [401, 200, 403, 403, 200];
    private static readonly int[] SchedulerOnly = [401, 403, 403, 403, 200];
    private static readonly int[] PlantRead = [401, 200, 403, 200, 200];
    private static readonly int[] PlantWrite = [401, 403, 403, 201, 201];

    // endpoint name → (expected per caller, request builder)
    private static readonly Dictionary<string, (int[] Expected, Func<ServedNetwork, Caller, Task<HttpRequestMessage>> Request)> Endpoints = new()
    {
        ["GET /health"] = ([200, 200, 200, 200, 200], Get("/health")),
        ["GET /openapi/{documentName}.json"] = ([200, 200, 200, 200, 200], Get("/openapi/v1.json")),
        ["GET /api/networks"] = (Read, Get("/api/networks")),
        ["GET /api/networks/{id}"] = (Read, Get($"/api/networks/{NetworkId}")),
        ["GET /api/networks/{id}/versions/{v}"] = (Read, Get($"/api/networks/{NetworkId}/versions/1")),
        ["POST /api/networks/{id}/versions"] = ([401, 403, 403, 403, 201], Post($"/api/networks/{NetworkId}/versions", () => TwoPlantNetworkJson)),
        ["POST /api/plans"] = ([401, 403, 403, 403, 202],
            Post("/api/plans", () => $$"""{ "networkId": "{{NetworkId}}", "startDate": "2027-03-26", "days": 1 }""")),
        ["GET /api/plans"] = (Read, Get("/api/plans")),
        ["GET /api/plans/{id}"] = (Read, (s, _) => Request(HttpMethod.Get, $"/api/plans/{s.PlanId}")),
        ["GET /api/plans/{id}/summary"] = (Read, (s, _) => Request(HttpMethod.Get, $"/api/plans/{s.PlanId}/summary")),
        ["GET /api/plans/{id}/problems"] = (Read, (s, _) => Request(HttpMethod.Get, $"/api/plans/{s.PlanId}/problems")),
        ["GET /api/plans/{id}/marginal-water-costs"] = (Read, (s, _) => Request(HttpMethod.Get, $"/api/plans/{s.PlanId}/marginal-water-costs")),
        ["GET /api/plans/{id}/check"] = (Read, (s, _) => Request(HttpMethod.Get, $"/api/plans/{s.PlanId}/check")),
        ["GET /api/plans/{id}/schematic"] = (Read, (s, _) => Request(HttpMethod.Get, $"/api/plans/{s.PlanId}/schematic")),
        ["GET /api/plans/{id}/series"] = (Read, (s, _) => Request(HttpMethod.Get, $"/api/plans/{s.PlanId}/series")),
        ["GET /api/plans/{id}/publication-preview"] = (Read, (s, _) => Request(HttpMethod.Get, $"/api/plans/{s.PlanId}/publication-preview")),
        ["GET /api/me"] = ([401, 200, 200, 200, 200], Get("/api/me")),
        ["GET /api/jobs/{id}"] = (Read, (s, _) => Request(HttpMethod.Get, $"/api/jobs/{s.PlanId}")),
        ["POST /api/jobs/{id}/cancel"] = ([401, 403, 403, 403, 202], CancelRunningJob),
        ["POST /api/plans/{id}/publish"] = ([401, 403, 403, 403, 201], (s, _) => Request(HttpMethod.Post, $"/api/plans/{s.PlanId}/publish", "{}")),
        ["GET /api/publications"] = (Read, Get("/api/publications")),
        ["GET /api/publications/{id}"] = (Read, (s, _) => Request(HttpMethod.Get, $"/api/publications/{s.PublicationId}")),
        ["GET /api/plants/{plant}/targets/{date}"] = (PlantRead, Get(Targets)),
        ["GET /api/plants/{plant}/targets/{date}/versions"] = (PlantRead, Get($"{Targets}/versions")),
        ["GET /api/plants/{plant}/targets/{date}/versions/{v}"] = (PlantRead, Get($"{Targets}/versions/1")),
        ["POST /api/plants/{plant}/targets/{date}/acknowledgements"] = (PlantWrite,
            (_, _) => Task.FromResult(Acknowledgement("ashby", Day, 1, Guid.NewGuid().ToString()))),
        ["GET /api/plants/{plant}/targets/{date}/acknowledgements"] = (PlantRead, Get($"{Targets}/acknowledgements")),
        ["POST /api/plants/{plant}/actuals"] = (PlantWrite,
            (_, _) => Task.FromResult(Actuals("ashby", SomeActuals(PlanDeskFactory.Now - NodaTime.Duration.FromHours(30), 2), Guid.NewGuid().ToString()))),
        ["GET /api/plants/{plant}/actuals"] = (PlantRead, Get("/api/plants/ashby/actuals?from=2027-03-25&to=2027-03-26")),
        ["GET /api/keys"] = (SchedulerOnly, Get("/api/keys")),
        ["POST /api/keys"] = ([401, 403, 403, 403, 201], Post("/api/keys", () => """{ "role": "viewer", "label": "matrix" }""")),
        ["DELETE /api/keys/{id}"] = (SchedulerOnly, RevokeThrowawayKey),
    };

    public static TheoryData<string, Caller> Cases()
    {
        var data = new TheoryData<string, Caller>();
        foreach (var endpoint in Endpoints.Keys)
        {
            foreach (var caller in Enum.GetValues<Caller>())
            {
                data.Add(endpoint, caller);
            }
        }
        return data;
    }

    [Theory]
    [MemberData(nameof(Cases))]
    public async Task EachEndpointAnswersEachKindOfCallerAsDesigned(string endpoint, Caller caller)
    {
        var (expected, build) = Endpoints[endpoint];
        using var request = await build(served, caller);

        var response = await served.Client(caller).SendAsync(request);

        var body = await response.Content.ReadAsStringAsync();
        Assert.True((int)response.StatusCode == expected[(int)caller], $"{endpoint} by {caller}: expected {expected[(int)caller]}, got {(int)response.StatusCode}: {body}");
        if ((int)response.StatusCode is 401 or 403)
        {
            Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
            Assert.Contains("\"detail\"", body);
        }
    }

    [Fact]
    public async Task TheKeyMayAlsoComeInTheXApiKeyHeader()
    {
        var client = served.Client(Caller.None);
        var request = new HttpRequestMessage(HttpMethod.Get, Targets) { Headers = { { "X-Api-Key", served.Keys[Caller.Plant] } } };
        var refused = new HttpRequestMessage(HttpMethod.Get, Targets) { Headers = { { "X-Api-Key", served.Keys[Caller.OtherPlant] } } };

        Assert.Equal(HttpStatusCode.OK, (await client.SendAsync(request)).StatusCode);
        Assert.Equal(HttpStatusCode.Forbidden, (await client.SendAsync(refused)).StatusCode);
    }

    [Fact]
    public void TheMatrixCoversEveryMappedEndpoint()
    {
        var mapped = served.Factory.Services.GetRequiredService<Microsoft.AspNetCore.Routing.EndpointDataSource>().Endpoints
            .OfType<Microsoft.AspNetCore.Routing.RouteEndpoint>()
            .SelectMany(e => (e.Metadata.GetMetadata<Microsoft.AspNetCore.Routing.IHttpMethodMetadata>()?.HttpMethods ?? []).Select(m => $"{m} {e.RoutePattern.RawText}"))
            .Select(Normalise)
            .ToHashSet();
        var covered = Endpoints.Keys.Select(Normalise).ToHashSet();

        Assert.Empty(mapped.Except(covered));
    }

    // "/api/plans/{planId:long}" and "/api/plans/{id}" both become "/api/plans/{}".
    private static string Normalise(string route) =>
        System.Text.RegularExpressions.Regex.Replace(route.TrimEnd('/'), @"\{[^}]*\}", "{}").Replace("/ ", " ");

    private static Func<ServedNetwork, Caller, Task<HttpRequestMessage>> Get(string path) => (_, _) => Request(HttpMethod.Get, path);

    private static Func<ServedNetwork, Caller, Task<HttpRequestMessage>> Post(string path, Func<string> body) =>
        (_, _) => Request(HttpMethod.Post, path, body());

    private static Task<HttpRequestMessage> Request(HttpMethod method, string path, string? body = null) =>
        Task.FromResult(new HttpRequestMessage(method, path) { Content = body is null ? null : JsonBody(body) });

    // Only a scheduler's call needs a job that is really running; the others are refused before the job is looked at.
    private static async Task<HttpRequestMessage> CancelRunningJob(ServedNetwork served, Caller caller)
    {
        if (caller != Caller.Scheduler)
        {
            return await Request(HttpMethod.Post, $"/api/jobs/{served.PlanId}/cancel");
        }
        var scheduler = served.Client(Caller.Scheduler);
        var job = await SubmitAsync(scheduler, FakeSolver.BlockingDate);
        await WaitForJobAsync(scheduler, job.JobId, JobState.Running);
        return await Request(HttpMethod.Post, $"/api/jobs/{job.JobId}/cancel");
    }

    private static async Task<HttpRequestMessage> RevokeThrowawayKey(ServedNetwork served, Caller caller)
    {
        var throwaway = await served.Factory.AddKeyAsync(Role.Viewer);
        return await Request(HttpMethod.Delete, $"/api/keys/{Auth.ApiKeys.KeyIdOf(throwaway)}");
    }
}
