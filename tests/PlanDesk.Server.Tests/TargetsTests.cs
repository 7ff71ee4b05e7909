using System.Net;
using System.Net.Http.Headers;
using PlanDesk.Server.Auth;
using PlanDesk.Server.Store;
using PlanDesk.Server.Targets;
using PlanDesk.Server.Tests.Infrastructure;
using static PlanDesk.Server.Tests.Infrastructure.TestApi;

namespace PlanDesk.Server.Tests;

public sealed class TargetsTests : IDisposable
{
    private readonly TestDatabase database = TestDatabase.Create(StoreKind.Sqlite);
    private readonly PlanDeskFactory factory;

    public TargetsTests()
    {
        factory = new PlanDeskFactory(database);
    }

    public void Dispose()
    {
        factory.Dispose();
        database.Dispose();
    }

    private async Task<(HttpClient Scheduler, HttpClient Plant)> PublishedDayAsync()
    {
        var scheduler = factory.ClientWith(await factory.AddKeyAsync(Role.Scheduler));
        await UploadNetworkAsync(scheduler);
        await PublishAsync(scheduler, await SolveAsync(scheduler, Day));
        return (scheduler, factory.ClientWith(await factory.AddKeyAsync(Role.Plant, "ashby")));
    }

    [Fact]
    public async Task PublishedTargetsCarryTheSheetTheVersionTheTankLimitsAndTheCaution()
    {
        var (_, plant) = await PublishedDayAsync();

        var targets = await ReadAsync<TargetsResponse>(await plant.GetAsync("/api/plants/ashby/targets/2027-03-26"), HttpStatusCode.OK);

        Assert.Equal(1, targets.Version);
        Assert.True(targets.Current);
        Assert.Equal("ashby", targets.Sheet.Plant.Value);
        Assert.Equal(24, targets.Sheet.Hours.Count);
        Assert.Equal(26, targets.Sheet.Hours[0].TreatedM3); // the fake solver marks plans with the start day
        Assert.Contains("monitoring under its permit", targets.Sheet.Caution);
        var tank = Assert.Single(targets.Sheet.Tanks);
        Assert.Equal(("ashby-tank", 100.0, 2000.0), (tank.Tank.Value, tank.MinM3, tank.MaxM3)); // two-plants.json
    }

    [Fact]
    public async Task PollingWithTheETagAnswersNotModifiedUntilANewVersionIsPublished()
    {
        var (scheduler, plant) = await PublishedDayAsync();
        var first = await plant.GetAsync("/api/plants/ashby/targets/2027-03-26");
        var etag = first.Headers.ETag!;

        var poll = new HttpRequestMessage(HttpMethod.Get, "/api/plants/ashby/targets/2027-03-26") { Headers = { IfNoneMatch = { etag } } };
        var unchanged = await plant.SendAsync(poll);
        Assert.Equal(HttpStatusCode.NotModified, unchanged.StatusCode);

        await PublishAsync(scheduler, await SolveAsync(scheduler, Day));
        var again = new HttpRequestMessage(HttpMethod.Get, "/api/plants/ashby/targets/2027-03-26") { Headers = { IfNoneMatch = { etag } } };
        var changed = await plant.SendAsync(again);
        var targets = await ReadAsync<TargetsResponse>(changed, HttpStatusCode.OK);
        Assert.Equal(2, targets.Version);
        Assert.NotEqual(etag, changed.Headers.ETag);
    }

    [Fact]
    public async Task AcceptTextCsvGivesOneRowPerPeriodAfterTheCautionLineEndingWithTheTankLimits()
    {
        var (_, plant) = await PublishedDayAsync();
        var request = new HttpRequestMessage(HttpMethod.Get, "/api/plants/ashby/targets/2027-03-26") { Headers = { Accept = { new MediaTypeWithQualityHeaderValue("text/csv") } } };

        var response = await plant.SendAsync(request);
        var lines = (await response.Content.ReadAsStringAsync()).TrimEnd().Split('\n').Select(l => l.TrimEnd('\r')).ToList();

        Assert.Equal("text/csv", response.Content.Headers.ContentType!.MediaType);
        Assert.StartsWith("# Decision support only.", lines[0]);
        var header = lines.First(l => !l.StartsWith('#')).Split(',');
        Assert.Equal(["periodStartUtc", "localStart", "treatedM3", "bypassM3", "productionAM3", "units:ashby-filter", "tankEnd:ashby-tankM3"], header[..7]);
        Assert.Equal(24, lines.Count(l => !l.StartsWith('#')) - 1);
        Assert.StartsWith("2027-03-25T23:00:00Z,2027-03-26T00:00,26,", lines[3]);
        Assert.Contains("version 1, treatment level standard", lines[1]);
        Assert.Equal(["tankMin:ashby-tankM3", "tankMax:ashby-tankM3"], header[^2..]);
        Assert.EndsWith(",100,2000", lines[3]); // ashby-tank's limits in two-plants.json
    }

    [Fact]
    public async Task EveryPublishedVersionStaysInTheHistory()
    {
        var (scheduler, plant) = await PublishedDayAsync();
        await PublishAsync(scheduler, await SolveAsync(scheduler, Day));

        var versions = await ReadAsync<List<TargetVersionResponse>>(await plant.GetAsync("/api/plants/ashby/targets/2027-03-26/versions"), HttpStatusCode.OK);
        var first = await ReadAsync<TargetsResponse>(await plant.GetAsync("/api/plants/ashby/targets/2027-03-26/versions/1"), HttpStatusCode.OK);

        Assert.Equal([1, 2], versions.Select(v => v.Version));
        Assert.False(first.Current);
        Assert.NotEqual(versions[0].PlanId, versions[1].PlanId);
    }

    [Fact]
    public async Task APlanCanBePublishedWithoutABody()
    {
        var scheduler = factory.ClientWith(await factory.AddKeyAsync(Role.Scheduler));
        await UploadNetworkAsync(scheduler);
        var planId = await SolveAsync(scheduler, Day);

        var publication = await ReadAsync<PublicationResponse>(await scheduler.PostAsync($"/api/plans/{planId}/publish", null), HttpStatusCode.Created);

        Assert.Equal(2, publication.Targets.Count);
        Assert.Null(publication.Note);
    }
}
