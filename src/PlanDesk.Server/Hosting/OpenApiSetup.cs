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
        options.AddSchemaTransformer((schema, context, _) =>
        {
            var type = context.JsonTypeInfo.Type;
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
