using Microsoft.AspNetCore.Authorization;
using Microsoft.AspNetCore.Authorization.Policy;

namespace PlanDesk.Server.Auth;

/// <summary>
/// The four kinds of access every endpoint needs one of. Scheduler keys may do everything; viewer keys read
/// everything but keys; a plant key reads and writes only under its own <c>/api/plants/{plantId}</c>.
/// </summary>
public static class Access
{
    /// <summary>Read networks, plans, jobs and publications: scheduler or viewer.</summary>
    public const string Read = "read";
    /// <summary>Upload networks, solve, cancel, publish, manage keys: scheduler.</summary>
    public const string Schedule = "schedule";
    /// <summary>Read one plant's targets, acknowledgements and actuals: scheduler, viewer, or that plant's key.</summary>
    public const string PlantRead = "plant-read";
    /// <summary>Acknowledge targets and report actuals for one plant: scheduler or that plant's key.</summary>
    public const string PlantWrite = "plant-write";

    public static void AddPolicies(AuthorizationOptions options)
    {
        foreach (var name in new[] { Read, Schedule, PlantRead, PlantWrite })
        {
            options.AddPolicy(name, policy => policy
                .AddAuthenticationSchemes(PlanDeskClaims.Scheme)
                .RequireAuthenticatedUser()
                .AddRequirements(new AccessRequirement(name)));
        }
    }
}

internal sealed record AccessRequirement(string Access) : IAuthorizationRequirement;

/// <summary>Decides an <see cref="AccessRequirement"/> and, when it refuses, says why in words the caller can act on.</summary>
internal sealed class AccessHandler : AuthorizationHandler<AccessRequirement>
{
    protected override Task HandleRequirementAsync(AuthorizationHandlerContext context, AccessRequirement requirement)
    {
        if (context.User.Identity?.IsAuthenticated != true)
        {
            return Task.CompletedTask;
        }
        var role = context.User.FindFirst(PlanDeskClaims.Role)?.Value;
        var keyPlant = context.User.FindFirst(PlanDeskClaims.Plant)?.Value;
        var routePlant = (context.Resource as HttpContext)?.GetRouteValue("plantId") as string;
        var refusal = (requirement.Access, role) switch
        {
            (_, "scheduler") => null,
            (Access.Read or Access.PlantRead, "viewer") => null,
            (Access.Schedule or Access.PlantWrite, "viewer") =>
                "A viewer key is read-only. Uploading, solving, publishing, acknowledging, reporting actuals and managing keys need a scheduler key (or, for one plant's acknowledgements and actuals, that plant's key).",
            (Access.PlantRead or Access.PlantWrite, "plant") when routePlant == keyPlant => null,
            (Access.PlantRead or Access.PlantWrite, "plant") =>
                $"This key belongs to plant '{keyPlant}' and may only use /api/plants/{keyPlant}/...; it cannot reach plant '{routePlant}'.",
            (_, "plant") =>
                $"A plant key (plant '{keyPlant}') may only read that plant's targets and report its acknowledgements and actuals under /api/plants/{keyPlant}/...; ask a scheduler for a viewer key to read networks and plans.",
            _ => $"The key's role '{role}' is not known to this server.",
        };
        if (refusal is null)
        {
            context.Succeed(requirement);
        }
        else
        {
            context.Fail(new AuthorizationFailureReason(this, refusal));
        }
        return Task.CompletedTask;
    }
}

/// <summary>Turns a refusal into a 403 problem details that says why; 401s are written by the authentication handler.</summary>
internal sealed class ProblemAuthorizationResultHandler : IAuthorizationMiddlewareResultHandler
{
    private readonly AuthorizationMiddlewareResultHandler fallback = new();

    public async Task HandleAsync(RequestDelegate next, HttpContext context, AuthorizationPolicy policy, PolicyAuthorizationResult result)
    {
        if (result.Forbidden)
        {
            var reasons = result.AuthorizationFailure?.FailureReasons.Select(r => r.Message).Distinct().ToList() ?? [];
            var detail = reasons.Count > 0 ? string.Join(" ", reasons) : "This key may not use this endpoint.";
            await ProblemResponses.WriteAsync(context, StatusCodes.Status403Forbidden, "This key may not do that", detail);
            return;
        }
        await fallback.HandleAsync(next, context, policy, result);
    }
}
