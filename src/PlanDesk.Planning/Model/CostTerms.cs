using Google.OrTools.LinearSolver;
using PlanDesk.Core.Plans;

namespace PlanDesk.Planning.Model;

/// <summary>The parts of the objective, kept apart so the plan can show its cost by component.</summary>
internal enum CostComponent
{
    EnergyImport,
    /// <summary>Entered with a negative sign: feed-in revenue lowers the objective.</summary>
    EnergyExportCredit,
    DemandCharge,
    UnitStarts,
    Chemicals,
    Carbon,
    ShortfallPenalty,
    BypassPenalty,
    PermitPenalty,
    OutfallPenalty,
    TankEndPenalty,
    TankLimitPenalty,
}

/// <summary>
/// Objective terms by component. OR-Tools' <c>Objective.SetCoefficient</c> overwrites, so terms are summed
/// here first and written once; the same terms evaluate each component of the solved plan.
/// </summary>
internal sealed class CostTerms
{
    private readonly Dictionary<CostComponent, Dictionary<Variable, double>> terms = [];
    private readonly Dictionary<CostComponent, double> constants = [];

    public void Add(CostComponent component, Variable variable, double coefficient)
    {
        if (coefficient == 0)
        {
            return;
        }
        if (!terms.TryGetValue(component, out var byVariable))
        {
            byVariable = new Dictionary<Variable, double>(ReferenceEqualityComparer.Instance);
            terms[component] = byVariable;
        }
        byVariable[variable] = byVariable.GetValueOrDefault(variable) + coefficient;
    }

    public void AddConstant(CostComponent component, double amount) =>
        constants[component] = constants.GetValueOrDefault(component) + amount;

    /// <summary>Writes the summed terms as a minimisation objective.</summary>
    public void ApplyTo(Objective objective)
    {
        var total = new Dictionary<Variable, double>(ReferenceEqualityComparer.Instance);
        foreach (var (variable, coefficient) in terms.Values.SelectMany(byVariable => byVariable))
        {
            total[variable] = total.GetValueOrDefault(variable) + coefficient;
        }
        foreach (var (variable, coefficient) in total)
        {
            objective.SetCoefficient(variable, coefficient);
        }
        objective.SetOffset(constants.Values.Sum());
        objective.SetMinimization();
    }

    /// <summary>Value of one component in the solved model, as it enters the objective.</summary>
    public double Value(CostComponent component)
    {
        var sum = constants.GetValueOrDefault(component);
        if (terms.TryGetValue(component, out var byVariable))
        {
            sum += byVariable.Sum(term => term.Value * term.Key.SolutionValue());
        }
        return sum;
    }

    public CostBreakdown ToBreakdown() => new()
    {
        EnergyImport = Value(CostComponent.EnergyImport),
        EnergyExportCredit = 0.0 - Value(CostComponent.EnergyExportCredit), // 0.0 − x: never "-0"
        DemandCharge = Value(CostComponent.DemandCharge),
        UnitStarts = Value(CostComponent.UnitStarts),
        Chemicals = Value(CostComponent.Chemicals),
        Carbon = Value(CostComponent.Carbon),
        ShortfallPenalty = Value(CostComponent.ShortfallPenalty),
        BypassPenalty = Value(CostComponent.BypassPenalty),
        PermitPenalty = Value(CostComponent.PermitPenalty),
        OutfallPenalty = Value(CostComponent.OutfallPenalty),
        TankEndPenalty = Value(CostComponent.TankEndPenalty),
        TankLimitPenalty = Value(CostComponent.TankLimitPenalty),
    };
}
