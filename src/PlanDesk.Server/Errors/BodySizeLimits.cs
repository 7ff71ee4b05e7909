using Microsoft.AspNetCore.Http.Features;

namespace PlanDesk.Server;

/// <summary>Largest request body an endpoint accepts, in bytes; endpoints without it accept <see cref="DefaultBytes"/>.</summary>
public sealed record BodySizeLimit(long Bytes)
{
    public const long DefaultBytes = 1_000_000;
    public const long NetworkBytes = 10_000_000;
}

/// <summary>Answers 413 with problem details when a body is larger than its endpoint's limit.</summary>
internal static class BodySizeLimits
{
    public static TBuilder WithBodySizeLimit<TBuilder>(this TBuilder builder, long bytes) where TBuilder : IEndpointConventionBuilder =>
        builder.WithMetadata(new BodySizeLimit(bytes));

    public static IApplicationBuilder UseBodySizeLimits(this IApplicationBuilder app) => app.Use(async (context, next) =>
    {
        var limit = context.GetEndpoint()?.Metadata.GetMetadata<BodySizeLimit>()?.Bytes ?? BodySizeLimit.DefaultBytes;
        if (context.Request.ContentLength > limit)
        {
            await ProblemResponses.WriteAsync(context, StatusCodes.Status413PayloadTooLarge, "Request body too large",
                $"The body is {context.Request.ContentLength:N0} bytes; this endpoint accepts at most {limit:N0} bytes. Send smaller parts (for actuals, fewer hours per request).");
            return;
        }
        // Bodies without a length (chunked) are stopped by the server when they pass the limit.
        if (context.Features.Get<IHttpMaxRequestBodySizeFeature>() is { IsReadOnly: false } feature)
        {
            feature.MaxRequestBodySize = limit;
        }
        await next(context);
    });
}
