using System.Diagnostics;
using System.Net;
using System.Net.Sockets;
using CapReview.Reviews.Storage;

namespace CapReview.Web.Tests.Operations;

/// <summary>
/// The built app as a separate process on a loopback port of its own, on a given database: for the faults a test
/// cannot cause inside its own process, such as being killed with SIGKILL.
/// </summary>
public sealed class AppProcess : IAsyncDisposable
{
    private readonly Process _process;
    private readonly List<string> _output = [];

    private AppProcess(Process process, Uri address)
    {
        _process = process;
        Address = address;
    }

    public Uri Address { get; }

    /// <summary>What the app wrote to its standard output and error, for a failing test's message.</summary>
    public string Output
    {
        get
        {
            lock (_output)
            {
                return string.Join('\n', _output);
            }
        }
    }

    /// <summary>Starts the app (Development settings, no demo data) on the database and waits until it is ready.</summary>
    public static async Task<AppProcess> StartAsync(DatabaseSettings database)
    {
        ArgumentNullException.ThrowIfNull(database);
        Uri address = new($"http://127.0.0.1:{FreePort()}");
        var start = Start(database);
        start.ArgumentList.Add("--contentRoot");
        start.ArgumentList.Add(RepositoryFolder.Path("src", "CapReview.Web"));
        start.ArgumentList.Add("--urls");
        start.ArgumentList.Add(address.ToString());
        start.Environment["RateLimits__ApiPerMinute"] = "1000000";
        var app = new AppProcess(Process.Start(start) ?? throw new InvalidOperationException("dotnet did not start."), address);
        app._process.OutputDataReceived += app.Keep;
        app._process.ErrorDataReceived += app.Keep;
        app._process.BeginOutputReadLine();
        app._process.BeginErrorReadLine();

        using var probe = new HttpClient { BaseAddress = address, Timeout = TimeSpan.FromSeconds(5) };
        for (int k = 0; k < 120; k++)
        {
            if (app._process.HasExited)
            {
                break;
            }
            try
            {
                using var ready = await probe.GetAsync(new Uri("/health/ready", UriKind.Relative));
                if (ready.StatusCode == HttpStatusCode.OK)
                {
                    return app;
                }
            }
            catch (HttpRequestException)
            {
                // Not listening yet.
            }
            await Task.Delay(250);
        }
        string output = app.Output;
        await app.DisposeAsync();
        throw new InvalidOperationException("The app did not become ready. It wrote:\n" + output);
    }

    /// <summary>Runs one of the app's command-line verbs (create-admin, issue-token, revoke-tokens) on the database; its exit code and output.</summary>
    public static async Task<(int ExitCode, string Output)> RunVerbAsync(DatabaseSettings database, params string[] arguments)
    {
        ArgumentNullException.ThrowIfNull(database);
        var start = Start(database);
        foreach (string argument in arguments)
        {
            start.ArgumentList.Add(argument);
        }
        using Process process = Process.Start(start) ?? throw new InvalidOperationException("dotnet did not start.");
        Task<string> output = process.StandardOutput.ReadToEndAsync();
        Task<string> errors = process.StandardError.ReadToEndAsync();
        await process.WaitForExitAsync();
        return (process.ExitCode, await output + await errors);
    }

    /// <summary>Ends the process at once with SIGKILL: no shutdown, no flushing, no finally blocks.</summary>
    public async Task KillAsync()
    {
        if (!_process.HasExited)
        {
            _process.Kill(entireProcessTree: false);
        }
        await _process.WaitForExitAsync();
    }

    public async ValueTask DisposeAsync()
    {
        await KillAsync();
        _process.Dispose();
    }

    /// <summary>The built app under dotnet, in Development settings without demo data, on the database.</summary>
    private static ProcessStartInfo Start(DatabaseSettings database)
    {
        var start = new ProcessStartInfo("dotnet")
        {
            WorkingDirectory = AppContext.BaseDirectory,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        start.ArgumentList.Add(Path.Combine(AppContext.BaseDirectory, "CapReview.Web.dll"));
        start.Environment["ASPNETCORE_ENVIRONMENT"] = "Development";
        start.Environment["Storage__Provider"] = database.Provider.ToString();
        start.Environment["ConnectionStrings__CapReview"] = database.ConnectionString;
        start.Environment["Demo__Enabled"] = "false";
        return start;
    }

    private void Keep(object sender, DataReceivedEventArgs e)
    {
        if (e.Data is not null)
        {
            lock (_output)
            {
                _output.Add(e.Data);
            }
        }
    }

    private static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }
}
