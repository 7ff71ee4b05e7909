using Microsoft.Extensions.Hosting;
using System.CommandLine;
using PlanDesk.Server.Store;

namespace PlanDesk.Cli;

internal static class ServeCommand
{
    public static Command Create()
    {
        var store = new StoreOptions();
        var urls = new Option<string?>("--urls") { Description = "Address to listen on (default http://127.0.0.1:5080)." };
        var command = new Command("serve", "Run the target service: REST API, background solves, pages and the store, in one process.") { urls };
        store.AddTo(command);
        command.SetAction(async (parse, cancellation) =>
        {
            var settings = store.Read(parse);
            var args = new List<string>();
            if (settings.PostgresConnection is { } connection)
            {
                args.AddRange(["--" + StoreSettings.PostgresKey, connection]);
            }
            if (settings.DataDirectory is { } directory)
            {
                args.AddRange(["--" + StoreSettings.DataDirectoryKey, directory]);
            }
            if (parse.GetValue(urls) is { } address)
            {
                args.AddRange(["--urls", address]);
            }
            var app = PlanDesk.Server.Program.Create([.. args]);
            await app.StartAsync(cancellation);
            await app.WaitForShutdownAsync(cancellation);
            return 0;
        });
        return command;
    }
}
