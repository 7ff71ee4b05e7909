using Microsoft.AspNetCore.OpenApi;
using Microsoft.OpenApi;
using NodaTime;
using PlanDesk.Core.Model;

namespace PlanDesk.Server.Hosting;

/// <summary>The OpenAPI document at /openapi/v1.json, with NodaTime types and typed ids described as the strings they are on the wire.</summary>
internal static class OpenApiSetup
{
    private static readonly Dictionary<Type, (string? Format, string Example)> StringTypes = new()
    {
        [typeof(LocalDate)] = ("date", "2027-03-26"),
        [typeof(Instant)] = ("date-time", "2027-03-26T05:00:00Z"),
        [typeof(LocalDateTime)] = (null, "2027-03-26T07:00:00"),
        [typeof(LocalTime)] = (null, "07:00"),
        [typeof(PlantId)] = (null, "larkmoor"),
        [typeof(StageId)] = (null, "larkmoor-filter-uv"),
        [typeof(TankId)] = (null, "larkmoor-class-a"),
        [typeof(PipelineId)] = (null, "larkmoor-to-orchard"),
        [typeof(CustomerId)] = (null, "hollins-orchard"),
        [typeof(TariffId)] = (null, "larkmoor-grid"),
        [typeof(ClassId)] = (null, "A"),
        [typeof(LevelId)] = (null, "standard"),
    };

    public static void Configure(OpenApiOptions options)
    {
        options.AddDocumentTransformer((document, _, _) =>
        {
            document.Info.Title = "PlanDesk target service";
            document.Info.Description =
                "Plans, published per-plant daily targets, acknowledgements and actuals. Send 'Authorization: Bearer <key>'. " +
                "Decision support only: reclaimed-water quality must be verified by the plant's own monitoring under its permit; " +
                "local regulations and licensed operators decide.";
            return Task.CompletedTask;
        });
        options.AddOperationTransformer((operation, _, _) =>
        {
            // Every error answer is problem details; say so with its own media type.
            foreach (var (status, response) in operation.Responses ?? [])
            {
                if (status[0] is '4' or '5' && response.Content is { } content && content.Remove("application/json", out var json))
                {
                    content["application/problem+json"] = json;
                }
            }
            return Task.CompletedTask;
        });
        options.AddSchemaTransformer((schema, context, _) =>
        {
            var type = context.JsonTypeInfo.Type;
            // Plans may hold NaN for an unknown bound, so the API writes named floating-point values; requests
            // must send plain numbers, which is what the document shows.
            if ((Nullable.GetUnderlyingType(type) ?? type) == typeof(double) && schema.AnyOf is { Count: > 0 })
            {
                schema.Type = Nullable.GetUnderlyingType(type) is null ? JsonSchemaType.Number : JsonSchemaType.Number | JsonSchemaType.Null;
                schema.AnyOf = null;
                return Task.CompletedTask;
            }
            var underlying = Nullable.GetUnderlyingType(type);
            if (StringTypes.TryGetValue(underlying ?? type, out var described))
            {
                schema.Type = underlying is null ? JsonSchemaType.String : JsonSchemaType.String | JsonSchemaType.Null;
                schema.Format = described.Format;
                schema.Examples = [System.Text.Json.Nodes.JsonValue.Create(described.Example)];
                schema.Properties?.Clear();
                schema.Required?.Clear();
            }
            return Task.CompletedTask;
        });
    }
}
