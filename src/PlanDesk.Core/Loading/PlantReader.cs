using PlanDesk.Core.Model;

namespace PlanDesk.Core.Loading;

/// <summary>Reads a plant with its treatment levels, polishing stages, biogas and permit.</summary>
internal static class PlantReader
{
    public static Plant Read(Node plant, LoadContext context)
    {
        var id = plant.Text("id");
        context.Ids.Resolve(context, plant.Text("tariff"), plant.PathOf("tariff"), IdKind.Tariff);
        var levels = ReadLevels(plant, context);
        var standard = plant.Text("standardLevel");
        if (standard.Length > 0 && levels.Count > 0 && !levels.Any(l => l.Id.Value == standard))
        {
            var ids = levels.Select(l => l.Id.Value).ToList();
            context.Add(plant.PathOf("standardLevel"), $"'{standard}' is not one of this plant's treatment levels",
                $"{Suggest.DidYouMean(standard, ids)}give one of: {Suggest.List(ids)}");
        }
        return new Plant
        {
            Id = new PlantId(id),
            Name = plant.Text("name"),
            Tariff = new TariffId(plant.Text("tariff")),
            InfluentM3PerHour = SeriesReader.Read(plant.Field("influentM3PerHour"), context, ValueRule.NonNegative("an influent in m3/h"))
                ?? Series.Constant(double.NaN),
            SecondaryCapacityM3PerHour = plant.Number("secondaryCapacityM3PerHour"),
            RawTotalNitrogenMgPerL = plant.Number("rawTotalNitrogenMgPerL"),
            RawTotalPhosphorusMgPerL = plant.Number("rawTotalPhosphorusMgPerL"),
            Levels = levels,
            StandardLevel = new LevelId(standard),
            Stages = plant.Items("stages").Select(s => ReadStage(s, id, context)).ToList(),
            BaseLoadKw = plant.Number("baseLoadKw"),
            Biogas = plant.Field("biogas") is { IsObject: true } biogas ? ReadBiogas(biogas, context) : null,
            Permit = ReadPermit(plant.Field("permit")),
            MonthToDatePeakKw = plant.NumberOr("monthToDatePeakKw", 0),
        };
    }

    private static List<TreatmentLevel> ReadLevels(Node plant, LoadContext context)
    {
        var levels = new List<TreatmentLevel>();
        var seen = new Dictionary<string, string>();
        foreach (var level in plant.Items("treatmentLevels"))
        {
            var id = level.Text("id");
            if (id.Length > 0 && !seen.TryAdd(id, level.Path))
            {
                context.Add(level.PathOf("id"), $"'{id}' is already the id of the treatment level at {seen[id]}", "give each treatment level of a plant its own id");
            }
            levels.Add(new TreatmentLevel(
                new LevelId(id),
                level.Text("name"),
                level.Number("effluentTotalNitrogenMgPerL"),
                level.Number("effluentTotalPhosphorusMgPerL"),
                level.Number("aerationEnergyKWhPerM3"),
                level.Number("chemicalCostPerM3")));
        }
        return levels;
    }

