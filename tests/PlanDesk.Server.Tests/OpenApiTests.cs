using System.Net;
using System.Text.Json;
using PlanDesk.Server.Tests.Infrastructure;

namespace PlanDesk.Server.Tests;

public sealed class OpenApiTests(ServedNetwork served) : IClassFixture<ServedNetwork>
{
    private async Task<JsonElement> SchemasAsync()
    {
        var document = JsonDocument.Parse(await served.Client(Caller.None).GetStringAsync("/openapi/v1.json"));
        return document.RootElement.GetProperty("components").GetProperty("schemas");
    }

    private static JsonElement Property(JsonElement schemas, string schema, string property)
    {
        var found = schemas.GetProperty(schema).GetProperty("properties").GetProperty(property);
        // A property of a described type may be given as a reference to a shared schema.
        return found.TryGetProperty("$ref", out var reference) ? schemas.GetProperty(reference.GetString()!.Split('/')[^1]) : found;
    }

    [Fact]
    public async Task LocalDatesAreDescribedAsDateStringsAndInstantsAsDateTimeStrings()
    {
        var schemas = await SchemasAsync();

        var startDate = Property(schemas, "SolveRequest", "startDate");
        var hourStart = Property(schemas, "ActualsHour", "hourStart");

        Assert.Equal(("string", "date"), (startDate.GetProperty("type").GetString(), startDate.GetProperty("format").GetString()));
        Assert.Equal(("string", "date-time"), (hourStart.GetProperty("type").GetString(), hourStart.GetProperty("format").GetString()));
    }

    [Fact]
    public async Task TypedIdsAreDescribedAsStrings()
    {
        var schemas = await SchemasAsync();

        var plant = Property(schemas, "PlantDayTargets", "plant");

        Assert.Equal("string", plant.GetProperty("type").GetString());
        Assert.False(plant.TryGetProperty("properties", out _));
    }

    [Fact]
    public async Task TheApiReferencePageIsServedAndNeedsNothingFromOutside()
    {
        var client = served.Client(Caller.None);

        var page = await client.GetAsync("/api-reference.html");
        var html = await page.Content.ReadAsStringAsync();
        var index = await client.GetStringAsync("/");

        Assert.Equal(HttpStatusCode.OK, page.StatusCode);
        Assert.Contains("fetch(\"openapi/v1.json\")", html);
        Assert.DoesNotContain("src=\"http", html);
        Assert.DoesNotContain("href=\"http", html);
        Assert.Contains("api-reference.html", index);
        Assert.Contains("monitoring under its permit", index);
    }
}
