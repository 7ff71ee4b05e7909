using System.Globalization;
using System.Text;
using System.Text.Json;
using PlanDesk.Core.Plans;

namespace PlanDesk.Core.Targets;

/// <summary>Writes a plant's day targets as JSON, as CSV (one row per period) and as a plain-text sheet.</summary>
public static class TargetWriters
{
    /// <summary>The file name stem of a plant's day, e.g. <c>larkmoor_2027-03-26</c>.</summary>
    public static string FileStem(PlantDayTargets targets) => $"{targets.Plant}_{targets.Date:yyyy-MM-dd}";

    public static string ToJson(PlantDayTargets targets) => JsonSerializer.Serialize(targets, PlanJson.Options);

    /// <summary>
    /// One row per period: 23 rows on a spring-forward day, 25 on a fall-back day (plus the header). Each tank's
    /// minimum and maximum come last, repeated on every row, so readers that take columns by position still find
    /// the earlier columns where they were.
    /// </summary>
    public static string ToCsv(PlantDayTargets targets)
    {
        var classes = targets.Hours.SelectMany(h => h.ProductionM3ByClass.Keys).Distinct().ToList();
        var stages = targets.Hours.SelectMany(h => h.UnitsRunning.Keys).Distinct().ToList();
        var tanks = targets.Hours.SelectMany(h => h.TankEndM3.Keys).Distinct().ToList();
        var csv = new StringBuilder();
        var header = new[] { "periodStartUtc", "localStart", "treatedM3", "bypassM3" }
            .Concat(classes.Select(c => $"production{c}M3"))
            .Concat(stages.Select(s => $"units:{s}"))
            .Concat(tanks.Select(k => $"tankEnd:{k}M3"))
            .Concat(["outfallM3", "importKWh", "engineKWh", "exportKWh"])
            .Concat(targets.Tanks.SelectMany(k => new[] { $"tankMin:{k.Tank}M3", $"tankMax:{k.Tank}M3" }));
        csv.AppendLine(string.Join(",", header.Select(CsvField)));
        foreach (var hour in targets.Hours)
        {
            var row = new[]
                {
                    hour.Start.ToString(),
                    hour.LocalStart.ToString("yyyy-MM-dd'T'HH:mm", CultureInfo.InvariantCulture),
                    Number(hour.TreatedM3),
                    Number(hour.BypassM3),
                }
                .Concat(classes.Select(c => Number(hour.ProductionM3ByClass.GetValueOrDefault(c))))
                .Concat(stages.Select(s => hour.UnitsRunning.GetValueOrDefault(s).ToString(CultureInfo.InvariantCulture)))
                .Concat(tanks.Select(k => Number(hour.TankEndM3.GetValueOrDefault(k))))
                .Concat([Number(hour.OutfallM3), Number(hour.ImportKWh), Number(hour.EngineKWh), Number(hour.ExportKWh)])
                .Concat(targets.Tanks.SelectMany(k => new[] { Number(k.MinM3), Number(k.MaxM3) }));
            csv.AppendLine(string.Join(",", row.Select(CsvField)));
        }
        return csv.ToString();
    }

    // RFC 4180: quote a field holding a comma, quote or line break, doubling its quotes.
    private static string CsvField(string field) =>
        field.IndexOfAny([',', '"', '\n', '\r']) < 0 ? field : "\"" + field.Replace("\"", "\"\"") + "\"";

