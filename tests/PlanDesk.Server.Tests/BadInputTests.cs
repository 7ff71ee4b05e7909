using System.Net;
using System.Text.Json;
using NodaTime;
using PlanDesk.Server.Store;
using PlanDesk.Server.Tests.Infrastructure;
using static PlanDesk.Server.Tests.Infrastructure.TestApi;

namespace PlanDesk.Server.Tests;

/// <summary>Mistakes a controller engineer can make get a problem-details answer that says what to fix; never a 500.</summary>
public sealed class BadInputTests(ServedNetwork served) : IClassFixture<ServedNetwork>
{
    private const string Hour = "2027-03-26T20:00:00Z";

    private HttpClient Plant => served.Client(Caller.Plant);
    private HttpClient Scheduler => served.Client(Caller.Scheduler);

    private static HttpRequestMessage PostActuals(string body, string plant = "ashby") =>
        new(HttpMethod.Post, $"/api/plants/{plant}/actuals") { Content = JsonBody(body), Headers = { { "Idempotency-Key", Guid.NewGuid().ToString() } } };

    /// <summary>Asserts a problem details answer with the status, and returns its detail.</summary>
    private static async Task<string> ProblemAsync(HttpResponseMessage response, HttpStatusCode status)
    {
        var body = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == status, $"expected {(int)status}, got {(int)response.StatusCode}: {body}");
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
        using var problem = JsonDocument.Parse(body);
        Assert.Equal((int)status, problem.RootElement.GetProperty("status").GetInt32());
        Assert.False(string.IsNullOrWhiteSpace(problem.RootElement.GetProperty("title").GetString()));
        return problem.RootElement.GetProperty("detail").GetString()!;
    }

    [Fact]
    public async Task MalformedJsonIsAnsweredWithItsPosition()
    {
        var detail = await ProblemAsync(await Plant.SendAsync(PostActuals("""{ "hours": [ { "hourStart": """)), HttpStatusCode.BadRequest);

        Assert.Contains("line 1", detail);
    }

    [Fact]
    public async Task AWrongTypeNamesTheFieldAndWhatWasExpected()
    {
        var detail = await ProblemAsync(await Plant.SendAsync(PostActuals($$"""{ "hours": [ { "hourStart": "{{Hour}}", "influentM3": "lots" } ] }""")), HttpStatusCode.BadRequest);

        Assert.StartsWith("$.hours[0].influentM3", detail);
        Assert.Contains("expected a number", detail);
    }

    [Fact]
    public async Task ATimeThatIsNotATimeNamesTheFieldAndTheFormat()
    {
        var detail = await ProblemAsync(await Plant.SendAsync(PostActuals("""{ "hours": [ { "hourStart": "26/03/2027 20:00" } ] }""")), HttpStatusCode.BadRequest);

        Assert.StartsWith("$.hours[0].hourStart", detail);
        Assert.Contains("2027-03-26T05:00:00Z", detail);
    }

    [Fact]
    public async Task AMissingRequiredFieldIsNamed()
    {
        var detail = await ProblemAsync(await Plant.SendAsync(PostActuals("""{ "hours": [ { "influentM3": 400 } ] }""")), HttpStatusCode.BadRequest);

        Assert.Contains("hourStart", detail);
    }

    [Fact]
    public async Task AnUnknownFieldIsRefusedRatherThanDropped()
    {
        var detail = await ProblemAsync(await Plant.SendAsync(PostActuals($$"""{ "hours": [ { "hourStart": "{{Hour}}", "influentM3PerHour": 400 } ] }""")), HttpStatusCode.BadRequest);

        Assert.Contains("influentM3PerHour", detail);
        Assert.Contains("not known", detail);
    }

    [Fact]
    public async Task ANegativeVolumeNamesTheFieldAndNothingIsStored()
    {
        var body = $$"""{ "hours": [ { "hourStart": "{{Hour}}", "influentM3": 400 }, { "hourStart": "2027-03-26T21:00:00Z", "influentM3": -5 } ] }""";

        var detail = await ProblemAsync(await Plant.SendAsync(PostActuals(body)), HttpStatusCode.BadRequest);

        Assert.StartsWith("hours[1].influentM3: -5 is negative", detail);
        Assert.Contains("Nothing was stored", detail);
        var stored = await Plant.GetStringAsync("/api/plants/ashby/actuals?from=2027-03-26&to=2027-03-26");
        Assert.DoesNotContain("2027-03-26T20:00:00Z", stored);
    }

    [Fact]
    public async Task AnIdOfTheWrongPlantIsNamedWithTheKnownOnes()
    {
        var body = $$"""{ "hours": [ { "hourStart": "{{Hour}}", "tankLevelsM3": { "brindle-tank": 300 } } ] }""";

        var detail = await ProblemAsync(await Plant.SendAsync(PostActuals(body)), HttpStatusCode.BadRequest);

        Assert.Contains("hours[0].tankLevelsM3.brindle-tank", detail);
        Assert.Contains("known: ashby-tank", detail);
    }

    [Fact]
    public async Task AnHourThatHasNotEndedIsRefused()
    {
        var future = (PlanDeskFactory.Now + Duration.FromHours(2)).ToString();
        var detail = await ProblemAsync(await Plant.SendAsync(PostActuals($$"""{ "hours": [ { "hourStart": "{{future}}" } ] }""")), HttpStatusCode.BadRequest);

        Assert.Contains("has not ended yet", detail);
    }

    [Fact]
    public async Task AnUnknownPlantIsNotFoundWithAMessage()
    {
        var scheduler = Scheduler;

        var targets = await ProblemAsync(await scheduler.GetAsync("/api/plants/nowhere/targets/2027-03-26"), HttpStatusCode.NotFound);
        var actuals = await ProblemAsync(await scheduler.SendAsync(PostActuals($$"""{ "hours": [ { "hourStart": "{{Hour}}" } ] }""", "nowhere")), HttpStatusCode.NotFound);

        Assert.Contains("No uploaded network has a plant 'nowhere'", targets);
        Assert.Contains("No uploaded network has a plant 'nowhere'", actuals);
    }

    [Fact]
    public async Task ADateOutsideEveryPublishedPlanIsNotFoundWithThePublishedDays()
    {
        var detail = await ProblemAsync(await Plant.GetAsync("/api/plants/ashby/targets/2027-04-10"), HttpStatusCode.NotFound);

        Assert.Contains("No published plan covers plant 'ashby' on 2027-04-10", detail);
        Assert.Contains("from 2027-03-26 to 2027-03-26", detail);
    }

    [Fact]
    public async Task ADateThatIsNotADateIsABadRequest()
    {
        var detail = await ProblemAsync(await Plant.GetAsync("/api/plants/ashby/targets/26-03-2027"), HttpStatusCode.BadRequest);

        Assert.Contains("write the local day as 2027-03-26", detail);
    }

    [Fact]
    public async Task AcknowledgingAVersionThatWasNeverPublishedIsNotFound()
    {
        var detail = await ProblemAsync(await Plant.SendAsync(Acknowledgement("ashby", Day, 99, "ack-99")), HttpStatusCode.NotFound);

        Assert.Contains("not version 99", detail);
    }

    [Fact]
    public async Task AReportWithoutAnIdempotencyKeyIsRefused()
    {
        var request = new HttpRequestMessage(HttpMethod.Post, "/api/plants/ashby/actuals") { Content = JsonBody($$"""{ "hours": [ { "hourStart": "{{Hour}}" } ] }""") };

        var detail = await ProblemAsync(await Plant.SendAsync(request), HttpStatusCode.BadRequest);

        Assert.Contains("'Idempotency-Key' header is missing", detail);
    }

    [Fact]
    public async Task ABodyOverTheLimitIsRefusedWith413()
    {
        var padding = new string(' ', (int)BodySizeLimit.DefaultBytes);
        var detail = await ProblemAsync(await Plant.SendAsync(PostActuals($$"""{ "hours": [ ] {{padding}} }""")), HttpStatusCode.RequestEntityTooLarge);

        Assert.Contains("at most 1,000,000 bytes", detail);
    }

    [Fact]
    public async Task ANetworkOverItsLargerLimitIsRefusedWith413()
    {
        var padding = new string(' ', (int)BodySizeLimit.NetworkBytes);
        var response = await Scheduler.PostAsync($"/api/networks/{NetworkId}/versions", JsonBody("{ }" + padding));

        Assert.Contains("at most 10,000,000 bytes", await ProblemAsync(response, HttpStatusCode.RequestEntityTooLarge));
    }

    [Fact]
    public async Task ANetworkWithProblemsIsRefusedWithEveryProblemListed()
    {
        var broken = TwoPlantNetworkJson.Replace("\"recoveryFraction\": 0.97", "\"recoveryFraction\": 1.7");

        var response = await Scheduler.PostAsync("/api/networks/broken/versions", JsonBody(broken));

        var detail = await ProblemAsync(response, HttpStatusCode.BadRequest);
        Assert.Contains("The network was not stored", detail);
        using var problem = JsonDocument.Parse(await response.Content.ReadAsStringAsync());
        var problems = problem.RootElement.GetProperty("problems").EnumerateArray().Select(p => p.GetString()!).ToList();
        Assert.Contains(problems, p => p.Contains("recoveryFraction"));
        Assert.Equal(HttpStatusCode.NotFound, (await Scheduler.GetAsync("/api/networks/broken")).StatusCode);
    }

    [Fact]
    public async Task ASolveForDaysTheNetworkCannotCoverOrTooManyDaysIsABadRequest()
    {
        var tooLong = await ProblemAsync(await Scheduler.PostAsync("/api/plans", JsonBody($$"""{ "networkId": "{{NetworkId}}", "startDate": "2027-03-26", "days": 9 }""")), HttpStatusCode.BadRequest);
        var unknown = await ProblemAsync(await Scheduler.PostAsync("/api/plans", JsonBody("""{ "networkId": "atlantis", "startDate": "2027-03-26" }""")), HttpStatusCode.NotFound);

        Assert.Contains("plan 1 to 7 local days", tooLong);
        Assert.Contains("There is no network 'atlantis'", unknown);
    }

    [Fact]
    public async Task ABodyThatIsNotJsonIsRefusedWith415()
    {
        var request = new HttpRequestMessage(HttpMethod.Post, "/api/plants/ashby/actuals")
        {
            Content = new StringContent("hour,influent\n", System.Text.Encoding.UTF8, "text/csv"),
            Headers = { { "Idempotency-Key", "csv" } },
        };

        var detail = await ProblemAsync(await Plant.SendAsync(request), HttpStatusCode.UnsupportedMediaType);

        Assert.Contains("Content-Type: application/json", detail);
    }

    [Fact]
    public async Task AnUnknownAddressIsNotFoundAsProblemDetails()
    {
        var response = await Scheduler.GetAsync("/api/plans/not-a-number");

        Assert.Equal(HttpStatusCode.NotFound, response.StatusCode);
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
    }

    [Fact]
    public async Task ARevokedKeyIsRefusedWithTheReason()
    {
        var key = await served.Factory.AddKeyAsync(Role.Viewer);
        await served.Factory.Store.RevokeKeyAsync(Auth.ApiKeys.KeyIdOf(key)!, PlanDeskFactory.Now);

        var detail = await ProblemAsync(await served.Factory.ClientWith(key).GetAsync("/api/networks"), HttpStatusCode.Unauthorized);

        Assert.Contains("was revoked", detail);
    }

    [Fact]
    public async Task AnUnknownRoleSaysWhichRolesThereAre()
    {
        var detail = await ProblemAsync(await Scheduler.PostAsync("/api/keys", JsonBody("""{ "role": "admin" }""")), HttpStatusCode.BadRequest);

        Assert.Contains("one of scheduler, plant, viewer", detail);
    }

    [Fact]
    public async Task AnEmptyBodyIsABadRequestSayingABodyIsNeeded()
    {
        var request = new HttpRequestMessage(HttpMethod.Post, "/api/plants/ashby/actuals") { Content = JsonBody(""), Headers = { { "Idempotency-Key", "empty" } } };

        var detail = await ProblemAsync(await Plant.SendAsync(request), HttpStatusCode.BadRequest);

        Assert.Contains("needs a JSON body", detail);
    }
}
