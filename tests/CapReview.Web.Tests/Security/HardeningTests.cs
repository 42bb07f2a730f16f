using System.Buffers.Binary;
using System.Net;
using System.Net.Http.Json;
using System.Security.Cryptography;
using System.Security.Cryptography.X509Certificates;
using System.Text.Json;
using CapReview.Reviews.Access;
using CapReview.Reviews.Proposals;
using CapReview.Web.Identity;
using CapReview.Web.Tests.Api;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Http;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Security;

/// <summary>Output encoding, object properties a caller may not set, secrets kept out of addresses, stored passwords, keys, errors and the files served.</summary>
public sealed class HardeningTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private const string Script = "<script>alert('stored')</script>";

    [Fact]
    public async Task Text_a_lead_typed_is_shown_encoded_on_the_boards_pages_never_run()
    {
        var (cycle, draft) = await factory.CycleWithSubmittedProposalAsync("Hardening cycle", 0.08, ApiFactory.Draft(Script, 4, 10_000, 4_000,
            costLabel: "<img src=x onerror=alert(3)>", description: "\" onmouseover=\"alert(2)", category: ProposalCategory.Other), "hardening-lead");

        await AccountDefenceTests.CreateUserAsync(factory.Services, "hardening.board@tarnby.example", "ivory-trellis-2027", RoleNames.Reviewer);
        using HttpClient browser = factory.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false });
        Assert.Equal(HttpStatusCode.Redirect, (await FormSignIn.PostAsync(browser, "hardening.board@tarnby.example", "ivory-trellis-2027")).StatusCode);
        foreach (string path in new[] { $"/cycles/{cycle.Id}/ranking", $"/cycles/{cycle.Id}", $"/proposals/{draft.Id}" })
        {
            string html = await browser.GetStringAsync(path);
            Assert.Contains("&lt;script&gt;alert(&#x27;stored&#x27;)&lt;/script&gt;", html, StringComparison.Ordinal);
            Assert.DoesNotContain(Script, html, StringComparison.Ordinal);
            Assert.DoesNotContain("<img src=x", html, StringComparison.Ordinal);
            Assert.DoesNotContain("\" onmouseover=\"alert(2)", html, StringComparison.Ordinal);
        }
    }

    [Fact]
    public async Task A_new_draft_takes_only_the_fields_a_lead_may_set()
    {
        var (lead, leadId) = await factory.TokenClientAsync("fields.lead@tarnby.example", RoleNames.ProjectLead);
        using (lead)
        {
            using var answer = await lead.PostAsJsonAsync("/api/v1/proposals", new
            {
                title = "Conveyor guards",
                category = "compliance",
                riskClass = "low",
                status = "approved",
                cycleId = 1,
                ownerId = "someone-else",
                reference = "P-9999",
                id = 424242,
                revision = 99,
                versions = new[] { new { number = 7, frozen = true, assumptionsHash = "00" } },
                assumptions = new { model = new { horizon = 3, elements = new[] { new { type = "single", label = "Guards", category = "capital", period = 0, amount = -9_000 } } } },
            });
            Assert.Equal(HttpStatusCode.Created, answer.StatusCode);
            using JsonDocument body = JsonDocument.Parse(await answer.Content.ReadAsStringAsync());
            JsonElement created = body.RootElement;
            Assert.Equal("draft", created.GetProperty("status").GetString());
            Assert.Equal(JsonValueKind.Null, created.GetProperty("cycleId").ValueKind);
            Assert.NotEqual("P-9999", created.GetProperty("reference").GetString());
            Assert.NotEqual(424242, created.GetProperty("id").GetInt32());
            var version = Assert.Single(created.GetProperty("versions").EnumerateArray());
            Assert.Equal(1, version.GetProperty("number").GetInt32());
            Assert.False(version.GetProperty("frozen").GetBoolean());
            var stored = await factory.Services.GetRequiredService<ProposalService>().GetAsync(Actor.Of(leadId, "Fields Lead", Role.ProjectLead), created.GetProperty("id").GetInt32(), CancellationToken.None);
            Assert.Equal(leadId, stored.OwnerId);
        }
    }

    [Fact]
    public async Task An_api_token_is_read_only_from_the_authorization_header_never_from_the_address()
    {
        var (client, _) = await factory.TokenClientAsync("address.token@tarnby.example", RoleNames.Finance);
        string token = client.DefaultRequestHeaders.Authorization!.Parameter!;
        Assert.Equal(HttpStatusCode.OK, (await client.GetAsync("/api/v1/cycles")).StatusCode);
        client.DefaultRequestHeaders.Authorization = null;
        foreach (string name in new[] { "access_token", "token", "api_key" })
        {
            Assert.Equal(HttpStatusCode.Unauthorized, (await client.GetAsync($"/api/v1/cycles?{name}={Uri.EscapeDataString(token)}")).StatusCode);
        }
        client.Dispose();
    }

    [Fact]
    public async Task Passwords_are_stored_as_PBKDF2_with_HMAC_SHA512_and_100000_iterations_and_a_random_salt()
    {
        await AccountDefenceTests.CreateUserAsync(factory.Services, "stored.password@tarnby.example", "walnut-beacon-2027");
        await AccountDefenceTests.CreateUserAsync(factory.Services, "stored.twin@tarnby.example", "walnut-beacon-2027");
        using var scope = factory.Services.CreateScope();
        var users = scope.ServiceProvider.GetRequiredService<Microsoft.AspNetCore.Identity.UserManager<CapReviewUser>>();
        byte[] first = Convert.FromBase64String((await users.FindByEmailAsync("stored.password@tarnby.example"))!.PasswordHash!);
        byte[] twin = Convert.FromBase64String((await users.FindByEmailAsync("stored.twin@tarnby.example"))!.PasswordHash!);
        // ASP.NET Core Identity's version-3 layout: 0x01, PRF (2 = HMAC-SHA512), iterations, salt length, salt, subkey.
        Assert.Equal(0x01, first[0]);
        Assert.Equal(2u, BinaryPrimitives.ReadUInt32BigEndian(first.AsSpan(1)));
        Assert.Equal(100_000u, BinaryPrimitives.ReadUInt32BigEndian(first.AsSpan(5)));
        uint saltLength = BinaryPrimitives.ReadUInt32BigEndian(first.AsSpan(9));
        Assert.Equal(16u, saltLength);
        Assert.Equal(13 + 16 + 32, first.Length);
        // The same password, another salt, another hash; and the hash is PBKDF2's, computed here independently.
        Assert.NotEqual(first[13..29], twin[13..29]);
        byte[] expected = Rfc2898DeriveBytes.Pbkdf2("walnut-beacon-2027", first[13..29], 100_000, HashAlgorithmName.SHA512, 32);
        Assert.Equal(expected, first[29..]);
    }

    [Fact]
    public async Task The_keys_for_cookies_and_forms_use_AES_256_GCM_and_are_stored_encrypted_when_a_certificate_is_configured()
    {
        string folder = Directory.CreateTempSubdirectory("capreview-keys-").FullName;
        string pfx = Path.Combine(folder, "keys.pfx");
        using (var rsa = RSA.Create(3072))
        {
            var request = new CertificateRequest("CN=CapReview key protection (tests)", rsa, HashAlgorithmName.SHA256, RSASignaturePadding.Pkcs1);
            using X509Certificate2 certificate = request.CreateSelfSigned(DateTimeOffset.UtcNow.AddDays(-1), DateTimeOffset.UtcNow.AddYears(1));
            File.WriteAllBytes(pfx, certificate.Export(X509ContentType.Pfx, "key-tests"));
        }
        await using var database = CapReview.TestSupport.TestDatabase.Create(Path.Combine(folder, "keys.db"));
        using var app = factory.WithWebHostBuilder(builder =>
        {
            builder.UseSetting("Storage:Provider", database.Settings.Provider.ToString());
            builder.UseSetting("ConnectionStrings:CapReview", database.Settings.ConnectionString);
            builder.UseSetting("DataProtection:CertificatePath", pfx);
            builder.UseSetting("DataProtection:CertificatePassword", "key-tests");
        });
        using HttpClient client = app.CreateClient();
        Assert.Equal(HttpStatusCode.OK, (await client.GetAsync("/signin")).StatusCode);
        using var scope = app.Services.CreateScope();
        string xml = Assert.Single(scope.ServiceProvider.GetRequiredService<CapReviewIdentityDbContext>().DataProtectionKeys).Xml!;
        Assert.Contains("AES_256_GCM", xml, StringComparison.Ordinal);
        Assert.Contains("encryptedSecret", xml, StringComparison.Ordinal);
        Assert.DoesNotContain("<masterKey", xml, StringComparison.Ordinal);
    }

    [Fact]
    public async Task In_production_an_unexpected_error_shows_a_reference_and_no_detail()
    {
        using var production = factory.WithWebHostBuilder(builder =>
        {
            builder.UseEnvironment("Production");
            builder.ConfigureServices(services => services.AddTransient<IStartupFilter, FailingEndpoint>());
        });
        // A host name of the organisation's: HSTS is never sent to localhost.
        using HttpClient client = production.CreateClient(new WebApplicationFactoryClientOptions { BaseAddress = new Uri("https://capreview.tarnby.example"), AllowAutoRedirect = false });
        using var answer = await client.GetAsync("/failing-for-tests");
        Assert.Equal(HttpStatusCode.InternalServerError, answer.StatusCode);
        string body = await answer.Content.ReadAsStringAsync();
        Assert.Contains("Something went wrong", body, StringComparison.Ordinal);
        Assert.DoesNotContain("secret detail", body, StringComparison.Ordinal);
        Assert.DoesNotContain("InvalidOperationException", body, StringComparison.Ordinal);
        Assert.DoesNotContain("at CapReview", body, StringComparison.Ordinal);
        Assert.Contains("max-age=31536000", answer.Headers.GetValues("Strict-Transport-Security").Single(), StringComparison.Ordinal);

        using HttpClient plain = production.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false });
        using var redirected = await plain.GetAsync("/signin");
        Assert.Equal(HttpStatusCode.TemporaryRedirect, redirected.StatusCode);
        Assert.Equal("https", redirected.Headers.Location!.Scheme);
    }

    [Fact]
    public void In_production_a_sample_placeholder_left_in_the_settings_stops_the_start_with_its_name()
    {
        using var production = factory.WithWebHostBuilder(builder =>
        {
            builder.UseEnvironment("Production");
            builder.UseSetting("Packets:Signing:CertificatePassword", "CHANGE-ME");
        });
        var refused = Assert.ThrowsAny<Exception>(() => production.CreateClient());
        Assert.Contains("Packets:Signing:CertificatePassword", refused.ToString(), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("/.git/HEAD")]
    [InlineData("/.git/config")]
    [InlineData("/appsettings.json")]
    [InlineData("/appsettings.Development.json")]
    [InlineData("/CapReview.Web.dll")]
    [InlineData("/CapReview.Web.deps.json")]
    [InlineData("/templates/")]
    [InlineData("/db/capreview.db")]
    public async Task No_source_control_settings_binaries_database_or_folder_listing_is_served(string path)
    {
        using HttpClient client = factory.CreateClient();
        using var answer = await client.GetAsync(path);
        Assert.Equal(HttpStatusCode.NotFound, answer.StatusCode);
    }

    [Fact]
    public async Task Trace_is_not_answered_and_dynamic_answers_are_not_cached()
    {
        using HttpClient client = factory.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false });
        using (var trace = await client.SendAsync(new HttpRequestMessage(HttpMethod.Trace, "/signin")))
        {
            // No endpoint answers TRACE: the request is not echoed back.
            Assert.Contains(trace.StatusCode, new[] { HttpStatusCode.NotFound, HttpStatusCode.MethodNotAllowed });
            Assert.DoesNotContain("TRACE /signin", await trace.Content.ReadAsStringAsync(), StringComparison.Ordinal);
        }
        using (var page = await client.GetAsync("/signin"))
        {
            Assert.Contains("no-store", page.Headers.CacheControl!.ToString(), StringComparison.Ordinal);
        }
        var (api, _) = await factory.TokenClientAsync("cache.finance@tarnby.example", RoleNames.Finance);
        using (api)
        using (var answer = await api.GetAsync("/api/v1/cycles"))
        {
            Assert.True(answer.Headers.CacheControl!.NoStore);
        }
    }

    /// <summary>An endpoint that fails, added behind the app's own pipeline as an unforeseen bug would be.</summary>
    private sealed class FailingEndpoint : IStartupFilter
    {
        public Action<IApplicationBuilder> Configure(Action<IApplicationBuilder> next) => app =>
        {
            next(app);
            app.Map("/failing-for-tests", failing => failing.Run(_ => throw new InvalidOperationException("secret detail of a failure")));
        };
    }
}