    private static Stage ReadStage(Node stage, string plantId, LoadContext context)
    {
        var feed = stage.Text("feed");
        var tank = stage.Text("tank");
        var produces = stage.Text("producesClass");
        if (feed != "secondary" && context.Ids.Resolve(context, feed, stage.PathOf("feed"), IdKind.Tank) && feed == tank)
        {
            context.Add(stage.PathOf("feed"), $"the stage feeds from its own product tank '{tank}'", "feed it from \"secondary\" or from another tank");
        }
        context.Ids.Resolve(context, produces, stage.PathOf("producesClass"), IdKind.QualityClass);
        if (context.Ids.Resolve(context, tank, stage.PathOf("tank"), IdKind.Tank) && context.Catalog.Tank(tank) is { } product)
        {
            if (!context.Catalog.Serves(produces, product.Class))
            {
                context.Add(stage.PathOf("tank"), $"tank '{tank}' holds class {product.Class} but the stage produces class {produces}, which is worse",
                    $"put the product in a tank of class {produces} or a worse class, or change producesClass");
            }
            if (product.Plant is { } owner && owner != plantId && plantId.Length > 0)
            {
                context.Add(stage.PathOf("tank"), $"tank '{tank}' stands at plant '{owner}', not at this plant '{plantId}'",
                    "put the product in a tank of this plant or in a regional reservoir (a tank without plant)");
            }
        }
        var units = stage.Int("units", 0);
        var minFlow = stage.Number("unitMinFlowM3PerHour");
        var maxFlow = stage.Number("unitMaxFlowM3PerHour");
        NetworkReader.CheckOrder(context, stage.PathOf("unitMinFlowM3PerHour"), "unitMinFlowM3PerHour", minFlow, "unitMaxFlowM3PerHour", maxFlow);
        var initialRunning = stage.Int("initialUnitsRunning", 0);
        if (units >= 1 && initialRunning > units)
        {
            context.Add(stage.PathOf("initialUnitsRunning"), $"{initialRunning} units running but the stage has only {units}",
                $"give a number from 0 to {units}");
        }
        return new Stage
        {
            Id = new StageId(stage.Text("id")),
            Name = stage.Text("name"),
            Plant = new PlantId(plantId),
            FeedTank = feed == "secondary" ? null : new TankId(feed),
            ProductTank = new TankId(tank),
            ProducesClass = new ClassId(produces),
            RecoveryFraction = stage.Number("recoveryFraction"),
            NutrientRejectionFraction = stage.NumberOr("nutrientRejectionFraction", 0),
            EnergyKWhPerM3 = stage.Number("energyKWhPerM3"),
            ChemicalCostPerM3 = stage.NumberOr("chemicalCostPerM3", 0),
            Units = units,
            UnitMinFlowM3PerHour = minFlow,
            UnitMaxFlowM3PerHour = maxFlow,
            StartupCost = stage.NumberOr("startupCost", 0),
            MinRunHours = stage.NumberOr("minRunHours", 0),
            InitialUnitsRunning = initialRunning,
            AvailableUnits = units >= 1 ? SeriesReader.Read(stage.Field("availableUnits"), context, ValueRule.UnitCount(units)) : null,
        };
    }

    private static Biogas ReadBiogas(Node biogas, LoadContext context)
    {
        var holder = biogas.Number("holderNm3");
        var initial = biogas.Number("initialHolderNm3");
        NetworkReader.CheckOrder(context, biogas.PathOf("initialHolderNm3"), "initialHolderNm3", initial, "holderNm3", holder);
        return new Biogas(
            SeriesReader.Read(biogas.Field("productionNm3PerHour"), context, ValueRule.NonNegative("a gas production in Nm3/h")) ?? Series.Constant(double.NaN),
            biogas.Number("lowerHeatingValueKWhPerNm3"),
            holder,
            initial,
            biogas.Number("engineKw"),
            biogas.Number("engineEfficiency"));
    }

    private static Permit ReadPermit(Node? node)
    {
        if (node is not { } permit)
        {
            return new Permit();
        }
        return new Permit
        {
            DailyTotalNitrogenKg = permit.OptionalNumber("dailyTotalNitrogenKg"),
            MonthlyTotalNitrogenKg = permit.OptionalNumber("monthlyTotalNitrogenKg"),
            MonthToDateTotalNitrogenKg = permit.NumberOr("monthToDateTotalNitrogenKg", 0),
            DailyTotalPhosphorusKg = permit.OptionalNumber("dailyTotalPhosphorusKg"),
            MonthlyTotalPhosphorusKg = permit.OptionalNumber("monthlyTotalPhosphorusKg"),
            MonthToDateTotalPhosphorusKg = permit.NumberOr("monthToDateTotalPhosphorusKg", 0),
            MaxTotalNitrogenMgPerL = permit.OptionalNumber("maxTotalNitrogenMgPerL"),
            MaxTotalPhosphorusMgPerL = permit.OptionalNumber("maxTotalPhosphorusMgPerL"),
            MaxOutfallM3PerHour = permit.OptionalNumber("maxOutfallM3PerHour"),
        };
    }
}
