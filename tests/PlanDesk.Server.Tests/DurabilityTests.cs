using System.Net;
using System.Text.Json;
using NodaTime;
using PlanDesk.Core.Loading;
using PlanDesk.Core.Model;
using PlanDesk.Core.Plans;
using PlanDesk.Core.Targets;
using PlanDesk.Server.Auth;
using PlanDesk.Server.Hosting;
using PlanDesk.Server.Reports;
using PlanDesk.Server.Store;
using PlanDesk.Server.Tests.Infrastructure;
using static PlanDesk.Server.Tests.Infrastructure.TestApi;

namespace PlanDesk.Server.Tests;

/// <summary>A write the server answered 201 to is on disk: killing the process hard loses none of them.</summary>
public sealed class DurabilityTests
{
    private const int Writes = 30;

    [Fact]
    public async Task EveryAcknowledgedWriteSurvivesTheServerBeingKilled()
    {
        using var database = TestDatabase.Create(StoreKind.Sqlite);
        var plantKey = await SeedPublishedDayAsync(database.Settings);
        // Actuals must be for hours that have ended by the real clock the child process uses.
        var firstHour = Instant.FromUnixTimeSeconds(SystemClock.Instance.GetCurrentInstant().ToUnixTimeSeconds() / 3600 * 3600) - Duration.FromDays(3);

        List<AcknowledgementResponse> acks;
        List<ActualsReportResponse> reports;
        using (var first = await ChildServer.StartAsync(database.DataDirectory!))
        {
            var plant = first.Client(plantKey);
            var ackTasks = Enumerable.Range(0, Writes).Select(async i =>
                await ReadAsync<AcknowledgementResponse>(await plant.SendAsync(Acknowledgement("ashby", Day, 1, $"ack-{i}", $"operator {i}")), HttpStatusCode.Created));
            var reportTasks = Enumerable.Range(0, Writes).Select(async i =>
                await ReadAsync<ActualsReportResponse>(await plant.SendAsync(Actuals("ashby", SomeActuals(firstHour + Duration.FromHours(i), 1, 400 + i), $"actuals-{i}")), HttpStatusCode.Created));
            acks = (await Task.WhenAll(ackTasks)).ToList();
            reports = (await Task.WhenAll(reportTasks)).ToList();
            first.KillHard();
        }

        using var second = await ChildServer.StartAsync(database.DataDirectory!);
        var again = second.Client(plantKey);
        var storedAcks = await ReadAsync<List<AcknowledgementResponse>>(await again.GetAsync("/api/plants/ashby/targets/2027-03-26/acknowledgements"), HttpStatusCode.OK);
        var zone = DateTimeZoneProviders.Tzdb["Europe/Madrid"];
        var from = firstHour.InZone(zone).Date;
        var to = (firstHour + Duration.FromHours(Writes)).InZone(zone).Date;
        var storedHours = await ReadAsync<ActualsListResponse>(await again.GetAsync($"/api/plants/ashby/actuals?from={from:uuuu-MM-dd}&to={to:uuuu-MM-dd}"), HttpStatusCode.OK);
        var retried = await ReadAsync<AcknowledgementResponse>(await again.SendAsync(Acknowledgement("ashby", Day, 1, "ack-7", "operator 7")), HttpStatusCode.Created);

        Assert.Equal(acks.Select(a => a.AcknowledgementId).Order(), storedAcks.Select(a => a.AcknowledgementId).Order());
        Assert.Equal(reports.Select(r => r.ReportId).Order(), storedHours.Hours.Select(h => h.ReportId).Order());
        Assert.Equal(Enumerable.Range(0, Writes).Select(i => 400.0 + i), storedHours.Hours.Select(h => h.Hour.InfluentM3!.Value));
        Assert.Equal(acks.Single(a => a.AcknowledgedBy == "operator 7"), retried);
    }

    /// <summary>Writes what a scheduler would have done before the plants call: a network, a finished plan and its
    /// publication for <see cref="TestApi.Day"/>. Returns a key for plant 'ashby'.</summary>
    private static async Task<string> SeedPublishedDayAsync(StoreSettings settings)
    {
        var store = settings.CreateStore();
        try
        {
            await store.MigrateAsync();
            var now = SystemClock.Instance.GetCurrentInstant();
            var (plantKey, plantRecord) = ApiKeys.Create(Role.Plant, "ashby", "durability", now);
            await store.AddKeyAsync(plantRecord);
            var network = NetworkLoader.LoadText(TwoPlantNetworkJson, "two-plants.json", null).Network!;
            await store.AddNetworkVersionAsync(NetworkId, network.Name, TwoPlantNetworkJson,
                network.Plants.Select(p => new NetworkPlantRecord(p.Id.Value, p.Name)).ToList(), now, plantRecord.KeyId);
            var planningCase = PlanningCase.Create(network, Day, 1).Case!;
            var plan = TestPlans.Simple(planningCase, 26);
            var sheets = PlantDayTargetsBuilder.Build(planningCase, plan);
            var job = await store.AddPlanJobAsync(NetworkId, 1, Day, 1, "{}", now, plantRecord.KeyId);
            await store.CompletePlanAsync(job.Id, new PlanOutcome("{}", PlanJson.Serialize(plan), "{}", JsonSerializer.Serialize(sheets, ServerJson.Options)), "seeded", now);
            await store.PublishAsync(job.Id,
                sheets.Select(s => new TargetSheetToPublish(s.Plant.Value, s.Date, JsonSerializer.Serialize(s, ServerJson.Options))).ToList(), null, now, plantRecord.KeyId);
            return plantKey;
        }
        finally
        {
            (store as IDisposable)?.Dispose();
        }
    }
}