    /// <summary>A sheet a plant operator can read, carrying the caution first.</summary>
    public static string ToText(PlantDayTargets targets)
    {
        var sheet = new StringBuilder();
        sheet.AppendLine($"PlanDesk targets: {targets.PlantName} ({targets.Plant}), {targets.Date:yyyy-MM-dd} ({targets.TimeZone})");
        sheet.AppendLine();
        sheet.AppendLine("CAUTION: " + targets.Caution);
        sheet.AppendLine();
        sheet.AppendLine($"Treatment level: {targets.TreatmentLevelName} ({targets.TreatmentLevel}): effluent total N " +
                         $"{Amounts.Format(targets.EffluentTotalNitrogenMgPerL, 2)} mg/L, total P {Amounts.Format(targets.EffluentTotalPhosphorusMgPerL, 2)} mg/L");
        var permit = targets.Permit;
        sheet.AppendLine($"Outfall: {Amounts.Format(permit.OutfallM3)} m3; total N {Amounts.Format(permit.TotalNitrogenKg, 1)} kg{CapText(permit.DailyTotalNitrogenCapKg, permit.TotalNitrogenHeadroomKg)}; " +
                         $"total P {Amounts.Format(permit.TotalPhosphorusKg, 1)} kg{CapText(permit.DailyTotalPhosphorusCapKg, permit.TotalPhosphorusHeadroomKg)}");
        var energy = targets.Energy;
        sheet.AppendLine($"Energy: load {Amounts.Format(energy.LoadKWh)} kWh, engine {Amounts.Format(energy.EngineKWh)} kWh, " +
                         $"import {Amounts.Format(energy.ImportKWh)} kWh (peak {Amounts.Format(energy.PeakImportKw)} kW), export {Amounts.Format(energy.ExportKWh)} kWh");
        foreach (var delivery in targets.Deliveries)
        {
            sheet.AppendLine($"Delivery: {delivery.CustomerName} ({delivery.Customer}), class {delivery.Class}: {Amounts.Format(delivery.VolumeM3)} m3");
        }
        foreach (var tank in targets.Tanks)
        {
            sheet.AppendLine($"Tank limits: {tank.TankName} ({tank.Tank}), class {tank.Class}: {Amounts.Format(tank.MinM3)}–{Amounts.Format(tank.MaxM3)} m3");
        }
        sheet.AppendLine();
        AppendHours(sheet, targets);
        sheet.AppendLine();
        sheet.AppendLine("CAUTION: " + targets.Caution);
        return sheet.ToString();
    }

    /// <summary>Writes JSON, CSV and text files for each target into <paramref name="directory"/>; returns the paths.</summary>
    public static IReadOnlyList<string> WriteAll(IEnumerable<PlantDayTargets> targets, string directory)
    {
        Directory.CreateDirectory(directory);
        var paths = new List<string>();
        foreach (var target in targets)
        {
            var stem = Path.Combine(directory, FileStem(target));
            File.WriteAllText(stem + ".json", ToJson(target));
            File.WriteAllText(stem + ".csv", ToCsv(target));
            File.WriteAllText(stem + ".txt", ToText(target));
            paths.AddRange([stem + ".json", stem + ".csv", stem + ".txt"]);
        }
        return paths;
    }

    private static void AppendHours(StringBuilder sheet, PlantDayTargets targets)
    {
        var stages = targets.Hours.SelectMany(h => h.UnitsRunning.Keys).Distinct().ToList();
        var tanks = targets.Hours.SelectMany(h => h.TankEndM3.Keys).Distinct().ToList();
        var columns = new[] { "time", "treated m3", "bypass m3", "product m3", "outfall m3", "import kWh", "engine kWh" }
            .Concat(stages.Select(s => $"units {s}"))
            .Concat(tanks.Select(k => $"{k} m3"))
            .ToList();
        sheet.AppendLine(string.Join("  ", columns.Select(c => c.PadLeft(Math.Max(10, c.Length)))));
        foreach (var hour in targets.Hours)
        {
            var cells = new[]
                {
                    hour.LocalStart.ToString("HH:mm", CultureInfo.InvariantCulture),
                    Amounts.Format(hour.TreatedM3), Amounts.Format(hour.BypassM3), Amounts.Format(hour.ProductionM3ByClass.Values.Sum()),
                    Amounts.Format(hour.OutfallM3), Amounts.Format(hour.ImportKWh), Amounts.Format(hour.EngineKWh),
                }
                .Concat(stages.Select(s => hour.UnitsRunning.GetValueOrDefault(s).ToString(CultureInfo.InvariantCulture)))
                .Concat(tanks.Select(k => Amounts.Format(hour.TankEndM3.GetValueOrDefault(k))))
                .ToList();
            sheet.AppendLine(string.Join("  ", cells.Select((cell, i) => cell.PadLeft(Math.Max(10, columns[i].Length)))));
        }
    }

    private static string CapText(double? cap, double? headroom) =>
        cap is null ? " (no daily cap)" : $" of a {Amounts.Format(cap.Value, 1)} kg daily cap (headroom {Amounts.Format(headroom!.Value, 1)} kg)";

    private static string Number(double value) => Math.Round(value, 3).ToString("0.###", CultureInfo.InvariantCulture);
}
