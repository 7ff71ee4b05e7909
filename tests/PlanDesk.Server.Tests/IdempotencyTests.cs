using System.Net;
using NodaTime;
using PlanDesk.Server.Reports;
using PlanDesk.Server.Tests.Infrastructure;
using static PlanDesk.Server.Tests.Infrastructure.TestApi;

namespace PlanDesk.Server.Tests;

/// <summary>Plant links are flaky: a retried acknowledgement or report of actuals must never count twice.</summary>
public sealed class IdempotencyTests
{
    private static readonly Instant LastNight = Instant.FromUtc(2027, 3, 26, 22, 0);

    [Theory, OnSqlite, OnPostgres]
    public async Task TheSameAcknowledgementSentTwiceWithOneKeyIsStoredOnce(StoreKind store)
    {
        await using var served = await Served.StartAsync(store);

        var first = await ReadAsync<AcknowledgementResponse>(await served.Plant.SendAsync(Acknowledgement("ashby", Day, 1, "ack-7f3a")), HttpStatusCode.Created);
        var retry = await served.Plant.SendAsync(Acknowledgement("ashby", Day, 1, "ack-7f3a"));
        var second = await ReadAsync<AcknowledgementResponse>(retry, HttpStatusCode.Created);

        Assert.Equal(first, second);
        Assert.Equal("true", retry.Headers.GetValues(Idempotency.ReplayHeader).Single());
        var stored = await ReadAsync<List<AcknowledgementResponse>>(await served.Plant.GetAsync("/api/plants/ashby/targets/2027-03-26/acknowledgements"), HttpStatusCode.OK);
        Assert.Single(stored);
    }

    [Theory, OnSqlite, OnPostgres]
    public async Task AcknowledgementsSentWithTwoKeysAreStoredTwice(StoreKind store)
    {
        await using var served = await Served.StartAsync(store);

        var first = await ReadAsync<AcknowledgementResponse>(await served.Plant.SendAsync(Acknowledgement("ashby", Day, 1, "ack-1")), HttpStatusCode.Created);
        var second = await ReadAsync<AcknowledgementResponse>(await served.Plant.SendAsync(Acknowledgement("ashby", Day, 1, "ack-2")), HttpStatusCode.Created);

        Assert.NotEqual(first.AcknowledgementId, second.AcknowledgementId);
        var stored = await ReadAsync<List<AcknowledgementResponse>>(await served.Plant.GetAsync("/api/plants/ashby/targets/2027-03-26/acknowledgements"), HttpStatusCode.OK);
        Assert.Equal(2, stored.Count);
    }

    [Theory, OnSqlite, OnPostgres]
    public async Task TheSameActualsSentTwiceWithOneKeyAreStoredOnce(StoreKind store)
    {
        await using var served = await Served.StartAsync(store, publishDay: false);
        var report = SomeActuals(LastNight, 3);

        var first = await ReadAsync<ActualsReportResponse>(await served.Plant.SendAsync(Actuals("ashby", report, "actuals-0042")), HttpStatusCode.Created);
        var second = await ReadAsync<ActualsReportResponse>(await served.Plant.SendAsync(Actuals("ashby", report, "actuals-0042")), HttpStatusCode.Created);

        Assert.Equal(first, second);
        var stored = await ReadAsync<ActualsListResponse>(await served.Plant.GetAsync("/api/plants/ashby/actuals?from=2027-03-26&to=2027-03-27"), HttpStatusCode.OK);
        Assert.Equal(3, stored.Hours.Count);
        Assert.All(stored.Hours, h => Assert.Equal(first.ReportId, h.ReportId));
    }

    [Theory, OnSqlite, OnPostgres]
    public async Task ActualsSentWithTwoKeysAreTwoReportsAndTheLaterOneCountsForEachHour(StoreKind store)
    {
        await using var served = await Served.StartAsync(store, publishDay: false);

        var first = await ReadAsync<ActualsReportResponse>(await served.Plant.SendAsync(Actuals("ashby", SomeActuals(LastNight, 3, influentM3: 400), "a-1")), HttpStatusCode.Created);
        var second = await ReadAsync<ActualsReportResponse>(await served.Plant.SendAsync(Actuals("ashby", SomeActuals(LastNight, 3, influentM3: 410), "a-2")), HttpStatusCode.Created);

        Assert.NotEqual(first.ReportId, second.ReportId);
        var stored = await ReadAsync<ActualsListResponse>(await served.Plant.GetAsync("/api/plants/ashby/actuals?from=2027-03-26&to=2027-03-27"), HttpStatusCode.OK);
        Assert.Equal(3, stored.Hours.Count);
        Assert.All(stored.Hours, h => Assert.Equal((second.ReportId, 410.0), (h.ReportId, h.Hour.InfluentM3!.Value)));
    }

    [Theory, OnSqlite, OnPostgres]
    public async Task ReusingAKeyForADifferentReportIsRefusedAndStoresNothing(StoreKind store)
    {
        await using var served = await Served.StartAsync(store, publishDay: false);
        await ReadAsync<ActualsReportResponse>(await served.Plant.SendAsync(Actuals("ashby", SomeActuals(LastNight, 2, influentM3: 400), "k")), HttpStatusCode.Created);

        var reused = await served.Plant.SendAsync(Actuals("ashby", SomeActuals(LastNight, 2, influentM3: 999), "k"));

        Assert.Equal(HttpStatusCode.UnprocessableEntity, reused.StatusCode);
        Assert.Contains("already used for a different report", await reused.Content.ReadAsStringAsync());
        var stored = await ReadAsync<ActualsListResponse>(await served.Plant.GetAsync("/api/plants/ashby/actuals?from=2027-03-26&to=2027-03-27"), HttpStatusCode.OK);
        Assert.All(stored.Hours, h => Assert.Equal(400, h.Hour.InfluentM3));
    }

    [Theory, OnSqlite, OnPostgres]
    public async Task RetriesArrivingAtTheSameTimeStoreOneAcknowledgement(StoreKind store)
    {
        await using var served = await Served.StartAsync(store);

        var responses = await Task.WhenAll(Enumerable.Range(0, 8).Select(_ => served.Plant.SendAsync(Acknowledgement("ashby", Day, 1, "burst"))));
        var acks = await Task.WhenAll(responses.Select(r => ReadAsync<AcknowledgementResponse>(r, HttpStatusCode.Created)));

        Assert.Single(acks.Select(a => a.AcknowledgementId).Distinct());
        var stored = await ReadAsync<List<AcknowledgementResponse>>(await served.Plant.GetAsync("/api/plants/ashby/targets/2027-03-26/acknowledgements"), HttpStatusCode.OK);
        Assert.Single(stored);
    }
}
