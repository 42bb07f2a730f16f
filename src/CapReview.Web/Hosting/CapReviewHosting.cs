using System.Security.Cryptography.X509Certificates;
using System.Text.Json;
using System.Text.Json.Serialization;
using CapReview.Packets;
using CapReview.Reviews;
using CapReview.Reviews.Storage;
using CapReview.Web.Api;
using CapReview.Web.Components;
using CapReview.Web.Demo;
using CapReview.Web.Exports;
using CapReview.Web.Identity;
using CapReview.Web.Packets;
using CapReview.Web.Formatting;
using CapReview.Web.Operations;
using Microsoft.AspNetCore.DataProtection;
using Microsoft.AspNetCore.HttpOverrides;
using Microsoft.Extensions.Options;

namespace CapReview.Web.Hosting;

/// <summary>The composition root: what the web host registers and how its pipeline runs.</summary>
public static partial class CapReviewHosting
{
    public static WebApplicationBuilder AddCapReview(this WebApplicationBuilder builder)
    {
        ArgumentNullException.ThrowIfNull(builder);
        RefuseSamplePlaceholders(builder);
        IServiceCollection services = builder.Services;
        var storage = builder.Configuration.GetSection("Storage").Get<StorageOptions>() ?? new StorageOptions();
        services.Configure<OrganisationOptions>(builder.Configuration.GetSection("Organisation"));
        var database = storage.Database(builder.Configuration.GetConnectionString("CapReview"), builder.Environment.ContentRootPath);
        var audit = AuditKeySettings.Read(builder.Configuration, database, builder.Environment.ContentRootPath);
        services.AddSingleton(audit);
        services.AddSingleton(new Reviews.Interchange.TrustedSigners(builder.Configuration.GetSection("Interchange:TrustedSigners").Get<string[]>() ?? []));
        services.AddReviews(database, audit.Keys, audit.HeadLog);
        services.AddCapReviewIdentity(database, secureCookiesOnly: !builder.Environment.IsDevelopment(), SessionLimits.Read(builder.Configuration));
        if (builder.Configuration["DataProtection:CertificatePath"] is { Length: > 0 } keyCertificate)
        {
            // The keys that protect cookies and forms are stored encrypted to this certificate's public key.
            services.AddDataProtection().ProtectKeysWithCertificate(
                X509CertificateLoader.LoadPkcs12FromFile(keyCertificate, builder.Configuration["DataProtection:CertificatePassword"]));
        }
        services.AddPackets(PacketSettings.Read(builder.Configuration, database, builder.Environment.ContentRootPath));
        services.AddHostedService<PacketWorker>();
        services.AddScoped<DemoScenario>();
        services.AddScoped<DemoDecidedCycle>();

        services.AddRazorComponents().AddInteractiveServerComponents()
            .AddHubOptions(options => options.MaximumReceiveMessageSize = CapReview.Web.Components.PersistedText.MaxMessageBytes);
        services.AddProblemDetails();
        services.ConfigureHttpJsonOptions(options => ApiJson.Configure(options.SerializerOptions));
        services.AddOpenApi("v1", options => options.AddDocumentTransformer((document, _, _) =>
        {
            document.Info.Title = "CapReview API";
            document.Info.Description = "Evaluations of capital-budget cash-flow models. Results are estimates, not financial or tax advice.";
            return Task.CompletedTask;
        }));
        services.AddSingleton(sp => new DisplayFormat(sp.GetRequiredService<IOptions<OrganisationOptions>>().Value));
        services.AddSingleton<Components.PageMemory>();
        services.AddCapReviewHealth();
        services.AddSingleton<DatabasePreparation>();
        services.AddSingleton<CapReviewMetrics>();
        services.AddScoped<Microsoft.AspNetCore.Components.Server.Circuits.CircuitHandler, CircuitCounter>();
        services.AddScoped<PageLifetime>();
        services.AddScoped<Microsoft.AspNetCore.Components.Server.Circuits.CircuitHandler>(sp => sp.GetRequiredService<PageLifetime>());
        services.AddSingleton(RunLimits.Read(builder.Configuration));
        services.AddCapReviewRateLimits(builder.Configuration);
        services.AddHttpsRedirection(options => options.HttpsPort = builder.Configuration.GetValue("ReverseProxy:HttpsPort", 443));
        services.AddHsts(options => options.MaxAge = TimeSpan.FromDays(365));
        services.Configure<ForwardedHeadersOptions>(options =>
        {
            // Behind the reverse proxy (deploy/nginx): the client's address and scheme, believed only from the proxies
            // listed in ReverseProxy:KnownProxies. The framework would believe loopback too, which anyone on the host
            // can connect from; and with no proxy known at all it would believe every sender, so then nothing is read.
            options.KnownProxies.Clear();
            options.KnownIPNetworks.Clear();
            string[] proxies = builder.Configuration.GetSection("ReverseProxy:KnownProxies").Get<string[]>() ?? [];
            options.ForwardedHeaders = proxies.Length == 0
                ? ForwardedHeaders.None
                : ForwardedHeaders.XForwardedFor | ForwardedHeaders.XForwardedProto | ForwardedHeaders.XForwardedHost;
            foreach (string proxy in proxies)
            {
                options.KnownProxies.Add(System.Net.IPAddress.TryParse(proxy, out var address)
                    ? address
                    : throw new InvalidOperationException($"ReverseProxy:KnownProxies: “{proxy}” is not an IP address; list the reverse proxy's address, such as 127.0.0.1."));
            }
        });
        return builder;
    }

