using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Http.Metadata;
using Microsoft.AspNetCore.Mvc;

namespace PlanDesk.Server;

/// <summary>
/// Problem details (RFC 9457) for every error the API returns: a short title naming what went wrong and a
/// detail saying what to change. Extensions carry lists (e.g. every problem of an uploaded network).
/// </summary>
internal static class Problems
{
    public static ProblemDetails Details(int status, string title, string detail, IReadOnlyList<string>? problems = null)
    {
        var details = new ProblemDetails { Status = status, Title = title, Detail = detail };
        if (problems is { Count: > 0 })
        {
            details.Extensions["problems"] = problems;
        }
        return details;
    }

    public static BadRequest<ProblemDetails> BadRequest(string title, string detail, IReadOnlyList<string>? problems = null) =>
        TypedResults.BadRequest(Details(StatusCodes.Status400BadRequest, title, detail, problems));

    public static NotFound<ProblemDetails> NotFound(string title, string detail) =>
        TypedResults.NotFound(Details(StatusCodes.Status404NotFound, title, detail));

    public static Conflict<ProblemDetails> Conflict(string title, string detail) =>
        TypedResults.Conflict(Details(StatusCodes.Status409Conflict, title, detail));

    public static UnprocessableEntity<ProblemDetails> Unprocessable(string title, string detail) =>
        TypedResults.UnprocessableEntity(Details(StatusCodes.Status422UnprocessableEntity, title, detail));
}

/// <summary>Writes problem details from middleware, where no typed result is at hand.</summary>
internal static class ProblemResponses
{
    public static async Task WriteAsync(HttpContext context, int status, string title, string detail)
    {
        context.Response.StatusCode = status;
        var service = context.RequestServices.GetRequiredService<IProblemDetailsService>();
        await service.WriteAsync(new ProblemDetailsContext
        {
            HttpContext = context,
            ProblemDetails = Problems.Details(status, title, detail),
        });
    }
}

/// <summary>
/// Handlers declare their errors as typed results (<c>NotFound&lt;ProblemDetails&gt;</c> ...), which document each
/// status in the OpenAPI document; this filter sends them as <c>application/problem+json</c> through the
/// problem-details service, like every other error of the service.
/// </summary>
internal sealed class ProblemDetailsFilter : IEndpointFilter
{
    public async ValueTask<object?> InvokeAsync(EndpointFilterInvocationContext context, EndpointFilterDelegate next)
    {
        var result = await next(context);
        var inner = result is INestedHttpResult nested ? nested.Result : result;
        return inner is IValueHttpResult { Value: ProblemDetails problem } ? TypedResults.Problem(problem) : result;
    }
}
