using System.Globalization;
using Google.OrTools.LinearSolver;
using PlanDesk.Core.Model;

namespace PlanDesk.Planning.Model;

/// <summary>How integer decisions enter a model: as integers (the MILP), relaxed to continuous (for a lower
/// bound), or fixed to given values (the LP whose duals explain a solved plan).</summary>
internal enum IntegerMode
{
    Integer,
    Relaxed,
    Fixed,
}

/// <summary>How each integer decision (by its local day and variable name) enters a model; fixed ones take their value by name.</summary>
internal sealed record IntegerRule(Func<int, string, IntegerMode> ModeOf, IReadOnlyDictionary<string, double>? FixedValues = null)
{
    public static IntegerRule Everywhere(IntegerMode mode, IReadOnlyDictionary<string, double>? fixedValues = null) => new((_, _) => mode, fixedValues);
}

/// <summary>
/// The whole plan as one MILP on an OR-Tools solver. Each constraint family lives in its own file and method
/// (treatment, stages, storage, customers, permits, energy); variables are keyed by network ids and period
/// or day index, and named <c>family[key,...]</c> with periods as <c>t17</c> and days as dates, so an exported
/// LP file reads like the network.
/// </summary>
internal sealed partial class PlanModel
{
    private readonly IntegerRule integerRule;

    private PlanModel(Solver solver, PlanningCase planningCase, IntegerRule integerRule)
    {
        Solver = solver;
        Case = planningCase;
        this.integerRule = integerRule;
    }

    public Solver Solver { get; }
    public PlanningCase Case { get; }
    public CostTerms Costs { get; } = new();
    /// <summary>Things the model had to decide about the data (e.g. no level meets a limit), in plain words.</summary>
    public List<string> Notes { get; } = [];
    /// <summary>Integer variables as built, with their local day (also listed when relaxed or fixed, for the model size).</summary>
    public List<(Variable Variable, int Day)> IntegerDecisions { get; } = [];
    public IEnumerable<Variable> IntegerVariables => IntegerDecisions.Select(d => d.Variable);

    private Network Network => Case.Network;
    private Horizon Horizon => Case.Horizon;
    private Penalties Penalties => Network.Penalties;
    private int PeriodCount => Case.PeriodCount;
    private double PeriodHours => Case.PeriodHours;

    /// <summary>Builds every family into <paramref name="solver"/>. With <see cref="IntegerMode.Fixed"/>,
    /// <paramref name="fixedIntegers"/> gives each integer variable's value by name.</summary>
    public static PlanModel Build(Solver solver, PlanningCase planningCase, IntegerMode integerMode, IReadOnlyDictionary<string, double>? fixedIntegers = null) =>
        Build(solver, planningCase, IntegerRule.Everywhere(integerMode, fixedIntegers));

    /// <summary>Builds every family, treating each day's integer decisions as <paramref name="integerRule"/> says.</summary>
    public static PlanModel Build(Solver solver, PlanningCase planningCase, IntegerRule integerRule)
    {
        var model = new PlanModel(solver, planningCase, integerRule);
        model.AddTreatmentLevels();
        model.AddSecondaryBalance();
        model.AddStageUnits();
        model.AddSecondaryEffluentSplit();
        model.AddPipelines();
        model.AddTankBalances();
        model.AddCustomerBalances();
        model.AddBlendLimits();
        model.AddOutfallFlowLimits();
        model.AddPermitLoadCaps();
        model.AddEnergyBalances();
        model.AddPeakDemand();
        model.Costs.ApplyTo(solver.Objective());
        return model;
    }

    /// <summary>The value of every integer variable by name (of one day when given), rounded: what <see cref="IntegerMode.Fixed"/> takes.</summary>
    public Dictionary<string, double> IntegerValues(int? day = null) =>
        IntegerDecisions.Where(d => day is null || d.Day == day)
            .ToDictionary(d => d.Variable.Name(), d => Math.Round(d.Variable.SolutionValue()));

    internal static string Name(string family, params object[] keys) =>
        $"{family}[{string.Join(",", keys.Select(k => Convert.ToString(k, CultureInfo.InvariantCulture)))}]";

    private static string P(int period) => $"t{period}";

    private string DayLabel(int day) => DateLabel(Horizon.Days[day]);

    private static string DateLabel(PlanDay day) => day.Date.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);

    /// <summary>Name of y[p,d,m], the level decision, as the model builds it (for values given by name).</summary>
    public static string LevelName(PlantId plant, PlanDay day, LevelId level) => Name(LevelFamily, plant, DateLabel(day), level);

    /// <summary>Name of n[s,t], the units running, as the model builds it.</summary>
    public static string UnitsName(StageId stage, int period) => Name(UnitsFamily, stage, P(period));

    /// <summary>Name of the pumps running on a pipeline in a period, as the model builds it.</summary>
    public static string PumpsName(PipelineId pipeline, int period) => Name(PumpsFamily, pipeline, P(period));

    private const string UnitsFamily = "units";
    private const string PumpsFamily = "pumps";

    private Variable NumVar(double lowerBound, double upperBound, string name) => Solver.MakeNumVar(lowerBound, upperBound, name);

    private Variable IntVar(double lowerBound, double upperBound, string name, int day)
    {
        Variable variable;
        var fixedIntegers = integerRule.FixedValues;
        switch (integerRule.ModeOf(day, name))
        {
            case IntegerMode.Integer:
                variable = Solver.MakeIntVar(lowerBound, upperBound, name);
                break;
            case IntegerMode.Relaxed:
                variable = Solver.MakeNumVar(lowerBound, upperBound, name);
                break;
            default:
                var value = fixedIntegers is not null && fixedIntegers.TryGetValue(name, out var given) ? given : lowerBound;
                value = Math.Clamp(value, lowerBound, upperBound);
                variable = Solver.MakeNumVar(value, value, name);
                break;
        }
        IntegerDecisions.Add((variable, day));
        return variable;
    }

    private Constraint Row(double lowerBound, double upperBound, string name) => Solver.MakeConstraint(lowerBound, upperBound, name);

    private Constraint EqualRow(double value, string name) => Solver.MakeConstraint(value, value, name);

    private Constraint AtMostRow(double upperBound, string name) => Solver.MakeConstraint(double.NegativeInfinity, upperBound, name);

    private Constraint AtLeastRow(double lowerBound, string name) => Solver.MakeConstraint(lowerBound, double.PositiveInfinity, name);
}

internal static class ConstraintExtensions
{
    /// <summary>Adds to a coefficient instead of overwriting it (a variable may enter a row twice).</summary>
    public static Constraint Add(this Constraint row, Variable variable, double coefficient)
    {
        row.SetCoefficient(variable, row.GetCoefficient(variable) + coefficient);
        return row;
    }
}
