using CapReview.Web.Identity;

namespace CapReview.Web.Hosting;

/// <summary>
/// Verbs of the web app for a fresh install, so that automation never needs a browser:
/// <c>create-admin --email a@b --name "A B" --password …</c>, <c>issue-token --email a@b --token-name ci</c> and
/// <c>revoke-tokens --email a@b</c> (every token of that person; other app servers refuse them within 30 seconds) and
/// <c>audit-head</c> (prints where the audit chain stands and appends it to <c>Audit:HeadLog</c> when one is set: run it
/// on a schedule and keep the log where the database's writers cannot reach).
/// </summary>
public static class CommandLine
{
    private static readonly string[] Verbs = ["create-admin", "issue-token", "revoke-tokens", "audit-head"];

    public static bool Handles(string[] args) => args is [var verb, ..] && Verbs.Contains(verb);

    public static async Task<int> RunAsync(WebApplication app, string[] args)
    {
        ArgumentNullException.ThrowIfNull(app);
        ArgumentNullException.ThrowIfNull(args);
        var options = Options(args);
        using var scope = app.Services.CreateScope();
        var identity = scope.ServiceProvider.GetRequiredService<IdentityStore>();
        try
        {
            switch (args[0])
            {
                case "audit-head":
                    var head = await scope.ServiceProvider.GetRequiredService<Reviews.Audit.AuditQueries>().HeadAsync(CancellationToken.None).ConfigureAwait(false);
                    var log = scope.ServiceProvider.GetRequiredService<Reviews.Audit.AuditHeadLog>();
                    if (log.Path is not null)
                    {
                        log.Append(head);
                    }
                    await Console.Out.WriteLineAsync(head.ToLine()).ConfigureAwait(false);
                    return 0;
                case "create-admin":
                    var user = await identity.CreateUserAsync(Required(options, "email"), Required(options, "name"), Required(options, "password"), [RoleNames.Administrator]).ConfigureAwait(false);
                    await Console.Out.WriteLineAsync($"Administrator {user.Email} created.").ConfigureAwait(false);
                    return 0;
                case "revoke-tokens":
                    var holder = await FindAsync(identity, options).ConfigureAwait(false);
                    int revoked = await scope.ServiceProvider.GetRequiredService<ApiTokenService>().RevokeAllAsync(holder.Id, CancellationToken.None).ConfigureAwait(false);
                    await Console.Out.WriteLineAsync($"{revoked} API token(s) of {holder.Email} revoked.").ConfigureAwait(false);
                    return 0;
                default:
                    var owner = await FindAsync(identity, options).ConfigureAwait(false);
                    string token = await scope.ServiceProvider.GetRequiredService<ApiTokenService>()
                        .IssueAsync(owner.Id, options.GetValueOrDefault("token-name") ?? "command line", CancellationToken.None).ConfigureAwait(false);
                    await Console.Out.WriteLineAsync(token).ConfigureAwait(false);
                    return 0;
            }
        }
        catch (InvalidOperationException ex)
        {
            await Console.Error.WriteLineAsync($"{args[0]}: {ex.Message}").ConfigureAwait(false);
            return 2;
        }
    }

    private static async Task<CapReviewUser> FindAsync(IdentityStore identity, Dictionary<string, string> options)
    {
        string email = Required(options, "email");
        return await identity.FindByEmailAsync(email).ConfigureAwait(false) ?? throw new InvalidOperationException($"There is no user {email}.");
    }

    private static Dictionary<string, string> Options(string[] args)
    {
        var options = new Dictionary<string, string>(StringComparer.Ordinal);
        for (int k = 1; k + 1 < args.Length; k += 2)
        {
            if (args[k].StartsWith("--", StringComparison.Ordinal))
            {
                options[args[k][2..]] = args[k + 1];
            }
        }
        return options;
    }

    private static string Required(Dictionary<string, string> options, string name) =>
        options.TryGetValue(name, out string? value) && !string.IsNullOrWhiteSpace(value)
            ? value
            : throw new InvalidOperationException($"Give --{name}.");
}
