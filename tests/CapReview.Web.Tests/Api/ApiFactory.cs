using System.Net.Http.Headers;
using CapReview.Engine.CashFlows;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Access;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;
using CapReview.Web.Identity;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Api;

/// <summary>The real app in memory, on a temporary database of its own (SQLite, or PostgreSQL: see <see cref="CapReview.TestSupport.TestDatabase"/>).</summary>
public sealed class ApiFactory : WebApplicationFactory<Program>
{
    private readonly string _folder = Directory.CreateTempSubdirectory("capreview-api-").FullName;
    private CapReview.TestSupport.TestDatabase? _database;

    public CapReview.TestSupport.TestDatabase Database => _database ??= CapReview.TestSupport.TestDatabase.Create(Path.Combine(_folder, "capreview.db"));

    protected override void ConfigureWebHost(IWebHostBuilder builder)
    {
        builder.UseEnvironment("Development");
        builder.UseSetting("Storage:Provider", Database.Settings.Provider.ToString());
        builder.UseSetting("ConnectionStrings:CapReview", Database.Settings.ConnectionString);
        builder.UseSetting("Demo:Enabled", "false");
        // The tests sign in far more often than a person would; OperationsTests restores the real limit to test it.
        builder.UseSetting("RateLimits:SignInPerMinute", "100000");
    }

    private AuthenticationHeaderValue? _leadToken;

    /// <summary>A client that sends a personal API token of a project lead created for these tests, issued once per factory.</summary>
    public async Task<HttpClient> CreateAuthenticatedClientAsync()
    {
        if (_leadToken is null)
        {
            var (first, _) = await TokenClientAsync("api.tests@tarnby.example", RoleNames.ProjectLead);
            _leadToken = first.DefaultRequestHeaders.Authorization;
            return first;
        }
        HttpClient client = CreateClient();
        client.DefaultRequestHeaders.Authorization = _leadToken;
        return client;
    }

    /// <summary>A client that sends a new personal API token of the user with this e-mail (created with the role when missing), and the user's id.</summary>
    public async Task<(HttpClient Client, string UserId)> TokenClientAsync(string email, string role)
    {
        using var scope = Services.CreateScope();
        var identity = scope.ServiceProvider.GetRequiredService<IdentityStore>();
        var user = await identity.FindByEmailAsync(email) ?? await identity.CreateUserAsync(email, email, "amber-kettle-2027", [role]);
        string token = await scope.ServiceProvider.GetRequiredService<ApiTokenService>().IssueAsync(user.Id, "tests", CancellationToken.None);
        HttpClient client = CreateClient();
        client.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", token);
        return (client, user.Id);
    }

    /// <summary>
    /// An open cycle under a MARR policy of its own (effective <paramref name="marr"/>) with the draft of a project lead
    /// submitted to it; the cycle and the proposal as submitted.
    /// </summary>
    public async Task<(BudgetCycle Cycle, ProposalView Proposal)> CycleWithSubmittedProposalAsync(string cycleName, double marr, ProposalDraft draft, string leadId = "cycle-lead")
    {
        var admin = Actor.Of("cycle-admin", "Cycle Admin", Role.Administrator);
        var lead = Actor.Of(leadId, "Cycle Lead", Role.ProjectLead);
        var policy = await Services.GetRequiredService<MarrPolicyService>().AddVersionAsync(admin,
            new NewMarrPolicy(marr, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), cycleName + " policy"), CancellationToken.None);
        var cycle = await Services.GetRequiredService<CycleService>().CreateAsync(admin,
            new NewBudgetCycle(cycleName, 500_000m, policy.Id, new DateOnly(2027, 1, 1), new DateOnly(2027, 3, 31)), CancellationToken.None);
        var proposals = Services.GetRequiredService<ProposalService>();
        var created = await proposals.CreateDraftAsync(lead, draft, CancellationToken.None);
        return (cycle, await proposals.SubmitAsync(lead, created.Id, cycle.Id, created.Revision, CancellationToken.None));
    }

    /// <summary>A draft of one first cost and a level yearly saving, as leads write them.</summary>
    public static ProposalDraft Draft(string title, int horizon, double cost, double saving, string costLabel = "Purchase", string savingLabel = "Saving",
        CashFlowCategory savingCategory = CashFlowCategory.Revenue, string description = "", ProposalCategory category = ProposalCategory.CostReduction) =>
        new(title, description, category, RiskClass.Standard, new ProposalAssumptions
        {
            Model = new ModelSpec
            {
                Horizon = horizon,
                Elements =
                [
                    new ElementSpec { Type = ElementKind.Single, Label = costLabel, Category = CashFlowCategory.Capital, Period = 0, Amount = -cost },
                    new ElementSpec { Type = ElementKind.Uniform, Label = savingLabel, Category = savingCategory, First = 1, Last = horizon, Amount = saving },
                ],
            },
        }, null);

    protected override void Dispose(bool disposing)
    {
        base.Dispose(disposing);
        if (disposing)
        {
            _database?.DisposeAsync().AsTask().GetAwaiter().GetResult();
            try
            {
                Directory.Delete(_folder, recursive: true);
            }
            catch (IOException)
            {
                // Left for the system's temporary-file cleanup.
            }
        }
    }
}
