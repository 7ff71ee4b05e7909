using System.Security.Cryptography;
using System.Text;
using System.Text.Json;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;
using PlanDesk.Server.Hosting;

namespace PlanDesk.Server.Reports;

/// <summary>
/// Acknowledgements and actuals carry an <c>Idempotency-Key</c> header chosen by the plant (a UUID per report).
/// A retry with the same key and body returns the stored record without storing it again; the same key with a
/// different body is refused, since it would otherwise silently drop the new report.
/// </summary>
internal static class Idempotency
{
    public const string Header = "Idempotency-Key";
    public const string ReplayHeader = "Idempotent-Replay";
    private const int MaxKeyLength = 200;

    public static bool TryCheckKey(string? key, out BadRequest<ProblemDetails> problem)
    {
        var fix = $"Send a '{Header}' header with a value unique to this report (a UUID is fine, at most {MaxKeyLength} printable characters), and send the same value when retrying it.";
        problem = Problems.BadRequest("Idempotency-Key missing or not valid",
            string.IsNullOrWhiteSpace(key) ? $"The '{Header}' header is missing. {fix}" : $"The '{Header}' header is not valid. {fix}");
        return !string.IsNullOrWhiteSpace(key) && key.Length <= MaxKeyLength && key.All(c => c is >= ' ' and <= '~');
    }

    /// <summary>A fingerprint of the request as understood (not as formatted), so a retry that re-serialises the same report matches.</summary>
    public static string RequestHash<T>(T request) =>
        Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(JsonSerializer.Serialize(request, ServerJson.Options))));

    public static UnprocessableEntity<ProblemDetails> KeyReused(string key, string what) =>
        Problems.Unprocessable("Idempotency-Key already used",
            $"The '{Header}' value '{key}' was already used for a different {what}. Use a new key for a new report; reuse a key only to retry the very same report.");

    public static void MarkReplay(HttpContext context) => context.Response.Headers[ReplayHeader] = "true";
}
