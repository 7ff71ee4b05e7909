using PlanDesk.Core.Model;

namespace PlanDesk.Core.Checking;

/// <summary>Pipeline capacity, discrete pumps and the class rule.</summary>
internal static class PipelineChecks
{
    public static void Check(Findings findings, PlanIndex index)
    {
        foreach (var pipeline in findings.Case.Network.Pipelines)
        {
            CheckCapacity(findings, index, pipeline);
            if (pipeline.Pumps is { } pumps)
            {
                CheckPumps(findings, index, pipeline, pumps);
            }
            CheckClassRule(findings, index, pipeline);
        }
    }

    private static void CheckCapacity(Findings findings, PlanIndex index, Pipeline pipeline)
    {
        var flow = index.Pipelines[pipeline.Id].FlowM3;
        var where = pipeline.Id.Value;
        var capacityM3 = pipeline.CapacityM3PerHour * findings.Case.PeriodHours;
        findings.NonNegative(where, "flow", flow, "m3");
        for (var t = 0; t < flow.Length; t++)
        {
            if (findings.Tolerances.Above(flow[t], capacityM3))
            {
                findings.AtPeriod(ViolationKind.PipelineCapacity, where, t, flow[t] - capacityM3, "m3", capacityM3,
                    $"pipeline {where} carries {Findings.Q(flow[t])} m3, above its capacity of {Findings.Q(capacityM3)} m3 in the period");
            }
        }
    }

    private static void CheckPumps(Findings findings, PlanIndex index, Pipeline pipeline, PumpSet pumps)
    {
        var plan = index.Pipelines[pipeline.Id];
        var where = pipeline.Id.Value;
        var hours = findings.Case.PeriodHours;
        for (var t = 0; t < plan.FlowM3.Length; t++)
        {
            var n = plan.PumpsRunning![t];
            if (n < 0 || n > pumps.Count)
            {
                var limit = n < 0 ? 0 : pumps.Count;
                findings.AtPeriod(ViolationKind.PumpCount, where, t, Math.Abs(n - limit), "pumps", limit,
                    $"pipeline {where} runs {n} pumps but has {pumps.Count}");
            }
            var least = n * pumps.MinFlowM3PerHour * hours;
            var most = n * pumps.MaxFlowM3PerHour * hours;
            if (findings.Tolerances.Below(plan.FlowM3[t], least) || findings.Tolerances.Above(plan.FlowM3[t], most))
            {
                var below = plan.FlowM3[t] < least;
                findings.AtPeriod(ViolationKind.PumpFlow, where, t, below ? least - plan.FlowM3[t] : plan.FlowM3[t] - most, "m3", below ? least : most,
                    $"pipeline {where} carries {Findings.Q(plan.FlowM3[t])} m3 with {n} pumps on, outside their range of " +
                    $"{Findings.Q(least)} to {Findings.Q(most)} m3");
            }
        }
    }

    private static void CheckClassRule(Findings findings, PlanIndex index, Pipeline pipeline)
    {
        var network = findings.Case.Network;
        var supplied = network.Tank(pipeline.From).Class;
        var required = pipeline.To.Tank is { } tank ? network.Tank(tank).Class : network.Customer(pipeline.To.Customer!.Value).Class;
        if (network.Serves(supplied, required))
        {
            return;
        }
        var flow = index.Pipelines[pipeline.Id].FlowM3;
        for (var t = 0; t < flow.Length; t++)
        {
            if (findings.Tolerances.Above(flow[t], 0))
            {
                findings.AtPeriod(ViolationKind.ClassRule, pipeline.Id.Value, t, flow[t], "m3", 0,
                    $"pipeline {pipeline.Id} carries {Findings.Q(flow[t])} m3 of class {supplied} from tank {pipeline.From} to {pipeline.To}, " +
                    $"which needs class {required} or better");
            }
        }
    }
}