    public static async Task InitializeDatabaseAsync(this WebApplication app)
    {
        ArgumentNullException.ThrowIfNull(app);
        var organisation = app.Services.GetRequiredService<IOptions<OrganisationOptions>>().Value;
        await app.Services.GetRequiredService<DatabaseInitializer>()
            .InitializeAsync(organisation.ToProfile(), app.Lifetime.ApplicationStopping)
            .ConfigureAwait(false);
        using IServiceScope scope = app.Services.CreateScope();
        await scope.ServiceProvider.GetRequiredService<IdentityStore>().InitializeAsync(app.Lifetime.ApplicationStopping).ConfigureAwait(false);

        // The signing certificate is loaded (or the development one made) on first run, not at the first sign-off.
        var certificate = app.Services.GetRequiredService<CapReview.Packets.Signing.PacketCertificateSource>().Get(organisation.Name);
        if (certificate.Development)
        {
            DevelopmentSigning(app.Logger, app.Services.GetRequiredService<PacketOptions>().Signing.DevelopmentCertificatePath);
        }
        if (app.Services.GetRequiredService<AuditKeySettings>().KeyFile is { } keyFile)
        {
            AuditKeyInFile(app.Logger, keyFile);
        }
    }

    [LoggerMessage(Level = LogLevel.Warning, Message = "The audit chain is keyed from {Path}: keep that file out of the database's backups and out of reach of whoever can write to the database, or configure Audit:Keys.")]
    private static partial void AuditKeyInFile(ILogger logger, string path);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Packets are signed with a development certificate ({Path}); configure Packets:Signing:CertificatePath for the organisation's.")]
    private static partial void DevelopmentSigning(ILogger logger, string path);

    /// <summary>In demo mode (Demo:Enabled), writes the demo data into an empty database and prints the sign-ins.</summary>
    public static async Task EnsureDemoAsync(this WebApplication app)
    {
        ArgumentNullException.ThrowIfNull(app);
        if (app.Configuration.GetValue<bool>("Demo:Enabled"))
        {
            using IServiceScope scope = app.Services.CreateScope();
            await scope.ServiceProvider.GetRequiredService<DemoScenario>().EnsureAsync(app.Lifetime.ApplicationStopping).ConfigureAwait(false);
        }
    }

