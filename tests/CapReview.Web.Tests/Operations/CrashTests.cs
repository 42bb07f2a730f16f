using System.Collections.Concurrent;
using System.Net;
using System.Net.Http.Headers;
using System.Net.Http.Json;
using System.Text.Json;
using CapReview.Reviews.Audit;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Storage;
using CapReview.Web.Tests.Api;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Operations;

/// <summary>
/// The app killed with SIGKILL in the middle of a burst of saves, three times over: every save it acknowledged is
/// there after the restart, and no save is there in part (a proposal without its reference, version or audit event,
/// a version whose hash does not match its assumptions, a broken audit chain, a damaged database file).
/// </summary>
public sealed class CrashTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private const int Writers = 8;

    [Fact]
    public async Task Killed_during_a_burst_of_saves_the_app_loses_no_acknowledged_version_and_leaves_none_half_written()
    {
        // The in-process app migrates the database and issues the token; the child process does the saving.
        var (lead, _) = await factory.TokenClientAsync("crash.lead@tarnby.example", Identity.RoleNames.ProjectLead);
        AuthenticationHeaderValue token = lead.DefaultRequestHeaders.Authorization!;
        var acknowledged = new ConcurrentDictionary<string, (string Reference, string Hash)>();
        int attempted = 0;

        for (int round = 0; round < 3; round++)
        {
            await using AppProcess app = await AppProcess.StartAsync(factory.Database.Settings);
            using var stop = new CancellationTokenSource();
            using var client = new HttpClient { BaseAddress = app.Address };
            client.DefaultRequestHeaders.Authorization = token;
            Task[] writers = [.. Enumerable.Range(0, Writers).Select(w => Task.Run(async () =>
            {
                while (!stop.IsCancellationRequested)
                {
                    string title = $"Burst {round}-{w}-{Interlocked.Increment(ref attempted)}";
                    try
                    {
                        using var answer = await client.PostAsJsonAsync("/api/v1/proposals", Draft(title), stop.Token);
                        Assert.Equal(HttpStatusCode.Created, answer.StatusCode);
                        using var body = JsonDocument.Parse(await answer.Content.ReadAsStringAsync(stop.Token));
                        acknowledged[title] = (body.RootElement.GetProperty("reference").GetString()!,
                            body.RootElement.GetProperty("versions")[0].GetProperty("assumptionsHash").GetString()!);
                    }
                    catch (Exception ex) when (ex is HttpRequestException or OperationCanceledException)
                    {
                        // The process was killed under this request: it may or may not have committed.
                    }
                }
            })), ];

            // Kill at a different point of the burst each round, with saves in flight.
            int target = acknowledged.Count + 40 + (round * 17);
            for (int k = 0; k < 400 && acknowledged.Count < target; k++)
            {
                await Task.Delay(25);
            }
            Assert.True(acknowledged.Count >= target, "The burst made too few saves before the kill. The app wrote:\n" + app.Output);
            await app.KillAsync();
            await stop.CancelAsync();
            await Task.WhenAll(writers);
        }

        // A fresh start after the last kill comes up ready on the same database.
        await using (AppProcess after = await AppProcess.StartAsync(factory.Database.Settings))
        {
            using var client = new HttpClient { BaseAddress = after.Address };
            client.DefaultRequestHeaders.Authorization = token;
            using var list = await client.GetAsync(new Uri("/api/v1/proposals", UriKind.Relative));
            Assert.Equal(HttpStatusCode.OK, list.StatusCode);
        }

        await using CapReviewDbContext db = await factory.Services.GetRequiredService<IDbContextFactory<CapReviewDbContext>>().CreateDbContextAsync();
        var stored = await db.Proposals.AsNoTracking().Include(p => p.Versions).Where(p => p.Title.StartsWith("Burst ")).ToListAsync();
        var created = await db.AuditEvents.AsNoTracking().Where(e => e.Action == "proposal.created").Select(e => e.EntityId).ToListAsync();

        foreach (var (title, (reference, hash)) in acknowledged)
        {
            Proposal proposal = Assert.Single(stored, p => p.Title == title);
            Assert.Equal(reference, proposal.Reference);
            Assert.Equal(hash, Assert.Single(proposal.Versions).AssumptionsHash);
        }
        foreach (Proposal proposal in stored)
        {
            Assert.Matches("^P-[0-9]{4}$", proposal.Reference);
            ProposalVersion version = Assert.Single(proposal.Versions);
            Assert.Equal(AssumptionsDocument.Hash(version.AssumptionsJson), version.AssumptionsHash);
            Assert.Contains(proposal.Reference, created);
        }
        // Saves in flight at a kill may have committed before their answer was sent, never more than one per writer.
        Assert.InRange(stored.Count, acknowledged.Count, acknowledged.Count + (3 * Writers));
        Assert.Equal(stored.Count, created.Count);
        Assert.Equal(stored.Count, stored.Select(p => p.Reference).Distinct().Count());

        AuditVerification chain = await factory.Services.GetRequiredService<AuditTrail>().VerifyAsync(db, [], CancellationToken.None);
        Assert.True(chain.Intact, chain.Message);
        if (!factory.Database.IsPostgreSql)
        {
            await db.Database.OpenConnectionAsync();
            await using var check = db.Database.GetDbConnection().CreateCommand();
            check.CommandText = "PRAGMA integrity_check";
            Assert.Equal("ok", await check.ExecuteScalarAsync());
        }
    }

    private static object Draft(string title) => new
    {
        title,
        category = "costReduction",
        riskClass = "low",
        assumptions = new
        {
            model = new
            {
                horizon = 6,
                elements = new object[]
                {
                    new { type = "single", label = "Press refit", category = "capital", period = 0, amount = -52_000 },
                    new { type = "uniform", label = "Scrap avoided", category = "operating", first = 1, last = 6, amount = 13_500 },
                },
            },
        },
    };
}
