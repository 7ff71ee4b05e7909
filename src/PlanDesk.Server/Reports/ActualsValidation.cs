using NodaTime;
using PlanDesk.Core.Model;

namespace PlanDesk.Server.Reports;

/// <summary>
/// Checks a report of actuals against the plant as the latest network describes it. Each problem names the
/// field as <c>hours[i].field</c> and says what is allowed; nothing is stored when any is found.
/// </summary>
internal static class ActualsValidation
{
    public const int MaxHoursPerReport = 24 * 62;
    // Plant clocks drift; an hour may end this far in the server's future and still count as past.
    private static readonly Duration ClockTolerance = Duration.FromMinutes(10);

    public static IReadOnlyList<string> Check(ActualsRequest request, Network network, Plant plant, Instant now)
    {
        var problems = new List<string>();
        if (request.Hours.Count == 0)
        {
            problems.Add("hours: the list is empty; send at least one hour.");
        }
        if (request.Hours.Count > MaxHoursPerReport)
        {
            problems.Add($"hours: {request.Hours.Count} hours in one report; send at most {MaxHoursPerReport} (62 days) per request.");
        }
        var seen = new HashSet<Instant>();
        for (var i = 0; i < request.Hours.Count; i++)
        {
            CheckHour(request.Hours[i], $"hours[{i}]", network, plant, now, seen, problems);
        }
        return problems;
    }

    private static void CheckHour(ActualsHour hour, string at, Network network, Plant plant, Instant now, HashSet<Instant> seen, List<string> problems)
    {
        var start = hour.HourStart;
        if (start.ToUnixTimeTicks() % NodaConstants.TicksPerHour != 0)
        {
            problems.Add($"{at}.hourStart: {start} is not on the hour; report whole hours, starting at minute 00.");
        }
        if (start + Duration.FromHours(1) > now + ClockTolerance)
        {
            problems.Add($"{at}.hourStart: the hour from {start} has not ended yet (server time {now}); report an hour after it ends.");
        }
        if (!seen.Add(start))
        {
            problems.Add($"{at}.hourStart: {start} appears more than once in this report; send each hour once.");
        }
        NotNegative(problems, $"{at}.influentM3", hour.InfluentM3);
        NotNegative(problems, $"{at}.effluentTotalNitrogenMgPerL", hour.EffluentTotalNitrogenMgPerL);
        NotNegative(problems, $"{at}.effluentTotalPhosphorusMgPerL", hour.EffluentTotalPhosphorusMgPerL);
        NotNegative(problems, $"{at}.energyImportedKWh", hour.EnergyImportedKWh);
        NotNegative(problems, $"{at}.energyGeneratedKWh", hour.EnergyGeneratedKWh);
        NotNegative(problems, $"{at}.gasHolderNm3", hour.GasHolderNm3);
        NotNegative(problems, $"{at}.outfallM3", hour.OutfallM3);
        NotNegative(problems, $"{at}.outfallTotalNitrogenKg", hour.OutfallTotalNitrogenKg);
        NotNegative(problems, $"{at}.outfallTotalPhosphorusKg", hour.OutfallTotalPhosphorusKg);
        if (hour.GasHolderNm3 is not null && plant.Biogas is null)
        {
            problems.Add($"{at}.gasHolderNm3: plant '{plant.Id}' has no gas holder in network '{network.Name}'; leave the field out.");
        }
        var classes = network.Classes.Select(c => c.Id.Value).ToList();
        foreach (var (classId, m3) in hour.ProductionM3ByClass ?? new Dictionary<string, double>())
        {
            Known(problems, $"{at}.productionM3ByClass.{classId}", classId, classes, "quality class", network);
            NotNegative(problems, $"{at}.productionM3ByClass.{classId}", m3);
        }
        var tanks = network.Tanks.Where(t => t.Plant is null || t.Plant == plant.Id).Select(t => t.Id.Value).ToList();
        foreach (var (tankId, m3) in hour.TankLevelsM3 ?? new Dictionary<string, double>())
        {
            Known(problems, $"{at}.tankLevelsM3.{tankId}", tankId, tanks, $"tank at plant '{plant.Id}' (or regional reservoir)", network);
            NotNegative(problems, $"{at}.tankLevelsM3.{tankId}", m3);
        }
        foreach (var (stageId, units) in hour.UnitsRunning ?? new Dictionary<string, int>())
        {
            var stage = plant.Stages.FirstOrDefault(s => s.Id.Value == stageId);
            if (stage is null)
            {
                Known(problems, $"{at}.unitsRunning.{stageId}", stageId, plant.Stages.Select(s => s.Id.Value).ToList(), $"stage at plant '{plant.Id}'", network);
            }
            else if (units < 0 || units > stage.Units)
            {
                problems.Add($"{at}.unitsRunning.{stageId}: {units} units reported; the stage has 0 to {stage.Units} units.");
            }
        }
    }

    private static void NotNegative(List<string> problems, string field, double? value)
    {
        if (value is not { } v)
        {
            return;
        }
        if (!double.IsFinite(v))
        {
            problems.Add($"{field}: {v} is not a number; send the measured value, or leave the field out when there is none.");
        }
        else if (v < 0)
        {
            problems.Add($"{field}: {v} is negative; a measured volume, level, load or energy cannot be below 0. Correct it, or leave the field out.");
        }
    }

    private static void Known(List<string> problems, string field, string id, IReadOnlyList<string> known, string what, Network network)
    {
        if (!known.Contains(id))
        {
            var list = known.Count == 0 ? "there are none" : $"known: {string.Join(", ", known)}";
            problems.Add($"{field}: '{id}' is not a {what} in network '{network.Name}' ({list}).");
        }
    }
}
