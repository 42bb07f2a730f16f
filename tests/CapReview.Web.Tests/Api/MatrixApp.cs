using System.Collections.Concurrent;
using System.Net;
using CapReview.Engine.CashFlows;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Access;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Records;
using CapReview.Web.Identity;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Api;

/// <summary>
/// The app the authorisation matrix runs against: three cycles of two proposals each, in one exclusive group, by a lead
/// who is not the matrix's: one open; one in review, its first proposal already approved by the board but the cycle not
/// signed off; one decided by two sign-offs (first proposal approved, second rejected) with its packets made. Each
/// role signs in once through the real form; its cookie is kept for every request of the matrix.
/// </summary>
public sealed class MatrixApp : IAsyncLifetime
{
    public const string Password = "matrix-tests-2027";

    private static readonly Actor Admin = Actor.Of("matrix-setup", "Matrix setup", Role.Administrator);
    private static readonly Actor Owner = Actor.Of("matrix-owner", "Matrix owner", Role.ProjectLead);
    private static readonly Actor FirstBoard = Actor.Of("matrix-board-1", "Matrix board one", Role.Reviewer);
    private static readonly Actor SecondBoard = Actor.Of("matrix-board-2", "Matrix board two", Role.Reviewer);

    private readonly ConcurrentDictionary<string, string> _cookies = new(StringComparer.Ordinal);
    private readonly Dictionary<CycleStatus, MatrixCycle> _cycles = [];

    public ApiFactory Factory { get; } = new();

    /// <summary>The cycle in each state the matrix tests: <see cref="CycleStatus.Open"/>, <see cref="CycleStatus.InReview"/> and <see cref="CycleStatus.Decided"/>.</summary>
    public MatrixCycle this[CycleStatus state] => _cycles[state];

    public async Task InitializeAsync()
    {
        var services = Factory.Services;
        var marr = await services.GetRequiredService<MarrPolicyService>().AddVersionAsync(Admin,
            new NewMarrPolicy(0.08, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "Matrix policy"), CancellationToken.None);
        foreach (CycleStatus state in new[] { CycleStatus.Open, CycleStatus.InReview, CycleStatus.Decided })
        {
            _cycles[state] = await CycleAsync(services, marr.Id, state);
        }
    }

    private static async Task<MatrixCycle> CycleAsync(IServiceProvider services, int marrId, CycleStatus state)
    {
        var cycles = services.GetRequiredService<CycleService>();
        var proposals = services.GetRequiredService<ProposalService>();
        var decisions = services.GetRequiredService<DecisionService>();
        var cycle = await cycles.CreateAsync(Admin, new NewBudgetCycle($"Matrix cycle {state}", 1_000_000m, marrId, new DateOnly(2027, 1, 1), new DateOnly(2027, 3, 31)), CancellationToken.None);
        var first = await SubmittedAsync(proposals, cycle.Id, $"Matrix proposal {state}");
        var second = await SubmittedAsync(proposals, cycle.Id, $"Matrix alternative {state}");
        await services.GetRequiredService<PortfolioRulesService>().SaveGroupAsync(Admin, cycle.Id,
            new GroupDraft($"Matrix group {state}", false, [first.Id, second.Id]), CancellationToken.None);
        if (state == CycleStatus.Open)
        {
            return new MatrixCycle(cycle.Id, first.Id, second.Id, null);
        }
        if (state == CycleStatus.InReview)
        {
            await cycles.MoveAsync(Admin, cycle.Id, CycleStatus.InReview, cycle.Revision, CancellationToken.None);
            // Approved but not signed off: the cycle is not decided, so finance still may not see it.
            await decisions.DecideAsync(FirstBoard, first.Id, DecisionOutcome.Approve, "", first.Revision, CancellationToken.None);
            return new MatrixCycle(cycle.Id, first.Id, second.Id, null);
        }
        await decisions.DecideAsync(FirstBoard, first.Id, DecisionOutcome.Approve, "", first.Revision, CancellationToken.None);
        await decisions.DecideAsync(FirstBoard, second.Id, DecisionOutcome.Reject, "", second.Revision, CancellationToken.None);
        await decisions.SignOffAsync(FirstBoard, cycle.Id, CancellationToken.None);
        await decisions.SignOffAsync(SecondBoard, cycle.Id, CancellationToken.None);
        return new MatrixCycle(cycle.Id, first.Id, second.Id, await PacketOfAsync(services, cycle.Id, first.Id));
    }

