using System.Text.Json;
using System.Text.Json.Serialization;
using NodaTime;
using NodaTime.Text;
using PlanDesk.Core.Plans;

namespace PlanDesk.Server.Hosting;

/// <summary>JSON of the API: the plan file's settings (camelCase, ISO dates and times, ids as strings), strict about
/// what a request may hold (required fields, no unknown fields where a typo would lose a value, no null for non-null).</summary>
internal static class ServerJson
{
    /// <summary>The API's options, also used for the documents the store keeps (summaries, checks, sheets, actuals).</summary>
    public static JsonSerializerOptions Options { get; } = Create();

    private static JsonSerializerOptions Create()
    {
        var options = new JsonSerializerOptions(JsonSerializerDefaults.Web);
        Configure(options);
        return options;
    }

    public static void Configure(JsonSerializerOptions options)
    {
        var planOptions = PlanJson.CreateOptions(indented: false);
        options.PropertyNamingPolicy = JsonNamingPolicy.CamelCase;
        options.NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals;
        options.RespectNullableAnnotations = true;
        options.RespectRequiredConstructorParameters = true;
        options.Converters.Add(new LocalDateConverter());
        options.Converters.Add(new InstantConverter());
        foreach (var converter in planOptions.Converters)
        {
            options.Converters.Add(converter);
        }
        options.Converters.Add(new JsonStringEnumConverter(JsonNamingPolicy.CamelCase, allowIntegerValues: false));
    }

    // NodaTime's own converters throw parse exceptions the framework does not recognise as bad input;
    // these say what was expected and let the framework add the JSON path.
    private sealed class LocalDateConverter : JsonConverter<LocalDate>
    {
        public override LocalDate Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options)
        {
            var text = reader.TokenType == JsonTokenType.String ? reader.GetString() : null;
            var result = text is null ? null : LocalDatePattern.Iso.Parse(text);
            return result is { Success: true } ? result.Value : throw new JsonException($"expected a date like 2027-03-26, got {Shown(text)}.");
        }

        public override void Write(Utf8JsonWriter writer, LocalDate value, JsonSerializerOptions options) =>
            writer.WriteStringValue(LocalDatePattern.Iso.Format(value));
    }

    private sealed class InstantConverter : JsonConverter<Instant>
    {
        public override Instant Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options)
        {
            var text = reader.TokenType == JsonTokenType.String ? reader.GetString() : null;
            if (text is not null)
            {
                var utc = InstantPattern.ExtendedIso.Parse(text);
                if (utc.Success)
                {
                    return utc.Value;
                }
                var withOffset = OffsetDateTimePattern.ExtendedIso.Parse(text);
                if (withOffset.Success)
                {
                    return withOffset.Value.ToInstant();
                }
            }
            throw new JsonException($"expected a time with its offset, like 2027-03-26T05:00:00Z or 2027-03-26T07:00:00+02:00, got {Shown(text)}.");
        }

        public override void Write(Utf8JsonWriter writer, Instant value, JsonSerializerOptions options) =>
            writer.WriteStringValue(InstantPattern.ExtendedIso.Format(value));
    }

    private static string Shown(string? text) => text is null ? "a value that is not a string" : $"'{text}'";
}
