using PlanDesk.Server.Hosting;
using PlanDesk.Server.Keys;
using PlanDesk.Server.Networks;
using PlanDesk.Server.Plans;
using PlanDesk.Server.Reports;
using PlanDesk.Server.Targets;
using PlanDesk.Server.Views;

namespace PlanDesk.Server;

/// <summary>
/// The target service in one process: the REST API, the store, solve jobs in the background and the pages
/// under wwwroot. Settings: <c>PlanDesk:DataDir</c> (SQLite, default ./plandesk-data) or <c>PlanDesk:Postgres</c>
/// (a connection string), and <c>urls</c> (default http://127.0.0.1:5080).
/// </summary>
public sealed class Program
{
    public static Task Main(string[] args) => Create(args).RunAsync();

    public static WebApplication Create(string[] args)
    {
        var builder = WebApplication.CreateBuilder(args);
        builder.UseDefaultUrlUnlessGiven();
        builder.Logging.LeaveRequestsOut();
        builder.Services.AddProblemAnswers();
        builder.Services.AddPlanDeskStore();
        builder.Services.AddApiKeys();
        builder.Services.AddSolveJobs();
        builder.Services.AddOpenApi(OpenApiSetup.Configure);

        var app = builder.Build();
        app.UseExceptionHandler();
        app.UseStatusCodeProblems();
        app.UseBrowserDesk();
        app.UseRouting();
        app.UseAuthentication();
        app.UseAuthorization();
        app.UseBodySizeLimits();

        app.MapOpenApi().AllowAnonymous();
        var api = app.MapGroup("").AddEndpointFilter<ProblemDetailsFilter>();
        api.MapHealth();
        api.MapNetworks();
        api.MapPlans();
        api.MapJobs();
        api.MapPublications();
        api.MapTargets();
        api.MapPlantReports();
        api.MapKeys();
        api.MapSession();
        api.MapPlanViews();
        return app;
    }
}
