using Microsoft.AspNetCore.WebUtilities;

namespace PlanDesk.Server;

/// <summary>Gives error answers that the framework writes without a body (no such address, wrong method, wrong
/// content type, a chunked body over the limit) a problem-details body that says what to do.</summary>
internal static class StatusCodeProblems
{
    public static IApplicationBuilder UseStatusCodeProblems(this IApplicationBuilder app) => app.UseStatusCodePages(async pages =>
    {
        var context = pages.HttpContext;
        var status = context.Response.StatusCode;
        var path = context.Request.Path;
        var limit = context.GetEndpoint()?.Metadata.GetMetadata<BodySizeLimit>()?.Bytes ?? BodySizeLimit.DefaultBytes;
        var (title, detail) = status switch
        {
            StatusCodes.Status404NotFound => ("Not found", $"There is nothing at {path}; /api-reference.html lists the addresses of the API."),
            StatusCodes.Status405MethodNotAllowed => ("Method not allowed", $"{path} does not accept {context.Request.Method}; /api-reference.html lists what each address accepts."),
            StatusCodes.Status413PayloadTooLarge => ("Request body too large", $"This endpoint accepts at most {limit:N0} bytes. Send smaller parts (for actuals, fewer hours per request)."),
            StatusCodes.Status415UnsupportedMediaType => ("Body is not JSON", "Send the body as JSON with 'Content-Type: application/json'."),
            _ => (ReasonPhrases.GetReasonPhrase(status), "See /api-reference.html for what this address accepts."),
        };
        await ProblemResponses.WriteAsync(context, status, title, detail);
    });
}
