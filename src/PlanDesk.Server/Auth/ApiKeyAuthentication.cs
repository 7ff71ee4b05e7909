using System.Security.Claims;
using System.Text.Encodings.Web;
using Microsoft.AspNetCore.Authentication;
using Microsoft.Extensions.Options;
using PlanDesk.Server.Store;

namespace PlanDesk.Server.Auth;

/// <summary>Claims PlanDesk puts on an authenticated caller.</summary>
public static class PlanDeskClaims
{
    public const string Scheme = "ApiKey";
    public const string Role = "plandesk:role";
    public const string Plant = "plandesk:plant";
    public const string KeyId = "plandesk:keyId";

    public static string KeyIdOf(ClaimsPrincipal user) => user.FindFirstValue(KeyId) ?? "";
}

/// <summary>Finds the caller's key in <c>Authorization: Bearer &lt;key&gt;</c> or <c>X-Api-Key: &lt;key&gt;</c>
/// and checks it against its stored hash.</summary>
internal sealed class ApiKeyAuthenticationHandler(
    IOptionsMonitor<AuthenticationSchemeOptions> options, ILoggerFactory logger, UrlEncoder encoder, IPlanDeskStore store)
    : AuthenticationHandler<AuthenticationSchemeOptions>(options, logger, encoder)
{
    private const string FailureItem = "plandesk:authFailure";

    protected override async Task<AuthenticateResult> HandleAuthenticateAsync()
    {
        var presented = PresentedKey(Request);
        if (presented is null)
        {
            return AuthenticateResult.NoResult();
        }
        var keyId = ApiKeys.KeyIdOf(presented);
        var record = keyId is null ? null : await store.FindKeyAsync(keyId);
        if (record is null || !ApiKeys.Matches(record, presented))
        {
            return Fail("The API key is not recognised. Check that the whole key was copied; a scheduler can create a new one with 'plandesk keys add'.");
        }
        if (record.RevokedAt is not null)
        {
            return Fail($"The API key {record.KeyId} was revoked. Ask a scheduler for a new key ('plandesk keys add').");
        }
        var claims = new List<Claim>
        {
            new(PlanDeskClaims.Role, record.Role.ToString().ToLowerInvariant()),
            new(PlanDeskClaims.KeyId, record.KeyId),
        };
        if (record.PlantId is not null)
        {
            claims.Add(new Claim(PlanDeskClaims.Plant, record.PlantId));
        }
        var principal = new ClaimsPrincipal(new ClaimsIdentity(claims, PlanDeskClaims.Scheme));
        return AuthenticateResult.Success(new AuthenticationTicket(principal, PlanDeskClaims.Scheme));
    }

    private AuthenticateResult Fail(string message)
    {
        Context.Items[FailureItem] = message;
        return AuthenticateResult.Fail(message);
    }

    protected override async Task HandleChallengeAsync(AuthenticationProperties properties)
    {
        var detail = Context.Items[FailureItem] as string
            ?? "This endpoint needs an API key: send 'Authorization: Bearer <key>' or 'X-Api-Key: <key>'. A scheduler creates keys with 'plandesk keys add'.";
        Response.Headers.WWWAuthenticate = "Bearer";
        await ProblemResponses.WriteAsync(Context, StatusCodes.Status401Unauthorized, "API key missing or not valid", detail);
    }

    private static string? PresentedKey(HttpRequest request)
    {
        var authorization = request.Headers.Authorization.ToString();
        if (authorization.StartsWith("Bearer ", StringComparison.OrdinalIgnoreCase))
        {
            return authorization["Bearer ".Length..].Trim();
        }
        var apiKey = request.Headers["X-Api-Key"].ToString().Trim();
        return apiKey.Length > 0 ? apiKey : null;
    }
}
