using System.Globalization;
using NodaTime;
using NodaTime.Text;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Actuals;

/// <summary>A network whose starting state was taken from reported actuals, and what was taken, in plain words.</summary>
public sealed record AppliedActuals(Network Network, IReadOnlyList<string> Notes);

/// <summary>
/// Starts the next plan from what the plants reported instead of the network file: the latest tank levels,
/// units running and gas holder level reported before the horizon starts, and the month-to-date permit loads
/// and grid peak summed over the reported hours of the month the horizon starts in. Values are used only where
/// reported; every value taken, and every value moved into its allowed range, is written in the notes.
/// </summary>
public static class ActualsApplier
{
    private static readonly LocalDateTimePattern HourPattern = LocalDateTimePattern.CreateWithInvariantCulture("uuuu-MM-dd HH:mm");

    /// <param name="actuals">Hourly rows of any plants; rows ending after the horizon starts are ignored, and
    /// when one plant reports the same hour twice the later row in the list wins.</param>
    public static AppliedActuals Apply(Network network, LocalDate startDate, IReadOnlyList<HourlyActuals> actuals)
    {
        var zone = network.TimeZone;
        var start = zone.AtStartOfDay(startDate).ToInstant();
        var monthStart = zone.AtStartOfDay(startDate.With(DateAdjusters.StartOfMonth)).ToInstant();
        var rows = actuals
            .Where(a => a.HourEnd <= start)
            .GroupBy(a => (a.Plant, a.HourStart))
            .Select(g => g.Last())
            .OrderBy(a => a.HourStart)
            .ToList();
        var notes = new List<string>();
        string When(HourlyActuals row) => HourPattern.Format(row.HourEnd.InZone(zone).LocalDateTime);

        var plants = network.Plants
            .Select(plant => ApplyToPlant(plant, rows.Where(r => r.Plant == plant.Id).ToList(), monthStart, notes, When))
            .ToList();
        var tanks = network.Tanks.Select(tank => ApplyTankLevel(tank, rows, notes, When)).ToList();
        return new AppliedActuals(network with { Plants = plants, Tanks = tanks }, notes);
    }

    private static Plant ApplyToPlant(Plant plant, List<HourlyActuals> rows, Instant monthStart, List<string> notes, Func<HourlyActuals, string> when)
    {
        if (rows.Count == 0)
        {
            return plant;
        }
        var stages = plant.Stages.Select(stage => ApplyUnitsRunning(stage, rows, notes, when)).ToList();
        var biogas = ApplyGasHolder(plant, rows, notes, when);
        var monthRows = rows.Where(r => r.HourStart >= monthStart).ToList();
        var permit = ApplyMonthToDateLoads(plant, monthRows, notes);
        var peakKw = ApplyMonthToDatePeak(plant, monthRows, notes);
        return plant with { Stages = stages, Biogas = biogas, Permit = permit, MonthToDatePeakKw = peakKw };
    }

    private static Stage ApplyUnitsRunning(Stage stage, List<HourlyActuals> rows, List<string> notes, Func<HourlyActuals, string> when)
    {
        var latest = rows.LastOrDefault(r => r.UnitsRunning.ContainsKey(stage.Id));
        if (latest is null)
        {
            return stage;
        }
        var reported = latest.UnitsRunning[stage.Id];
        var used = Math.Clamp(reported, 0, stage.Units);
        notes.Add(used == reported
            ? $"stage {stage.Id}: starts with {used} units running, as reported at {when(latest)}"
            : $"stage {stage.Id}: {reported} units reported running at {when(latest)}, but the stage has {stage.Units}; the plan starts with {used}");
        return stage with { InitialUnitsRunning = used };
    }

    private static Biogas? ApplyGasHolder(Plant plant, List<HourlyActuals> rows, List<string> notes, Func<HourlyActuals, string> when)
    {
        var latest = rows.LastOrDefault(r => r.GasHolderNm3 is not null);
        if (latest is null)
        {
            return plant.Biogas;
        }
        if (plant.Biogas is null)
        {
            notes.Add($"plant {plant.Id}: a gas holder level was reported but the network gives the plant no biogas; the level is not used");
            return null;
        }
        var reported = latest.GasHolderNm3!.Value;
        var used = Math.Clamp(reported, 0, plant.Biogas.HolderNm3);
        notes.Add(used == reported
            ? $"plant {plant.Id}: gas holder starts at {Format(used)} Nm3, as reported at {when(latest)}"
            : $"plant {plant.Id}: gas holder reported as {Format(reported)} Nm3 at {when(latest)}, outside 0 to {Format(plant.Biogas.HolderNm3)} Nm3; the plan starts from {Format(used)} Nm3");
        return plant.Biogas with { InitialHolderNm3 = used };
    }

    private static Permit ApplyMonthToDateLoads(Plant plant, List<HourlyActuals> monthRows, List<string> notes)
    {
        var permit = plant.Permit;
        var nitrogenRows = monthRows.Where(r => r.OutfallTotalNitrogenKg is not null).ToList();
        if (nitrogenRows.Count > 0)
        {
            var kg = nitrogenRows.Sum(r => r.OutfallTotalNitrogenKg!.Value);
            notes.Add($"plant {plant.Id}: month-to-date total N {Format(kg)} kg, summed over {nitrogenRows.Count} reported hours of the month");
            permit = permit with { MonthToDateTotalNitrogenKg = kg };
        }
        var phosphorusRows = monthRows.Where(r => r.OutfallTotalPhosphorusKg is not null).ToList();
        if (phosphorusRows.Count > 0)
        {
            var kg = phosphorusRows.Sum(r => r.OutfallTotalPhosphorusKg!.Value);
            notes.Add($"plant {plant.Id}: month-to-date total P {Format(kg)} kg, summed over {phosphorusRows.Count} reported hours of the month");
            permit = permit with { MonthToDateTotalPhosphorusKg = kg };
        }
        return permit;
    }

    // An hour's imported kWh is its average import in kW, the quantity the demand charge is billed on.
    private static double ApplyMonthToDatePeak(Plant plant, List<HourlyActuals> monthRows, List<string> notes)
    {
        var importRows = monthRows.Where(r => r.ImportedKWh is not null).ToList();
        if (importRows.Count == 0)
        {
            return plant.MonthToDatePeakKw;
        }
        var peakKw = importRows.Max(r => r.ImportedKWh!.Value);
        notes.Add($"plant {plant.Id}: month-to-date grid peak {Format(peakKw)} kW, the highest of {importRows.Count} reported hours of the month");
        return peakKw;
    }

    private static Tank ApplyTankLevel(Tank tank, List<HourlyActuals> rows, List<string> notes, Func<HourlyActuals, string> when)
    {
        var latest = rows.Where(r => r.TankEndM3.ContainsKey(tank.Id)).MaxBy(r => r.HourStart);
        if (latest is null)
        {
            return tank;
        }
        var reported = latest.TankEndM3[tank.Id];
        var used = Math.Clamp(reported, tank.MinM3, tank.MaxM3);
        notes.Add(used == reported
            ? $"tank {tank.Id}: starts at {Format(used)} m3, as reported at {when(latest)}"
            : $"tank {tank.Id}: reported as {Format(reported)} m3 at {when(latest)}, outside its range {Format(tank.MinM3)} to {Format(tank.MaxM3)} m3; the plan starts from {Format(used)} m3");
        return tank with { InitialM3 = used };
    }

    private static string Format(double value) => value.ToString("0.###", CultureInfo.InvariantCulture);
}
