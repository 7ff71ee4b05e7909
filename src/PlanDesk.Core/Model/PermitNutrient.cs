namespace PlanDesk.Core.Model;

/// <summary>A nutrient a plant's permit caps, with what the plan needs to compute its load.</summary>
/// <param name="Key">"tn" or "tp", used in model and file names.</param>
/// <param name="Label">"total N" or "total P", used in messages.</param>
/// <param name="EffluentMgPerL">Concentration of the secondary effluent at a treatment level, mg/L.</param>
/// <param name="RawMgPerL">Concentration of raw sewage (bypassed influent), mg/L.</param>
public sealed record PermitNutrient(string Key, string Label, Func<TreatmentLevel, double> EffluentMgPerL, double RawMgPerL,
    double? DailyCapKg, double? MonthlyCapKg, double MonthToDateKg)
{
    public static IReadOnlyList<PermitNutrient> Of(Plant plant) =>
    [
        new("tn", "total N", l => l.EffluentTotalNitrogenMgPerL, plant.RawTotalNitrogenMgPerL,
            plant.Permit.DailyTotalNitrogenKg, plant.Permit.MonthlyTotalNitrogenKg, plant.Permit.MonthToDateTotalNitrogenKg),
        new("tp", "total P", l => l.EffluentTotalPhosphorusMgPerL, plant.RawTotalPhosphorusMgPerL,
            plant.Permit.DailyTotalPhosphorusKg, plant.Permit.MonthlyTotalPhosphorusKg, plant.Permit.MonthToDateTotalPhosphorusKg),
    ];

    public bool Capped => DailyCapKg.HasValue || MonthlyCapKg.HasValue;

    /// <summary>Stages whose reject carries nutrients of the plant's secondary effluent to the outfall: those with a
    /// non-zero rejection fraction fed from the secondary or from a tank at the plant (water the plant's own stages
    /// made, so of the plant's effluent concentration).</summary>
    public static IEnumerable<Stage> RejectingStages(Network network, Plant plant) =>
        plant.Stages.Where(s => s.NutrientRejectionFraction > 0 &&
                                (s.FeedTank is null || network.Tank(s.FeedTank.Value).Plant == plant.Id));
}
