using CapReview.Reviews.Storage;
using CapReview.Web.Hosting;
using Microsoft.AspNetCore.Authentication;
using Microsoft.AspNetCore.DataProtection;
using Microsoft.AspNetCore.DataProtection.AuthenticatedEncryption;
using Microsoft.AspNetCore.DataProtection.AuthenticatedEncryption.ConfigurationModel;
using Microsoft.AspNetCore.Identity;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Web.Identity;

/// <summary>
/// Sign-in for people (Identity cookie) and for automation (personal API tokens), and the policies that guard pages
/// and endpoints.
/// </summary>
public static class IdentityRegistration
{
    /// <summary>Pages: a signed-in person.</summary>
    public const string SignedIn = "signed-in";

    /// <summary>JSON endpoints: a cookie or an API token.</summary>
    public const string Api = "api";

    /// <summary>A cycle's ranking and portfolio downloads: a cookie or an API token, of the board, finance or an administrator.</summary>
    public const string BoardDownloads = "board-downloads";

    /// <param name="services">The app's services.</param>
    /// <param name="database">Where the accounts, tokens and data-protection keys are kept.</param>
    /// <param name="secureCookiesOnly">
    /// Outside development: every cookie (session, two-step, form) is sent over HTTPS only and carries the __Host-
    /// prefix (<see cref="CookieRules"/>).
    /// </param>
    /// <param name="sessions">How long a browser session lasts and how often it is checked against the account.</param>
    public static IServiceCollection AddCapReviewIdentity(this IServiceCollection services, DatabaseSettings database, bool secureCookiesOnly, SessionLimits sessions)
    {
        ArgumentNullException.ThrowIfNull(database);
        if (database.Provider == DatabaseProvider.PostgreSql)
        {
            services.AddDbContextFactory<PostgreSqlIdentityDbContext>(options => database.Apply(options, CapReviewIdentityDbContext.MigrationsHistoryTable));
            services.AddSingleton<IDbContextFactory<CapReviewIdentityDbContext>, DerivedContextFactory<CapReviewIdentityDbContext, PostgreSqlIdentityDbContext>>();
            // Identity's stores ask for the shared type within a request's scope.
            services.AddScoped<CapReviewIdentityDbContext>(sp => sp.GetRequiredService<PostgreSqlIdentityDbContext>());
        }
        else
        {
            services.AddDbContextFactory<CapReviewIdentityDbContext>(options => database.Apply(options, CapReviewIdentityDbContext.MigrationsHistoryTable));
        }
        // Every app server reads the same keys, so a cookie or form made by one is accepted by the others.
        // AES-256-GCM for the cookies and forms; new keys every 90 days (the framework's default), old ones kept to read old cookies.
        services.AddDataProtection().SetApplicationName("CapReview").PersistKeysToDbContext<CapReviewIdentityDbContext>()
            .UseCryptographicAlgorithms(new AuthenticatedEncryptorConfiguration
            {
                EncryptionAlgorithm = EncryptionAlgorithm.AES_256_GCM,
                ValidationAlgorithm = ValidationAlgorithm.HMACSHA256,
            });
        services.AddIdentityCore<CapReviewUser>(options =>
            {
                options.User.RequireUniqueEmail = true;
                // Length and a check against guessable passwords (PasswordStrengthValidator), no composition rules.
                options.Password.RequiredLength = 10;
                options.Password.RequireNonAlphanumeric = false;
                options.Password.RequireUppercase = false;
                options.Password.RequireLowercase = false;
                options.Password.RequireDigit = false;
                options.Password.RequiredUniqueChars = 1;
                options.Tokens.AuthenticatorTokenProvider = SingleUseAuthenticatorTokenProvider.Name;
                options.Lockout.MaxFailedAccessAttempts = 8;
                options.Lockout.DefaultLockoutTimeSpan = TimeSpan.FromMinutes(10);
            })
            .AddPasswordValidator<PasswordStrengthValidator>()
            .AddRoles<IdentityRole>()
            .AddEntityFrameworkStores<CapReviewIdentityDbContext>()
            .AddUserStore<HashedRecoveryCodeStore>()
            .AddUserManager<CapReviewUserManager>()
            .AddSignInManager()
            .AddClaimsPrincipalFactory<DisplayNameClaimsFactory>()
            .AddDefaultTokenProviders()
            .AddTokenProvider<SingleUseAuthenticatorTokenProvider>(SingleUseAuthenticatorTokenProvider.Name);

        services.AddAuthentication(options =>
            {
                options.DefaultScheme = IdentityConstants.ApplicationScheme;
                options.DefaultSignInScheme = IdentityConstants.ExternalScheme;
            })
            .AddIdentityCookies();
        services.AddAuthentication()
            .AddScheme<AuthenticationSchemeOptions, ApiTokenAuthenticationHandler>(ApiTokenAuthenticationHandler.SchemeName, null);
        // Identity's other cookies: the one that carries a person from the password to the code, and two that
        // CapReview never sets (it remembers no device and has no external sign-in), under the same rules all the same.
        foreach (var (scheme, name) in new[]
        {
            (IdentityConstants.TwoFactorUserIdScheme, "capreview-two-step"),
            (IdentityConstants.TwoFactorRememberMeScheme, "capreview-device"),
            (IdentityConstants.ExternalScheme, "capreview-external"),
        })
        {
            services.Configure<Microsoft.AspNetCore.Authentication.Cookies.CookieAuthenticationOptions>(scheme, cookie => CookieRules.Apply(cookie.Cookie, name, secureCookiesOnly));
        }
        services.ConfigureApplicationCookie(cookie =>
        {
            CookieRules.Apply(cookie.Cookie, "capreview", secureCookiesOnly);
            cookie.LoginPath = "/signin";
            cookie.AccessDeniedPath = "/denied";
            cookie.ExpireTimeSpan = sessions.Idle;
            cookie.SlidingExpiration = true;
            cookie.Events.OnSigningIn = sessions.OnSigningIn;
            // The sign-in page decides where to go next (ReturnAddress). The handler would first redirect a sign-in
            // made on /signin to its ReturnUrl as decoded, unchecked; with a "ü" in it that is a header Kestrel
            // refuses, and the sign-in answered without a place to go.
            cookie.Events.OnRedirectToReturnUrl = _ => Task.CompletedTask;
            cookie.Events.OnValidatePrincipal = sessions.OnValidatePrincipal;
            // The API answers 401 and 403; only pages redirect to the sign-in form.
            cookie.Events.OnRedirectToLogin = context => Answer(context, StatusCodes.Status401Unauthorized);
            cookie.Events.OnRedirectToAccessDenied = context =>
            {
                if (!IsMachineReadable(context.HttpContext))
                {
                    // A page sends the visitor to /denied with a redirect; the API's 403 is logged as it is sent.
                    ILogger log = context.HttpContext.RequestServices.GetRequiredService<ILoggerFactory>().CreateLogger(SecurityLog.Category);
                    SecurityLog.Refused(log, StatusCodes.Status403Forbidden, context.Request.Method, context.Request.Path, SecurityLog.UserOf(context.HttpContext.User),
                        SecurityLog.Address(context.HttpContext));
                }
                return Answer(context, StatusCodes.Status403Forbidden);
            };
        });
        services.Configure<SecurityStampValidatorOptions>(options =>
        {
            options.ValidationInterval = sessions.StampCheck;
            // A session signed in with two steps stays one when its claims are renewed from the account.
            options.OnRefreshingPrincipal = context =>
            {
                if (context.CurrentPrincipal?.FindFirst("amr") is { } method && context.NewPrincipal?.Identity is System.Security.Claims.ClaimsIdentity renewed)
                {
                    renewed.AddClaim(new System.Security.Claims.Claim(method.Type, method.Value));
                }
                return Task.CompletedTask;
            };
        });
        services.AddAntiforgery(antiforgery => CookieRules.Apply(antiforgery.Cookie, "capreview-form", secureCookiesOnly));
        services.AddAuthorizationBuilder()
            .AddPolicy(SignedIn, policy => policy.RequireAuthenticatedUser())
            .AddPolicy(Api, policy => policy
                .AddAuthenticationSchemes(IdentityConstants.ApplicationScheme, ApiTokenAuthenticationHandler.SchemeName)
                .RequireAuthenticatedUser())
            .AddPolicy(BoardDownloads, policy => policy
                .AddAuthenticationSchemes(IdentityConstants.ApplicationScheme, ApiTokenAuthenticationHandler.SchemeName)
                .RequireRole(RoleNames.Reviewer, RoleNames.Finance, RoleNames.Administrator));
        services.AddCascadingAuthenticationState();
        services.AddSingleton(sessions);
        services.AddScoped<Microsoft.AspNetCore.Components.Authorization.AuthenticationStateProvider, CircuitSessionCheck>();
        services.AddSingleton<ApiTokenService>();
        services.AddSingleton<ApiTokenCache>();
        services.AddSingleton<CapReview.Reviews.Interchange.IPeopleDirectory, PeopleDirectory>();
        services.AddScoped<IdentityStore>();
        services.AddScoped<TwoStepSignIn>();
        services.AddScoped<PasswordSignIn>();
        services.AddSingleton<UnknownAccountHash>();
        services.AddSingleton<UserAdministration>();
        return services;
    }

    /// <summary>
    /// The JSON API and its OpenAPI document, and any request sent with an API token (a download fetched by a
    /// script): answered with status codes, never with the sign-in page.
    /// </summary>
    public static bool IsMachineReadable(HttpContext context)
    {
        ArgumentNullException.ThrowIfNull(context);
        return context.Request.Path.StartsWithSegments("/api", StringComparison.OrdinalIgnoreCase)
            || ApiTokenAuthenticationHandler.PresentsToken(context.Request)
            || context.Request.Path.StartsWithSegments("/openapi", StringComparison.OrdinalIgnoreCase);
    }

    private static Task Answer(Microsoft.AspNetCore.Authentication.RedirectContext<Microsoft.AspNetCore.Authentication.Cookies.CookieAuthenticationOptions> context, int status)
    {
        if (IsMachineReadable(context.HttpContext))
        {
            context.Response.StatusCode = status;
        }
        else
        {
            context.Response.Redirect(context.RedirectUri);
        }
        return Task.CompletedTask;
    }
}
