using Microsoft.AspNetCore.Authorization;
using Microsoft.AspNetCore.Authorization.Policy;
using Microsoft.Extensions.DependencyInjection.Extensions;
using Microsoft.Extensions.FileProviders;
using NodaTime;
using PlanDesk.Server.Auth;
using PlanDesk.Server.Engine;
using PlanDesk.Server.Networks;
using PlanDesk.Server.SolveJobs;
using PlanDesk.Server.Store;

namespace PlanDesk.Server.Hosting;

/// <summary>The service's parts, registered one feature at a time; <see cref="Program"/> lists them in order.</summary>
internal static class ServiceSetup
{
    public const string DefaultUrl = "http://127.0.0.1:5080";

    /// <summary>Listens on <see cref="DefaultUrl"/> unless an address was given (--urls, ASPNETCORE_URLS).</summary>
    public static WebApplicationBuilder UseDefaultUrlUnlessGiven(this WebApplicationBuilder builder)
    {
        if (string.IsNullOrEmpty(builder.Configuration[WebHostDefaults.ServerUrlsKey]))
        {
            builder.WebHost.UseUrls(DefaultUrl);
        }
        return builder;
    }

    /// <summary>Request lines and refused keys are not logged: they would fill the log at every poll of every plant.</summary>
    public static ILoggingBuilder LeaveRequestsOut(this ILoggingBuilder logging) => logging
        .AddFilter("Microsoft.AspNetCore", LogLevel.Warning)
        .AddFilter("Microsoft.AspNetCore.DataProtection", LogLevel.Error)
        .AddFilter("PlanDesk.Server.Auth", LogLevel.Warning);

    /// <summary>Problem details for every error, strict JSON, and bad requests surfaced so they can be explained.</summary>
    public static IServiceCollection AddProblemAnswers(this IServiceCollection services)
    {
        services.AddProblemDetails();
        services.AddExceptionHandler<RequestErrorHandler>();
        services.Configure<RouteHandlerOptions>(options => options.ThrowOnBadRequest = true);
        services.ConfigureHttpJsonOptions(options => ServerJson.Configure(options.SerializerOptions));
        return services;
    }

    /// <summary>The store chosen by configuration (SQLite data directory or PostgreSQL), migrated before anything else starts.</summary>
    public static IServiceCollection AddPlanDeskStore(this IServiceCollection services)
    {
        // Read when first needed, so settings given to the host after this call (tests, the CLI) count.
        services.AddSingleton(provider => StoreSettings.From(provider.GetRequiredService<IConfiguration>()));
        services.AddSingleton(provider => provider.GetRequiredService<StoreSettings>().CreateStore());
        services.AddHostedService<StoreMigration>();
        services.TryAddSingleton<IClock>(SystemClock.Instance);
        return services;
    }

    public static IServiceCollection AddApiKeys(this IServiceCollection services)
    {
        services.AddAuthentication(PlanDeskClaims.Scheme)
            .AddScheme<Microsoft.AspNetCore.Authentication.AuthenticationSchemeOptions, ApiKeyAuthenticationHandler>(PlanDeskClaims.Scheme, null);
        services.AddAuthorization(Access.AddPolicies);
        services.AddSingleton<IAuthorizationHandler, AccessHandler>();
        services.AddSingleton<IAuthorizationMiddlewareResultHandler, ProblemAuthorizationResultHandler>();
        return services;
    }

    /// <summary>The solve queue and the engine behind it; tests replace the engine's parts before these defaults apply.</summary>
    public static IServiceCollection AddSolveJobs(this IServiceCollection services)
    {
        services.TryAddSingleton<INetworkReader, LoaderNetworkReader>();
        services.TryAddSingleton<IPlanSolver, PlannerSolver>();
        services.TryAddSingleton<IPlanReviewer, CoreReviewer>();
        services.TryAddSingleton<ITargetSheetBuilder, CoreSheetBuilder>();
        services.AddSingleton<NetworkCatalog>();
        services.AddSingleton<PlanPipeline>();
        services.AddSingleton<SolveJobQueue>();
        services.AddHostedService<SolveJobRunner>();
        return services;
    }

    /// <summary>The pages under wwwroot (embedded in the assembly, so the service runs from any directory).</summary>
    public static IApplicationBuilder UseBrowserDesk(this IApplicationBuilder app)
    {
        var files = new EmbeddedFileProvider(typeof(ServiceSetup).Assembly, "PlanDesk.Server.wwwroot");
        app.UseDefaultFiles(new DefaultFilesOptions { FileProvider = files });
        app.UseStaticFiles(new StaticFileOptions { FileProvider = files });
        return app;
    }

    public static IEndpointRouteBuilder MapHealth(this IEndpointRouteBuilder app)
    {
        app.MapGet("/health", () => TypedResults.Ok(new HealthResponse("ok"))).WithTags("Service").AllowAnonymous()
            .WithSummary("Answers when the service is up and its store migrated.");
        return app;
    }
}

public sealed record HealthResponse(string Status);

/// <summary>Applies the schema migrations at start, before the job runner and the web server start.</summary>
internal sealed class StoreMigration(IPlanDeskStore store, ILogger<StoreMigration> logger) : IHostedService
{
    public async Task StartAsync(CancellationToken cancellationToken)
    {
        await store.MigrateAsync(cancellationToken);
        logger.LogInformation("Store ready: {Store}", store.Description);
    }

    public Task StopAsync(CancellationToken cancellationToken) => Task.CompletedTask;
}
