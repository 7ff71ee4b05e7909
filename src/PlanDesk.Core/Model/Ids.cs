namespace PlanDesk.Core.Model;

/// <summary>Identifier of a plant, as written in the network file.</summary>
public readonly record struct PlantId(string Value)
{
    public override string ToString() => Value;
}

/// <summary>Identifier of a polishing stage (filtration, disinfection, membrane ...).</summary>
public readonly record struct StageId(string Value)
{
    public override string ToString() => Value;
}

/// <summary>Identifier of a tank or reservoir.</summary>
public readonly record struct TankId(string Value)
{
    public override string ToString() => Value;
}

/// <summary>Identifier of a pipeline.</summary>
public readonly record struct PipelineId(string Value)
{
    public override string ToString() => Value;
}

/// <summary>Identifier of a reclaimed-water customer.</summary>
public readonly record struct CustomerId(string Value)
{
    public override string ToString() => Value;
}

/// <summary>Identifier of an electricity tariff.</summary>
public readonly record struct TariffId(string Value)
{
    public override string ToString() => Value;
}

/// <summary>Identifier of a reclaimed-water quality class.</summary>
public readonly record struct ClassId(string Value)
{
    public override string ToString() => Value;
}

/// <summary>Identifier of a treatment level of a plant's secondary stage.</summary>
public readonly record struct LevelId(string Value)
{
    public override string ToString() => Value;
}