    /// <summary>
    /// Outside development, a setting still holding the samples' placeholder (deploy/capreview.env.sample: a database
    /// password, a certificate password) stops the start with its name, rather than running on a known credential.
    /// </summary>
    private static void RefuseSamplePlaceholders(WebApplicationBuilder builder)
    {
        if (builder.Environment.IsDevelopment())
        {
            return;
        }
        var placeholders = builder.Configuration.AsEnumerable().Where(p => p.Value?.Contains("CHANGE-ME", StringComparison.Ordinal) == true).Select(p => p.Key).ToList();
        if (placeholders.Count > 0)
        {
            throw new InvalidOperationException($"Replace the sample's CHANGE-ME in {string.Join(", ", placeholders)} before starting CapReview.");
        }
    }

    private static bool IsApi(HttpContext context) => IdentityRegistration.IsMachineReadable(context);

    public static WebApplication UseCapReview(this WebApplication app)
    {
        ArgumentNullException.ThrowIfNull(app);
        app.UseForwardedHeaders();
        app.UseRequestIds();
        app.UseSecurityHeaders();
        if (!app.Environment.IsDevelopment())
        {
            app.UseExceptionHandler("/error", createScopeForErrors: true);
            // HTTPS only, as the proxy in front serves it (deploy/nginx); the probes answer on plain HTTP too, for
            // the monitoring on the server itself.
            app.UseHsts();
            app.UseWhen(context => !context.Request.Path.StartsWithSegments("/health"), https => https.UseHttpsRedirection());
        }
        // Inside the exception handler: a database lost mid-run is a 503 with its own explanation, not an error page.
        app.UseDatabaseGate();
        // Every request, and so every interactive circuit it starts, runs in the organisation's culture: the inputs
        // bound to numbers and dates read and write them as the organisation does, whatever the browser or server says.
        var culture = app.Services.GetRequiredService<Formatting.DisplayFormat>().Culture;
        app.UseRequestLocalization(new RequestLocalizationOptions
        {
            DefaultRequestCulture = new Microsoft.AspNetCore.Localization.RequestCulture(culture, culture),
            SupportedCultures = [culture],
            SupportedUICultures = [culture],
            RequestCultureProviders = [],
        });
        // Pages show the not-found page; the API answers its bare status codes with problem details instead.
        app.UseWhen(IsApi, api => api.UseStatusCodePages());
        app.UseWhen(context => !IsApi(context), pages => pages.UseStatusCodePagesWithReExecute("/not-found", createScopeForStatusCodePages: true));
        // Routing after the status-code pages, so the re-executed request for /not-found is routed to its page (with
        // the implicit routing at the start of the pipeline it found no endpoint and answered an empty 404).
        app.UseRouting();
        app.UseSecurityLog();
        app.UseAuthentication();
        app.UseAccountSetupRequirement(app.Configuration);
        app.UseRateLimiter();
        app.UseAuthorization();
        app.UseAntiforgery();
        app.MapStaticAssets();
        app.MapOpenApi("/openapi/{documentName}.json").RequireAuthorization(IdentityRegistration.Api);
        app.MapEvaluationEndpoints();
        app.MapRiskAnalysisEndpoints();
        app.MapHealthEndpoints();
        app.MapCycleEndpoints();
        app.MapPortfolioEndpoints();
        app.MapVersionAnalysisEndpoints();
        app.MapProposalEndpoints();
        app.MapProposalWorkflowEndpoints();
        app.MapBoardEndpoints();
        app.MapAdministrationEndpoints();
        app.MapAdministrationCorrectionEndpoints();
        app.MapAuditEndpoints();
        app.MapCycleDocumentEndpoints();
        app.MapAccountEndpoints();
        app.MapExportEndpoints();
        app.MapPacketEndpoints();
        // Our own Content-Security-Policy (Operations/SecurityHeaders) already forbids framing; Blazor's would be a second header.
        app.MapRazorComponents<App>().AddInteractiveServerRenderMode(options => options.ContentSecurityFrameAncestorsPolicy = null);
        return app;
    }
}
