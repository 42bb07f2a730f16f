using System.Diagnostics;
using System.Net;
using System.Net.Http.Headers;
using System.Text.RegularExpressions;
using CapReview.Web.Identity;
using CapReview.Web.Tests.Api;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging;

namespace CapReview.Web.Tests.Security;

/// <summary>No password, token or cookie reaches the log, even at its most verbose; no secret is kept in the repository.</summary>
public sealed partial class SecretsTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    [Fact]
    public async Task Passwords_tokens_and_cookies_never_reach_the_log_even_at_trace_level()
    {
        var logs = new CapturedLogs();
        using var verbose = factory.WithWebHostBuilder(builder =>
        {
            builder.UseSetting("Logging:LogLevel:Default", "Trace");
            builder.UseSetting("Logging:LogLevel:Microsoft.AspNetCore", "Trace");
            builder.UseSetting("Logging:LogLevel:Microsoft.EntityFrameworkCore.Database.Command", "Trace");
            builder.ConfigureServices(services => services.AddSingleton<ILoggerProvider>(logs));
        });
        const string password = "quiet-orchard-2027", wrongPassword = "mistyped-secret-2027", forgedToken = "crv_forgedforgedforgedforgedforgedforgedforg";
        await AccountDefenceTests.CreateUserAsync(verbose.Services, "secrets@tarnby.example", password);
        string token;
        using (var scope = verbose.Services.CreateScope())
        {
            var user = await scope.ServiceProvider.GetRequiredService<IdentityStore>().FindByEmailAsync("secrets@tarnby.example");
            token = await scope.ServiceProvider.GetRequiredService<ApiTokenService>().IssueAsync(user!.Id, "secrets", CancellationToken.None);
        }

        using HttpClient browser = verbose.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false });
        using (var wrong = await FormSignIn.PostAsync(browser, "secrets@tarnby.example", wrongPassword))
        {
            Assert.Equal(HttpStatusCode.OK, wrong.StatusCode);
        }
        using var signedIn = await FormSignIn.PostAsync(browser, "secrets@tarnby.example", password);
        string cookie = signedIn.Headers.GetValues("Set-Cookie").Single(c => c.StartsWith("capreview=", StringComparison.Ordinal)).Split(';')[0];
        using (var page = new HttpRequestMessage(HttpMethod.Get, "/proposals"))
        {
            page.Headers.Add("Cookie", cookie);
            using var answer = await browser.SendAsync(page);
            Assert.Equal(HttpStatusCode.OK, answer.StatusCode);
        }
        using HttpClient api = verbose.CreateClient();
        api.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", token);
        Assert.Equal(HttpStatusCode.OK, (await api.GetAsync("/api/v1/proposals")).StatusCode);
        api.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", forgedToken);
        Assert.Equal(HttpStatusCode.Unauthorized, (await api.GetAsync("/api/v1/proposals")).StatusCode);

        string[] secrets = [password, wrongPassword, token, forgedToken, ApiTokenService.Hash(token), cookie.Split('=', 2)[1]];
        Assert.True(logs.Entries.Count > 100, $"only {logs.Entries.Count} log entries: the trace level did not take");
        foreach (CapturedLogs.Entry entry in logs.Entries)
        {
            foreach (string secret in secrets)
            {
                Assert.False(entry.Text.Contains(secret, StringComparison.Ordinal), $"A secret reached the log: {entry.Text[..Math.Min(300, entry.Text.Length)]}");
            }
        }
    }

    [Fact]
    public void The_repository_holds_no_private_key_no_token_and_no_real_password()
    {
        string root = RepositoryFolder.Root;
        var files = Git(root, "ls-files", "-z").Split('\0', StringSplitOptions.RemoveEmptyEntries);
        Assert.True(files.Length > 100, "git ls-files listed too few files");
        Assert.DoesNotContain(files, f => KeyFile().IsMatch(f));
        // Placeholders and the throwaway credentials of tests and CI's own loopback database.
        string[] allowed = ["CHANGE-ME", "${POSTGRES_PASSWORD}", "…", "none", "capreview-tests"];
        foreach (string file in files.Where(f => !f.Contains("/Migrations/", StringComparison.Ordinal)))
        {
            string path = Path.Combine(root, file);
            if (!File.Exists(path) || new FileInfo(path).Length > 2_000_000)
            {
                continue;
            }
            string text = File.ReadAllText(path);
            if (text.Contains('\0', StringComparison.Ordinal))
            {
                continue;
            }
            Assert.False(PrivateKey().IsMatch(text), $"{file} holds a private key");
            Assert.False(IssuedToken().IsMatch(text), $"{file} holds something shaped like an issued API token");
            foreach (Match password in ConnectionPassword().Matches(text))
            {
                Assert.True(allowed.Contains(password.Groups[1].Value), $"{file} holds a connection-string password: {password.Value}");
            }
        }
    }

    private static string Git(string root, params string[] arguments)
    {
        var start = new ProcessStartInfo("git") { WorkingDirectory = root, RedirectStandardOutput = true, UseShellExecute = false };
        foreach (string argument in arguments)
        {
            start.ArgumentList.Add(argument);
        }
        using Process git = Process.Start(start)!;
        string output = git.StandardOutput.ReadToEnd();
        git.WaitForExit();
        Assert.Equal(0, git.ExitCode);
        return output;
    }

    [GeneratedRegex(@"\.(pfx|p12|pem|key|jks|keystore)$", RegexOptions.IgnoreCase)]
    private static partial Regex KeyFile();

    [GeneratedRegex("-----BEGIN ([A-Z]+ )?PRIVATE KEY-----")]
    private static partial Regex PrivateKey();

    // crv_ and 43 characters of base64url: the shape ApiTokenService issues.
    [GeneratedRegex(@"crv_[A-Za-z0-9_-]{43}(?![A-Za-z0-9_-])")]
    private static partial Regex IssuedToken();

    [GeneratedRegex(@"(?<![A-Za-z.])Password=([^;""'\s),(\[]+)", RegexOptions.IgnoreCase)]
    private static partial Regex ConnectionPassword();
}
