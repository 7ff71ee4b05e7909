using System.Text.Json;
using System.Text.Json.Serialization;
using NodaTime;
using NodaTime.Serialization.SystemTextJson;
using PlanDesk.Core.Model;

namespace PlanDesk.Core.Plans;

/// <summary>JSON settings for plans and everything else PlanDesk writes: camelCase, NodaTime ISO types, ids as strings.</summary>
public static class PlanJson
{
    public static JsonSerializerOptions Options { get; } = CreateOptions(indented: true);

    public static JsonSerializerOptions CreateOptions(bool indented)
    {
        var options = new JsonSerializerOptions(JsonSerializerDefaults.Web)
        {
            WriteIndented = indented,
            NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals,
            DefaultIgnoreCondition = JsonIgnoreCondition.Never,
        };
        options.ConfigureForNodaTime(DateTimeZoneProviders.Tzdb);
        options.Converters.Add(new StringIdConverter<PlantId>(s => new PlantId(s), id => id.Value));
        options.Converters.Add(new StringIdConverter<StageId>(s => new StageId(s), id => id.Value));
        options.Converters.Add(new StringIdConverter<TankId>(s => new TankId(s), id => id.Value));
        options.Converters.Add(new StringIdConverter<PipelineId>(s => new PipelineId(s), id => id.Value));
        options.Converters.Add(new StringIdConverter<CustomerId>(s => new CustomerId(s), id => id.Value));
        options.Converters.Add(new StringIdConverter<TariffId>(s => new TariffId(s), id => id.Value));
        options.Converters.Add(new StringIdConverter<ClassId>(s => new ClassId(s), id => id.Value));
        options.Converters.Add(new StringIdConverter<LevelId>(s => new LevelId(s), id => id.Value));
        return options;
    }

    public static string Serialize(Plan plan) => JsonSerializer.Serialize(plan, Options);

    public static Plan? Deserialize(string json) => JsonSerializer.Deserialize<Plan>(json, Options);

    private sealed class StringIdConverter<T>(Func<string, T> create, Func<T, string> value) : JsonConverter<T>
    {
        public override T Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options) =>
            create(reader.GetString() ?? throw new JsonException($"expected a string id for {typeof(T).Name}"));

        public override void Write(Utf8JsonWriter writer, T id, JsonSerializerOptions options) => writer.WriteStringValue(value(id));

        public override T ReadAsPropertyName(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options) =>
            create(reader.GetString()!);

        public override void WriteAsPropertyName(Utf8JsonWriter writer, T id, JsonSerializerOptions options) =>
            writer.WritePropertyName(value(id));
    }
}