    private static async Task<ProposalView> SubmittedAsync(ProposalService proposals, int cycleId, string title)
    {
        var written = new ProposalDraft(title, "", ProposalCategory.Other, RiskClass.Standard, new ProposalAssumptions
        {
            Model = new ModelSpec
            {
                Horizon = 2,
                Elements =
                [
                    new ElementSpec { Type = ElementKind.Single, Label = "a", Category = CashFlowCategory.Capital, Period = 0, Amount = -100 },
                    new ElementSpec { Type = ElementKind.Uniform, Label = "b", Category = CashFlowCategory.Revenue, First = 1, Last = 2, Amount = 60 },
                ],
            },
        }, null);
        var draft = await proposals.CreateDraftAsync(Owner, written, CancellationToken.None);
        return await proposals.SubmitAsync(Owner, draft.Id, cycleId, draft.Revision, CancellationToken.None);
    }

    /// <summary>Waits for the packet worker to make the decided cycle's packets; the id of the first proposal's.</summary>
    private static async Task<int> PacketOfAsync(IServiceProvider services, int cycleId, int proposalId)
    {
        var jobs = services.GetRequiredService<PacketJobs>();
        for (int wait = 0; wait < 600; wait++)
        {
            var job = await jobs.StatusAsync(Admin, cycleId, CancellationToken.None);
            if (job?.Status == PacketJobStatus.Done)
            {
                var packets = await services.GetRequiredService<PacketArchive>().ListAsync(Admin, cycleId, CancellationToken.None);
                return packets.Single(p => p.Kind == PacketKind.Proposal && p.ProposalId == proposalId).Id;
            }
            Assert.NotEqual(PacketJobStatus.Failed, job?.Status);
            await Task.Delay(200);
        }
        throw new TimeoutException("The decided cycle's packets were not made within two minutes.");
    }

    /// <summary>
    /// A client without a cookie jar: anonymous, or sending the cookie of the role's matrix user (created and signed in
    /// through the form on first use).
    /// </summary>
    public async Task<HttpClient> ClientAsync(string? role)
    {
        HttpClient client = Factory.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false, HandleCookies = false });
        if (role is not null)
        {
            client.DefaultRequestHeaders.Add("Cookie", await CookieAsync(role));
        }
        return client;
    }

    private async Task<string> CookieAsync(string role)
    {
        if (_cookies.TryGetValue(role, out string? cookie))
        {
            return cookie;
        }
        string email = $"matrix.{role.ToLowerInvariant()}@tarnby.example";
        using (var scope = Factory.Services.CreateScope())
        {
            var identity = scope.ServiceProvider.GetRequiredService<IdentityStore>();
            if (await identity.FindByEmailAsync(email) is null)
            {
                await identity.CreateUserAsync(email, $"Matrix {role}", Password, [role]);
            }
        }
        using HttpClient browser = FormSignIn.NewBrowser(Factory);
        using HttpResponseMessage signedIn = await FormSignIn.PostAsync(browser, email, Password);
        Assert.True(signedIn.StatusCode is HttpStatusCode.Redirect or HttpStatusCode.Found, $"sign-in as {role} answered {signedIn.StatusCode}");
        cookie = signedIn.Headers.GetValues("Set-Cookie").Single(c => c.StartsWith("capreview=", StringComparison.Ordinal)).Split(';')[0];
        return _cookies.GetOrAdd(role, cookie);
    }

    private IReadOnlyDictionary<string, string>? _badTokens;

    /// <summary>
    /// Tokens no API route may accept, by kind: one never issued, one not even of the token's shape, one revoked, and
    /// one of an account that was disabled after it was issued. Made once.
    /// </summary>
    public async Task<IReadOnlyDictionary<string, string>> BadTokensAsync()
    {
        if (_badTokens is not null)
        {
            return _badTokens;
        }
        var (revokedClient, revokedUser) = await Factory.TokenClientAsync("matrix.revoked.token@tarnby.example", RoleNames.Administrator);
        var (disabledClient, disabledUser) = await Factory.TokenClientAsync("matrix.disabled.token@tarnby.example", RoleNames.Administrator);
        string revoked = revokedClient.DefaultRequestHeaders.Authorization!.Parameter!;
        string disabled = disabledClient.DefaultRequestHeaders.Authorization!.Parameter!;
        revokedClient.Dispose();
        disabledClient.Dispose();
        await Factory.Services.GetRequiredService<ApiTokenService>().RevokeAllAsync(revokedUser, CancellationToken.None);
        await Factory.Services.GetRequiredService<UserAdministration>().SetDisabledAsync(Admin, disabledUser, disabled: true);
        return _badTokens = new Dictionary<string, string>(StringComparer.Ordinal)
        {
            ["never issued"] = "crv_" + new string('Q', 43),
            ["not a token"] = "not-a-token",
            ["revoked"] = revoked,
            ["of a disabled account"] = disabled,
        };
    }

    public Task DisposeAsync()
    {
        Factory.Dispose();
        return Task.CompletedTask;
    }
}
