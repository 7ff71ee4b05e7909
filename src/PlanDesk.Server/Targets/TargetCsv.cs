using System.Globalization;
using System.Text;
using PlanDesk.Core.Targets;

namespace PlanDesk.Server.Targets;

/// <summary>
/// A plant-day's targets as CSV for control systems that read tables: a comment line with the caution and the
/// day's treatment level, then one row per period. Columns for production, units and tanks are named after the
/// class, stage and tank ids. Lines starting with '#' are comments.
/// </summary>
internal static class TargetCsv
{
    public static string Write(TargetsResponse targets)
    {
        var sheet = targets.Sheet;
        var classes = sheet.Hours.SelectMany(h => h.ProductionM3ByClass.Keys).Distinct().OrderBy(c => c.Value).ToList();
        var stages = sheet.Hours.SelectMany(h => h.UnitsRunning.Keys).Distinct().OrderBy(s => s.Value).ToList();
        var tanks = sheet.Hours.SelectMany(h => h.TankEndM3.Keys).Distinct().OrderBy(t => t.Value).ToList();
        var text = new StringBuilder();
        text.Append("# ").AppendLine(sheet.Caution);
        text.Append(CultureInfo.InvariantCulture,
            $"# plant {sheet.Plant}, {sheet.Date:uuuu-MM-dd} ({sheet.TimeZone}), version {targets.Version}, treatment level {sheet.TreatmentLevel}, ")
            .AppendLine(CultureInfo.InvariantCulture, $"effluent total N {sheet.EffluentTotalNitrogenMgPerL} mg/L, total P {sheet.EffluentTotalPhosphorusMgPerL} mg/L");
        var header = new List<string> { "startUtc", "localStart", "treatedM3", "bypassM3" };
        header.AddRange(classes.Select(c => $"production_{c}_M3"));
        header.AddRange(stages.Select(s => $"units_{s}"));
        header.AddRange(tanks.Select(t => $"tank_{t}_endM3"));
        header.AddRange(["outfallM3", "importKWh", "engineKWh", "exportKWh"]);
        text.AppendLine(string.Join(',', header.Select(Quote)));
        foreach (var hour in sheet.Hours)
        {
            var row = new List<string>
            {
                hour.Start.ToString("uuuu-MM-ddTHH:mm:ss'Z'", CultureInfo.InvariantCulture),
                hour.LocalStart.ToString("uuuu-MM-ddTHH:mm", CultureInfo.InvariantCulture),
                Number(hour.TreatedM3),
                Number(hour.BypassM3),
            };
            row.AddRange(classes.Select(c => Number(hour.ProductionM3ByClass.GetValueOrDefault(c))));
            row.AddRange(stages.Select(s => hour.UnitsRunning.GetValueOrDefault(s).ToString(CultureInfo.InvariantCulture)));
            row.AddRange(tanks.Select(t => Number(hour.TankEndM3.GetValueOrDefault(t))));
            row.AddRange([Number(hour.OutfallM3), Number(hour.ImportKWh), Number(hour.EngineKWh), Number(hour.ExportKWh)]);
            text.AppendLine(string.Join(',', row));
        }
        return text.ToString();
    }

    private static string Number(double value) => value.ToString("0.###", CultureInfo.InvariantCulture);

    // Ids come from the network file and may hold commas or quotes.
    private static string Quote(string field) =>
        field.IndexOfAny([',', '"', '\n']) >= 0 ? $"\"{field.Replace("\"", "\"\"")}\"" : field;
}
