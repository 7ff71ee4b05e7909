namespace PlanDesk.Core.Generation;

/// <summary>The polishing stages a generated plant has.</summary>
internal enum StageSet
{
    /// <summary>Filtration with UV to class A.</summary>
    Filtration,
    /// <summary>Filtration with UV to class A and a membrane train to class R.</summary>
    FiltrationWithMembrane,
    /// <summary>Disinfection only, to class B.</summary>
    Disinfection,
    /// <summary>A membrane train to class R and disinfection to class C.</summary>
    MembraneAndDisinfection,
    /// <summary>Filtration with UV to class A and disinfection to class B.</summary>
    FiltrationAndDisinfection,
}
