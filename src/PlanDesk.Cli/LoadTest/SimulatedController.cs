using System.Diagnostics;
using System.Net;
using System.Net.Http.Headers;
using System.Text;
using System.Text.Json;
using NodaTime;
using NodaTime.Text;

namespace PlanDesk.Cli.LoadTest;

/// <summary>
/// What one plant's control system does against the target service: polls its targets for the day with
/// If-None-Match, acknowledges each new version once, and every few polls reports an hour of actuals, each
/// report with its own Idempotency-Key.
/// </summary>
internal sealed class SimulatedController(HttpClient client, string plantId, LocalDate date, int actualsEveryPolls, TimeSpan think, LatencyRecorder recorder)
{
    private EntityTagHeaderValue? etag;
    private int acknowledgedVersion;

    // Reports cycle through this many hours from the first one, so a long run never reaches the present.
    private const int ReportedHours = 24 * 25;

    public async Task RunAsync(Instant firstActualsHour, CancellationToken stop)
    {
        var path = $"/api/plants/{plantId}/targets/{LocalDatePattern.Iso.Format(date)}";
        var reports = 0;
        for (var poll = 1; !stop.IsCancellationRequested; poll++)
        {
            var version = await PollAsync(path, stop);
            if (version > acknowledgedVersion)
            {
                await AcknowledgeAsync(path, version, stop);
            }
            if (poll % actualsEveryPolls == 0)
            {
                await ReportActualsAsync(firstActualsHour + Duration.FromHours(reports++ % ReportedHours), stop);
            }
            if (think > TimeSpan.Zero)
            {
                await Delay(think, stop);
            }
        }
    }

    /// <summary>The version now current, or the one already known when the answer is 304.</summary>
    private async Task<int> PollAsync(string path, CancellationToken stop)
    {
        using var request = new HttpRequestMessage(HttpMethod.Get, path);
        if (etag is not null)
        {
            request.Headers.IfNoneMatch.Add(etag);
        }
        var (response, _) = await SendAsync("poll targets", request, [HttpStatusCode.OK, HttpStatusCode.NotModified], stop);
        if (response is null)
        {
            return acknowledgedVersion;
        }
        using (response)
        {
            if (response.StatusCode != HttpStatusCode.OK)
            {
                return acknowledgedVersion;
            }
            etag = response.Headers.ETag;
            using var body = JsonDocument.Parse(await response.Content.ReadAsStringAsync(stop));
            return body.RootElement.GetProperty("version").GetInt32();
        }
    }

    private async Task AcknowledgeAsync(string path, int version, CancellationToken stop)
    {
        using var request = new HttpRequestMessage(HttpMethod.Post, $"{path}/acknowledgements")
        {
            Content = new StringContent($$"""{ "version": {{version}}, "acknowledgedBy": "load test controller" }""", Encoding.UTF8, "application/json"),
        };
        request.Headers.Add("Idempotency-Key", Guid.NewGuid().ToString());
        var (response, ok) = await SendAsync("acknowledge", request, [HttpStatusCode.Created], stop);
        response?.Dispose();
        if (ok)
        {
            acknowledgedVersion = version;
        }
    }

    private async Task ReportActualsAsync(Instant hour, CancellationToken stop)
    {
        var body = $$"""
            { "hours": [ { "hourStart": "{{InstantPattern.ExtendedIso.Format(hour)}}", "influentM3": 480, "energyImportedKWh": 160,
              "energyGeneratedKWh": 90, "outfallM3": 300, "outfallTotalNitrogenKg": 3.1, "outfallTotalPhosphorusKg": 0.4,
              "effluentTotalNitrogenMgPerL": 10.2, "effluentTotalPhosphorusMgPerL": 1.3 } ] }
            """;
        using var request = new HttpRequestMessage(HttpMethod.Post, $"/api/plants/{plantId}/actuals")
        {
            Content = new StringContent(body, Encoding.UTF8, "application/json"),
        };
        request.Headers.Add("Idempotency-Key", Guid.NewGuid().ToString());
        var (response, _) = await SendAsync("report actuals", request, [HttpStatusCode.Created], stop);
        response?.Dispose();
    }

    private async Task<(HttpResponseMessage? Response, bool Expected)> SendAsync(
        string kind, HttpRequestMessage request, HttpStatusCode[] expected, CancellationToken stop)
    {
        var clock = Stopwatch.StartNew();
        try
        {
            var response = await client.SendAsync(request, stop);
            var ok = expected.Contains(response.StatusCode);
            recorder.Record(kind, (int)response.StatusCode, clock.Elapsed.TotalMilliseconds, ok);
            return (response, ok);
        }
        catch (OperationCanceledException) when (stop.IsCancellationRequested)
        {
            return (null, false);
        }
        catch (HttpRequestException)
        {
            recorder.RecordFailure(kind, clock.Elapsed.TotalMilliseconds);
            return (null, false);
        }
    }

    private static async Task Delay(TimeSpan think, CancellationToken stop)
    {
        try
        {
            await Task.Delay(think, stop);
        }
        catch (OperationCanceledException)
        {
        }
    }
}
