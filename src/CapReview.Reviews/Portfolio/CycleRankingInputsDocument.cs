using System.Text.Json;
using System.Text.Json.Serialization;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;

namespace CapReview.Reviews.Portfolio;

/// <summary>
/// <see cref="CycleRankingInputs"/> as JSON, so that a page can carry what it read from its first rendering to its
/// live one instead of reading it again. Written in the same style as the stored assumptions (camelCase, enums as
/// strings), which the inputs contain; the cycle and its MARR version, whose setters are private, are read back as
/// EF Core reads their rows.
/// </summary>
public static class CycleRankingInputsDocument
{
    private static readonly JsonSerializerOptions Options = new(JsonSerializerDefaults.Web)
    {
        DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull,
        Converters =
        {
            new JsonStringEnumConverter(JsonNamingPolicy.CamelCase, allowIntegerValues: false),
            new PrivateStateConverter<BudgetCycle>(),
            new PrivateStateConverter<MarrPolicyVersion>(),
        },
    };

    public static string Serialize(CycleRankingInputs inputs) => JsonSerializer.Serialize(inputs, Options);

    public static CycleRankingInputs Deserialize(string json) =>
        JsonSerializer.Deserialize<CycleRankingInputs>(json, Options)
        ?? throw new JsonException("The document holds no ranking inputs.");
}
