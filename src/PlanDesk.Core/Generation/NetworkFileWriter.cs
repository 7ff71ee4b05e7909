using System.Globalization;
using System.Text;
using System.Text.Json;
using NodaTime;
using NodaTime.Text;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Generation;

/// <summary>
/// Writes a network in the documented network file format (see docs and networks/quickstart.json), with
/// every series inline. Output depends only on the network: fields in a fixed order, sets sorted, numbers
/// in invariant culture, so the same network always gives the same text.
/// </summary>
public static class NetworkFileWriter
{
    // The quality parameters the format knows, in the order the format lists them.
    private static readonly string[] QualityOrder =
        ["eColiPer100Ml", "bod5MgPerL", "tssMgPerL", "turbidityNtu", "totalNitrogenMgPerL", "conductivityUsPerCm"];

    private static readonly LocalDateTimePattern LocalMinutes = LocalDateTimePattern.CreateWithInvariantCulture("uuuu'-'MM'-'dd'T'HH':'mm");
    private static readonly OffsetPattern OffsetHoursMinutes = OffsetPattern.CreateWithInvariantCulture("+HH:mm");

    /// <summary>The network file text. Pipelines found in <paramref name="heads"/> are written with their static head and
    /// pump efficiency; the others with their energy per m3.</summary>
    public static string Write(Network network, IReadOnlyDictionary<PipelineId, PumpingHead>? heads = null)
    {
        using var stream = new MemoryStream();
        using (var json = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true }))
        {
            new Writer(json, network, heads ?? new Dictionary<PipelineId, PumpingHead>()).Network();
        }
        return Encoding.UTF8.GetString(stream.ToArray()) + "\n";
    }

    /// <summary>Writes <c>network.json</c> into <paramref name="directory"/> (created when missing) and returns its path.</summary>
    public static string WriteToDirectory(GeneratedRegion region, string directory)
    {
        Directory.CreateDirectory(directory);
        var path = Path.Combine(directory, "network.json");
        File.WriteAllText(path, Write(region.Network, region.Heads), new UTF8Encoding(false));
        return path;
    }

    private sealed class Writer(Utf8JsonWriter json, Network network, IReadOnlyDictionary<PipelineId, PumpingHead> heads)
    {
        public void Network()
        {
            json.WriteStartObject();
            json.WriteString("name", network.Name);
            json.WriteString("timeZone", network.TimeZone.Id);
            json.WriteString("currency", network.Currency);
            json.WriteNumber("periodMinutes", network.PeriodMinutes);
            if (network.DefaultStartDate is { } start)
            {
                json.WriteStartObject("horizon");
                json.WriteString("startDate", Date(start));
                json.WriteNumber("days", network.DefaultDays);
                json.WriteEndObject();
            }
            json.WriteStartObject("penalties");
            json.WriteNumber("bypassPerM3", network.Penalties.BypassPerM3);
            json.WriteNumber("permitExcessPerKg", network.Penalties.PermitExcessPerKg);
            json.WriteNumber("outfallExcessPerM3", network.Penalties.OutfallExcessPerM3);
            json.WriteNumber("tankEndDeficitPerM3", network.Penalties.TankEndDeficitPerM3);
            json.WriteNumber("tankLimitPerM3", network.Penalties.TankLimitPerM3);
            json.WriteEndObject();
            json.WriteNumber("carbonPricePerTonne", network.CarbonPricePerTonne);
            Array("qualityClasses", network.Classes, QualityClass);
            Array("tariffs", network.Tariffs, Tariff);
            Array("plants", network.Plants, Plant);
            Array("tanks", network.Tanks, Tank);
            Array("pipelines", network.Pipelines, Pipeline);
            Array("customers", network.Customers, Customer);
            json.WriteEndObject();
        }

        private void QualityClass(QualityClass c)
        {
            json.WriteString("id", c.Id.Value);
            json.WriteString("name", c.Name);
            json.WriteStartObject("quality");
            foreach (var (name, value) in c.Quality.OrderBy(q => QualityRank(q.Key)).ThenBy(q => q.Key, StringComparer.Ordinal))
            {
                json.WriteNumber(name, value);
            }
            json.WriteEndObject();
        }

        private void Tariff(Tariff t)
        {
            json.WriteString("id", t.Id.Value);
            json.WriteString("name", t.Name);
            switch (t.Price)
            {
                case TimeOfUsePrice tou:
                    json.WriteStartObject("timeOfUse");
                    Array("seasons", tou.Seasons, Season);
                    json.WriteEndObject();
                    break;
                case SeriesPrice series:
                    Series("priceSeries", series.PricePerMWh);
                    break;
            }
            Strings("holidays", t.Holidays.Order().Select(Date));
            json.WriteNumber("demandChargePerKwMonth", t.DemandChargePerKwMonth);
            json.WriteNumber("feedInPricePerMWh", t.FeedInPricePerMWh);
            json.WriteNumber("gridEmissionsKgPerMWh", t.GridEmissionsKgPerMWh);
        }

        private void Season(TouSeason s)
        {
            json.WriteString("name", s.Name);
            json.WriteNumber("fromMonth", s.FromMonth);
            json.WriteNumber("toMonth", s.ToMonth);
            json.WriteNumber("defaultPricePerMWh", s.DefaultPricePerMWh);
            Array("windows", s.Windows, w =>
            {
                Strings("dayTypes", w.DayTypes.Order().Select(d => d.ToString().ToLowerInvariant()));
                json.WriteString("from", Time(w.From));
                json.WriteString("to", Time(w.To));
                json.WriteNumber("pricePerMWh", w.PricePerMWh);
            });
        }

        private void Plant(Plant p)
        {
            json.WriteString("id", p.Id.Value);
            json.WriteString("name", p.Name);
            json.WriteString("tariff", p.Tariff.Value);
            Series("influentM3PerHour", p.InfluentM3PerHour);
            json.WriteNumber("secondaryCapacityM3PerHour", p.SecondaryCapacityM3PerHour);
            json.WriteNumber("rawTotalNitrogenMgPerL", p.RawTotalNitrogenMgPerL);
            json.WriteNumber("rawTotalPhosphorusMgPerL", p.RawTotalPhosphorusMgPerL);
            Array("treatmentLevels", p.Levels, l =>
            {
                json.WriteString("id", l.Id.Value);
                json.WriteString("name", l.Name);
                json.WriteNumber("effluentTotalNitrogenMgPerL", l.EffluentTotalNitrogenMgPerL);
                json.WriteNumber("effluentTotalPhosphorusMgPerL", l.EffluentTotalPhosphorusMgPerL);
                json.WriteNumber("aerationEnergyKWhPerM3", l.AerationEnergyKWhPerM3);
                json.WriteNumber("chemicalCostPerM3", l.ChemicalCostPerM3);
            });
            json.WriteString("standardLevel", p.StandardLevel.Value);
            json.WriteNumber("baseLoadKw", p.BaseLoadKw);
            json.WriteNumber("monthToDatePeakKw", p.MonthToDatePeakKw);
            Array("stages", p.Stages, Stage);
            if (p.Biogas is { } gas)
            {
                json.WriteStartObject("biogas");
                Series("productionNm3PerHour", gas.ProductionNm3PerHour);
                json.WriteNumber("lowerHeatingValueKWhPerNm3", gas.LowerHeatingValueKWhPerNm3);
                json.WriteNumber("holderNm3", gas.HolderNm3);
                json.WriteNumber("initialHolderNm3", gas.InitialHolderNm3);
                json.WriteNumber("engineKw", gas.EngineKw);
                json.WriteNumber("engineEfficiency", gas.EngineEfficiency);
                json.WriteEndObject();
            }
            Permit(p.Permit);
        }

        private void Stage(Stage s)
        {
            json.WriteString("id", s.Id.Value);
            json.WriteString("name", s.Name);
            json.WriteString("feed", s.FeedTank?.Value ?? "secondary");
            json.WriteString("tank", s.ProductTank.Value);
            json.WriteString("producesClass", s.ProducesClass.Value);
            json.WriteNumber("recoveryFraction", s.RecoveryFraction);
            json.WriteNumber("nutrientRejectionFraction", s.NutrientRejectionFraction);
            json.WriteNumber("energyKWhPerM3", s.EnergyKWhPerM3);
            json.WriteNumber("chemicalCostPerM3", s.ChemicalCostPerM3);
            json.WriteNumber("units", s.Units);
            json.WriteNumber("unitMinFlowM3PerHour", s.UnitMinFlowM3PerHour);
            json.WriteNumber("unitMaxFlowM3PerHour", s.UnitMaxFlowM3PerHour);
            json.WriteNumber("startupCost", s.StartupCost);
            json.WriteNumber("minRunHours", s.MinRunHours);
            json.WriteNumber("initialUnitsRunning", s.InitialUnitsRunning);
            if (s.AvailableUnits is { } available)
            {
                Series("availableUnits", available);
            }
        }

        private void Permit(Permit p)
        {
            json.WriteStartObject("permit");
            Optional("dailyTotalNitrogenKg", p.DailyTotalNitrogenKg);
            Optional("monthlyTotalNitrogenKg", p.MonthlyTotalNitrogenKg);
            json.WriteNumber("monthToDateTotalNitrogenKg", p.MonthToDateTotalNitrogenKg);
            Optional("dailyTotalPhosphorusKg", p.DailyTotalPhosphorusKg);
            Optional("monthlyTotalPhosphorusKg", p.MonthlyTotalPhosphorusKg);
            json.WriteNumber("monthToDateTotalPhosphorusKg", p.MonthToDateTotalPhosphorusKg);
            Optional("maxTotalNitrogenMgPerL", p.MaxTotalNitrogenMgPerL);
            Optional("maxTotalPhosphorusMgPerL", p.MaxTotalPhosphorusMgPerL);
            Optional("maxOutfallM3PerHour", p.MaxOutfallM3PerHour);
            json.WriteEndObject();
        }

        private void Tank(Tank t)
        {
            json.WriteString("id", t.Id.Value);
            json.WriteString("name", t.Name);
            if (t.Plant is { } plant)
            {
                json.WriteString("plant", plant.Value);
            }
            json.WriteString("class", t.Class.Value);
            json.WriteNumber("minM3", t.MinM3);
            json.WriteNumber("maxM3", t.MaxM3);
            json.WriteNumber("initialM3", t.InitialM3);
            json.WriteNumber("lossFractionPerDay", t.LossFractionPerDay);
        }

        private void Pipeline(Pipeline p)
        {
            json.WriteString("id", p.Id.Value);
            json.WriteString("name", p.Name);
            json.WriteString("from", p.From.Value);
            json.WriteString("to", p.To.ToString());
            json.WriteNumber("capacityM3PerHour", p.CapacityM3PerHour);
            if (heads.TryGetValue(p.Id, out var head))
            {
                json.WriteStartObject("pumping");
                json.WriteNumber("staticHeadM", head.StaticHeadM);
                json.WriteNumber("pumpEfficiency", head.PumpEfficiency);
                json.WriteEndObject();
            }
            else
            {
                json.WriteNumber("energyKWhPerM3", p.EnergyKWhPerM3);
            }
            json.WriteString("poweredBy", p.PoweredBy.Value);
            if (p.Pumps is { } pumps)
            {
                json.WriteStartObject("pumps");
                json.WriteNumber("count", pumps.Count);
                json.WriteNumber("minFlowM3PerHour", pumps.MinFlowM3PerHour);
                json.WriteNumber("maxFlowM3PerHour", pumps.MaxFlowM3PerHour);
                json.WriteEndObject();
            }
        }

        private void Customer(Customer c)
        {
            json.WriteString("id", c.Id.Value);
            json.WriteString("name", c.Name);
            json.WriteString("kind", c.Kind);
            json.WriteString("class", c.Class.Value);
            switch (c.Demand)
            {
                case HourlyDemand hourly:
                    Series("demandM3PerHour", hourly.M3PerHour);
                    break;
                case DailyDemand daily:
                    json.WriteStartObject("dailyVolume");
                    json.WriteNumber("volumeM3", daily.VolumeM3PerDay);
                    json.WriteString("from", Time(daily.From));
                    json.WriteString("to", Time(daily.To));
                    Optional("maxM3PerHour", daily.MaxM3PerHour);
                    json.WriteEndObject();
                    break;
            }
            json.WriteNumber("shortfallPenaltyPerM3", c.ShortfallPenaltyPerM3);
            json.WriteNumber("priority", c.Priority);
            if (c.Blend is { } blend)
            {
                json.WriteStartObject("blendLimit");
                json.WriteString("parameter", blend.Parameter);
                json.WriteNumber("max", blend.Max);
                json.WriteEndObject();
            }
        }

        private void Series(string name, Series series)
        {
            switch (series)
            {
                case ConstantSeries constant:
                    json.WriteNumber(name, constant.Value);
                    break;
                case StepSeries step:
                    var zoned = step.Start.InZone(network.TimeZone);
                    json.WriteStartObject(name);
                    json.WriteString("start", LocalMinutes.Format(zoned.LocalDateTime) + OffsetHoursMinutes.Format(zoned.Offset));
                    json.WriteNumber("stepMinutes", (long)step.Step.TotalMinutes);
                    json.WritePropertyName("values");
                    // One line per series keeps a week of hourly values readable.
                    json.WriteRawValue("[" + string.Join(", ", step.Values.Select(v => v.ToString("R", CultureInfo.InvariantCulture))) + "]");
                    json.WriteEndObject();
                    break;
                default:
                    throw new InvalidOperationException($"cannot write a series of kind {series.GetType().Name}");
            }
        }

        private void Array<T>(string name, IEnumerable<T> items, Action<T> writeFields)
        {
            json.WriteStartArray(name);
            foreach (var item in items)
            {
                json.WriteStartObject();
                writeFields(item);
                json.WriteEndObject();
            }
            json.WriteEndArray();
        }

        // Short lists of words stay on one line.
        private void Strings(string name, IEnumerable<string> values)
        {
            json.WritePropertyName(name);
            json.WriteRawValue("[" + string.Join(", ", values.Select(v => JsonSerializer.Serialize(v))) + "]");
        }

        private void Optional(string name, double? value)
        {
            if (value is { } v)
            {
                json.WriteNumber(name, v);
            }
        }

        private static int QualityRank(string parameter)
        {
            var index = System.Array.IndexOf(QualityOrder, parameter);
            return index < 0 ? QualityOrder.Length : index;
        }

        private static string Date(LocalDate date) => LocalDatePattern.Iso.Format(date);

        private static string Time(LocalTime time) => LocalTimePattern.CreateWithInvariantCulture("HH':'mm").Format(time);
    }
}
