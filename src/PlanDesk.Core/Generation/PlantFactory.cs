using NodaTime;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Generation;

/// <summary>Draws one treatment plant: size, influent with a storm, treatment levels, stages, biogas, permit.</summary>
internal static class PlantFactory
{
    // 180 L per PE per day — Gujer, Siedlungswasserwirtschaft [pub], see REFERENCES.md.
    private const double LitresPerPePerDay = 180;
    // Digester gas, about 28 L per capita per day [pub]; drawn a little either side.
    private const double GasNm3PerPePerDayMin = 0.022;
    private const double GasNm3PerPePerDayMax = 0.030;

    public static PlantDraft Create(SeededRandom random, PlaceNames names, StageSet set, TariffId tariff, HourGrid hours,
        int horizonHours, LocalDate stormDate)
    {
        var place = names.Next();
        var id = new PlantId(PlaceNames.Slug(place));
        var name = $"{place} treatment plant";
        var site = new Site(random.Uniform(0, 40, 1), random.Uniform(0, 30, 1), random.Uniform(5, 120, 0));
        var populationEquivalent = SeededRandom.RoundTo(random.LogUniform(20_000, 400_000), 1000);
        var averageM3PerHour = populationEquivalent * LitresPerPePerDay / 1000 / 24;
        // Large catchments smooth the daily wave: full shape at 20 000 PE, two thirds of it at 400 000.
        var damping = 1 - 0.35 * Math.Log(populationEquivalent / 20_000) / Math.Log(20);
        var influent = Profiles.Influent(random, hours.Local, averageM3PerHour, damping, stormDate, random.Uniform(0.8, 1.5));

        // Directive 91/271/EEC Annex I Table 2: TN 10 / TP 1 mg/L above 100 000 PE, else TN 15 / TP 2 [pub].
        var large = populationEquivalent > 100_000;
        var maxNitrogen = large ? 10.0 : 15.0;
        var maxPhosphorus = large ? 1.0 : 2.0;
        var levels = Levels(random, maxNitrogen, maxPhosphorus);
        var standard = levels[0];

        var reuseFeed = averageM3PerHour * random.Uniform(0.25, 0.55);
        var (stages, tanks) = StageFactory.Create(random, id, place, site, set, reuseFeed, hours, horizonHours);

        var baseLoadKw = SeededRandom.Round(populationEquivalent * random.Uniform(0.0010, 0.0016), 0);
        var biogas = populationEquivalent >= 50_000 && random.Chance(0.85) ? Biogas(random, populationEquivalent) : null;
        var estimatedPeakKw = baseLoadKw + standard.AerationEnergyKWhPerM3 * averageM3PerHour * 1.3
            + stages.Sum(s => s.EnergyKWhPerM3 * s.Units * s.UnitMaxFlowM3PerHour * 0.6);
        var plant = new Plant
        {
            Id = id,
            Name = name,
            Tariff = tariff,
            InfluentM3PerHour = hours.Series(influent),
            SecondaryCapacityM3PerHour = SeededRandom.RoundTo(averageM3PerHour * random.Uniform(2.2, 2.7), 10),
            RawTotalNitrogenMgPerL = random.Uniform(50, 70, 0),
            RawTotalPhosphorusMgPerL = random.Uniform(7, 11, 1),
            Levels = levels,
            StandardLevel = standard.Id,
            Stages = stages,
            BaseLoadKw = baseLoadKw,
            Biogas = biogas,
            Permit = Permit(random, hours.StartDate, averageM3PerHour, standard, maxNitrogen, maxPhosphorus),
            // Early in a billing month little peak has been set yet.
            MonthToDatePeakKw = hours.StartDate.Day == 1 ? 0 : SeededRandom.Round(estimatedPeakKw * random.Uniform(0.75, 0.95), 0),
        };
        return new PlantDraft { Plant = plant, Site = site, Tanks = tanks };
    }

