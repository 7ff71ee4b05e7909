using System.Text.Json;
using System.Text.RegularExpressions;
using Microsoft.AspNetCore.Diagnostics;

namespace PlanDesk.Server;

/// <summary>
/// Turns request errors that surface as exceptions (unreadable JSON, a body over the size limit, a wrong
/// content type) into problem details that name the JSON path and the fix. Anything else is a fault of the
/// server: logged, and answered with a 500 that carries no internals.
/// </summary>
internal sealed partial class RequestErrorHandler(ILogger<RequestErrorHandler> logger) : IExceptionHandler
{
    public async ValueTask<bool> TryHandleAsync(HttpContext context, Exception exception, CancellationToken cancellation)
    {
        if (exception is BadHttpRequestException bad)
        {
            var (title, detail) = Describe(bad);
            await ProblemResponses.WriteAsync(context, bad.StatusCode, title, detail);
            return true;
        }
        logger.LogError(exception, "Unhandled error on {Method} {Path}", context.Request.Method, context.Request.Path);
        await ProblemResponses.WriteAsync(context, StatusCodes.Status500InternalServerError, "Server error",
            "The server failed while handling this request; the error is in the server log. Retry later, or tell the PlanDesk administrator.");
        return true;
    }

    private static (string Title, string Detail) Describe(BadHttpRequestException bad)
    {
        if (bad.StatusCode == StatusCodes.Status413PayloadTooLarge)
        {
            return ("Request body too large", bad.Message);
        }
        if (bad.StatusCode == StatusCodes.Status415UnsupportedMediaType)
        {
            return ("Body is not JSON", "Send the body as JSON with 'Content-Type: application/json'.");
        }
        if (bad.InnerException is JsonException json)
        {
            return ("Request body is not valid", DescribeJson(json));
        }
        if (bad.Message.Contains("no body was provided", StringComparison.OrdinalIgnoreCase))
        {
            return ("Request body missing", "This endpoint needs a JSON body; see /api-reference.html for its fields.");
        }
        return ("Bad request", bad.Message);
    }

    // System.Text.Json says "could not be converted to System.Double. Path: $.hours[0].influentM3 | LineNumber ...":
    // keep the path and say in plain words what was expected.
    private static string DescribeJson(JsonException json)
    {
        var where = string.IsNullOrEmpty(json.Path) || json.Path == "$" ? "the body" : json.Path;
        var line = json.LineNumber is { } l ? $" (line {l + 1}, position {json.BytePositionInLine + 1})" : "";
        var message = json.Message;
        var cut = message.IndexOf(" Path: ", StringComparison.Ordinal);
        if (cut >= 0)
        {
            message = message[..cut];
        }
        var converted = ConvertedTo().Match(message);
        if (converted.Success)
        {
            return $"{where}{line}: expected {Expected(converted.Groups[1].Value)}. Fix the value and send the request again.";
        }
        if (message.Contains("missing required properties", StringComparison.Ordinal))
        {
            var names = RequiredNames().Match(message);
            return $"{where}{line}: required field{(names.Success ? "s " + names.Groups[1].Value : "s")} missing. Add them and send the request again.";
        }
        if (message.Contains("could not be mapped to any .NET member", StringComparison.Ordinal))
        {
            return $"{where}{line}: this field is not known here; check its spelling against /api-reference.html.";
        }
        return $"{where}{line}: {message} Fix the JSON and send the request again.";
    }

    private static string Expected(string typeName)
    {
        if (NullableOf().Match(typeName) is { Success: true } nullable)
        {
            return Expected(nullable.Groups[1].Value);
        }
        return typeName switch
        {
            _ when typeName.Contains("Dictionary") => "an object of names and values",
            _ when typeName.Contains("List") || typeName.EndsWith("[]") => "an array",
            _ when typeName.EndsWith("Double") || typeName.EndsWith("Single") || typeName.EndsWith("Decimal") => "a number",
            _ when typeName.Contains("Int") => "a whole number",
            _ when typeName.EndsWith("String") || typeName.StartsWith("PlanDesk.Core.Model.") => "a string",
            _ when typeName.EndsWith("Boolean") => "true or false",
            _ when typeName.Contains("LocalDate") => "a date like 2027-03-26",
            _ when typeName.Contains("Instant") => "a UTC time like 2027-03-26T05:00:00Z",
            _ => "an object with the documented fields",
        };
    }

    [GeneratedRegex(@"^System\.Nullable`1\[(.+)\]$")]
    private static partial Regex NullableOf();

    [GeneratedRegex(@"could not be converted to ([^\s]+?)\.?$")]
    private static partial Regex ConvertedTo();

    [GeneratedRegex(@"missing required properties including: (.+?)\.?$")]
    private static partial Regex RequiredNames();
}
