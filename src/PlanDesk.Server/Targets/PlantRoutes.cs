using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;
using NodaTime;
using NodaTime.Text;
using PlanDesk.Server.Store;

namespace PlanDesk.Server.Targets;

/// <summary>Answers shared by the endpoints under <c>/api/plants/{plantId}</c>.</summary>
internal static class PlantRoutes
{
    public static bool TryParseDate(string text, out LocalDate date, out BadRequest<ProblemDetails> problem)
    {
        var result = LocalDatePattern.Iso.Parse(text);
        date = result.Success ? result.Value : default;
        problem = Problems.BadRequest("Date not valid", $"'{text}' is not a date; write the local day as 2027-03-26.");
        return result.Success;
    }

    /// <summary>404 for a plant-day without (that version of) targets, saying whether the plant is unknown or which days it has.</summary>
    public static async Task<NotFound<ProblemDetails>> NoTargetsAsync(IPlanDeskStore store, string plantId, LocalDate date, int? version)
    {
        if (await store.LatestNetworkWithPlantAsync(plantId) is null)
        {
            return UnknownPlant(plantId);
        }
        var day = date.ToString("uuuu-MM-dd", null);
        var published = await store.PublishedDaysAsync(plantId);
        if (published is null)
        {
            return Problems.NotFound("No targets published", $"No targets have been published for plant '{plantId}' yet; a scheduler publishes a plan with POST /api/plans/{{planId}}/publish.");
        }
        if (version is { } v && await store.GetTargetAsync(plantId, date, null, withSheet: false) is { } current)
        {
            return Problems.NotFound("Target version not found", $"Plant '{plantId}' has versions 1 to {current.Version} for {day}, not version {v}.");
        }
        return Problems.NotFound("No targets for this day",
            $"No published plan covers plant '{plantId}' on {day}; published days for this plant run from {published.Value.First:uuuu-MM-dd} to {published.Value.Last:uuuu-MM-dd} (with possible gaps).");
    }

    public static NotFound<ProblemDetails> UnknownPlant(string plantId) =>
        Problems.NotFound("Plant not found", $"No uploaded network has a plant '{plantId}'. Check the plant id (it is case-sensitive) against GET /api/networks.");
}