    // Standard first; tighter nitrogen removal costs aeration and external carbon; some plants may relax.
    // Secondary treatment uses about half of a plant's 0.3-0.6 kWh/m3 for aeration [pub, see REFERENCES.md].
    private static List<TreatmentLevel> Levels(SeededRandom random, double maxNitrogen, double maxPhosphorus)
    {
        var aeration = random.Uniform(0.16, 0.26);
        var chemicals = random.Uniform(0.004, 0.012);
        var nitrogen = maxNitrogen * random.Uniform(0.7, 0.85);
        var levels = new List<TreatmentLevel>
        {
            new(new LevelId("standard"), "Standard nitrification-denitrification", SeededRandom.Round(nitrogen, 1),
                SeededRandom.Round(maxPhosphorus * 0.7, 2), SeededRandom.Round(aeration, 3), SeededRandom.Round(chemicals, 3)),
            new(new LevelId("tight"), "Tight nitrogen removal with external carbon", SeededRandom.Round(nitrogen * random.Uniform(0.6, 0.7), 1),
                SeededRandom.Round(maxPhosphorus * 0.5, 2), SeededRandom.Round(aeration * random.Uniform(1.2, 1.35), 3),
                SeededRandom.Round(chemicals + random.Uniform(0.01, 0.02), 3)),
        };
        if (random.Chance(0.5))
        {
            levels.Add(new(new LevelId("eco"), "Reduced aeration", SeededRandom.Round(maxNitrogen * random.Uniform(0.92, 0.98), 1),
                SeededRandom.Round(maxPhosphorus * 0.95, 2), SeededRandom.Round(aeration * random.Uniform(0.85, 0.92), 3),
                SeededRandom.Round(chemicals * 0.7, 3)));
        }
        return levels;
    }

    private static Biogas Biogas(SeededRandom random, double populationEquivalent)
    {
        var productionNm3PerHour = SeededRandom.Round(populationEquivalent * random.Uniform(GasNm3PerPePerDayMin, GasNm3PerPePerDayMax) / 24, 0);
        // Biogas at 60 % methane: 21.5 MJ/Nm3 ≈ 6.0 kWh/Nm3 [pub]; engine efficiency 30-42 % [mem].
        var heatingValue = random.Uniform(5.8, 6.2, 1);
        var efficiency = random.Uniform(0.34, 0.40, 2);
        var holder = SeededRandom.RoundTo(productionNm3PerHour * random.Uniform(6, 12), 10);
        // An engine larger than the steady gas flow needs lets the holder shift generation into dear hours.
        var engineKw = SeededRandom.RoundTo(productionNm3PerHour * heatingValue * efficiency * random.Uniform(1.3, 1.8), 10);
        return new Biogas(new ConstantSeries(productionNm3PerHour), heatingValue, holder,
            SeededRandom.RoundTo(holder * random.Uniform(0.3, 0.6), 10), engineKw, efficiency);
    }

    // Daily caps sit near what the standard level discharges on a dry day, so storms and wet days make the
    // planner choose between tighter treatment, more reuse and the permit.
    private static Permit Permit(SeededRandom random, LocalDate startDate, double averageM3PerHour, TreatmentLevel standard,
        double maxNitrogen, double maxPhosphorus)
    {
        var dryDayM3 = averageM3PerHour * 24;
        var dailyNitrogen = SeededRandom.Round(dryDayM3 * standard.EffluentTotalNitrogenMgPerL / 1000 * random.Uniform(1.0, 1.2), 0);
        var dailyPhosphorus = SeededRandom.Round(dryDayM3 * standard.EffluentTotalPhosphorusMgPerL / 1000 * random.Uniform(1.05, 1.3), 1);
        var daysBefore = startDate.Day - 1;
        var monthlyPhosphorus = random.Chance(0.5);
        return new Permit
        {
            DailyTotalNitrogenKg = dailyNitrogen,
            MonthlyTotalNitrogenKg = SeededRandom.Round(dailyNitrogen * 30 * random.Uniform(0.85, 0.95), 0),
            MonthToDateTotalNitrogenKg = SeededRandom.Round(dailyNitrogen * daysBefore * random.Uniform(0.7, 0.85), 0),
            DailyTotalPhosphorusKg = dailyPhosphorus,
            MonthlyTotalPhosphorusKg = monthlyPhosphorus ? SeededRandom.Round(dailyPhosphorus * 30 * random.Uniform(0.85, 0.95), 0) : null,
            MonthToDateTotalPhosphorusKg = monthlyPhosphorus ? SeededRandom.Round(dailyPhosphorus * daysBefore * random.Uniform(0.7, 0.85), 0) : 0,
            MaxTotalNitrogenMgPerL = maxNitrogen,
            MaxTotalPhosphorusMgPerL = maxPhosphorus,
            MaxOutfallM3PerHour = random.Chance(0.4) ? SeededRandom.RoundTo(averageM3PerHour * random.Uniform(2.6, 3.0), 10) : null,
        };
    }
}
