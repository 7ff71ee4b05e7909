using System.Diagnostics;
using System.Net;
using System.Net.Sockets;
using System.Reflection;
using System.Text;

namespace PlanDesk.Server.Tests.Infrastructure;

/// <summary>`plandesk serve` as a separate process on a free loopback port, so a test can kill it hard; and other
/// `plandesk` commands run to their end.</summary>
public sealed class ChildServer : IDisposable
{
    private readonly Process process;
    private readonly StringBuilder output = new();

    private ChildServer(Process process, Uri address)
    {
        this.process = process;
        Address = address;
    }

    public Uri Address { get; }

    /// <summary>What the server printed, for failure messages.</summary>
    public string Output
    {
        get
        {
            lock (output)
            {
                return output.ToString();
            }
        }
    }

    public static async Task<ChildServer> StartAsync(string dataDirectory)
    {
        var address = new Uri($"http://127.0.0.1:{FreeLoopbackPort()}");
        var server = new ChildServer(Process.Start(Cli("serve", "--data-dir", dataDirectory, "--urls", address.ToString().TrimEnd('/')))!, address);
        server.process.OutputDataReceived += (_, e) => server.Append(e.Data);
        server.process.ErrorDataReceived += (_, e) => server.Append(e.Data);
        server.process.BeginOutputReadLine();
        server.process.BeginErrorReadLine();
        await server.WaitUntilUpAsync();
        return server;
    }

    /// <summary>Runs a `plandesk` command to its end; returns its exit code, standard output and standard error.</summary>
    public static async Task<(int Exit, string Output, string Errors)> RunAsync(params string[] arguments)
    {
        using var process = Process.Start(Cli(arguments))!;
        var output = process.StandardOutput.ReadToEndAsync();
        var errors = process.StandardError.ReadToEndAsync();
        await process.WaitForExitAsync();
        return (process.ExitCode, await output, await errors);
    }

    private static ProcessStartInfo Cli(params string[] arguments)
    {
        var cli = typeof(ChildServer).Assembly.GetCustomAttributes<AssemblyMetadataAttribute>().Single(a => a.Key == "PlanDeskCli").Value!;
        Assert.True(File.Exists(cli), $"the plandesk CLI was not built at {cli}");
        var start = new ProcessStartInfo(Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") ?? "dotnet")
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        start.ArgumentList.Add(cli);
        foreach (var argument in arguments)
        {
            start.ArgumentList.Add(argument);
        }
        return start;
    }

    public HttpClient Client(string key)
    {
        var client = new HttpClient { BaseAddress = Address };
        client.DefaultRequestHeaders.Authorization = new System.Net.Http.Headers.AuthenticationHeaderValue("Bearer", key);
        return client;
    }

    /// <summary>Ends the server and everything it started at once, with no chance to flush or shut down.</summary>
    public void KillHard()
    {
        process.Kill(entireProcessTree: true);
        process.WaitForExit();
    }

    public void Dispose()
    {
        if (!process.HasExited)
        {
            KillHard();
        }
        process.Dispose();
    }

    private async Task WaitUntilUpAsync()
    {
        using var probe = new HttpClient { BaseAddress = Address, Timeout = TimeSpan.FromSeconds(2) };
        var deadline = DateTime.UtcNow.AddSeconds(60);
        while (DateTime.UtcNow < deadline)
        {
            Assert.False(process.HasExited, $"plandesk serve exited with code {(process.HasExited ? process.ExitCode : 0)}:\n{Output}");
            try
            {
                if ((await probe.GetAsync("/health")).StatusCode == HttpStatusCode.OK)
                {
                    return;
                }
            }
            catch (HttpRequestException)
            {
            }
            catch (TaskCanceledException)
            {
            }
            await Task.Delay(100);
        }
        Assert.Fail($"plandesk serve did not answer on {Address} within 60 s:\n{Output}");
    }

    private void Append(string? line)
    {
        if (line is null)
        {
            return;
        }
        lock (output)
        {
            output.AppendLine(line);
        }
    }

    private static int FreeLoopbackPort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }
}
