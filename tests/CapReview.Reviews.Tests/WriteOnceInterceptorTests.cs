using CapReview.Reviews.Common;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Storage;
using CapReview.Reviews.Storage.PostgreSql;
using Microsoft.EntityFrameworkCore;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests;

/// <summary>
/// The save interceptor: a row written once, changed or removed through EF's own API (the entities offer no setter),
/// is refused on save with the domain's message, and the stored row keeps its value.
/// </summary>
public sealed class WriteOnceInterceptorTests(ReviewsDatabase db) : IClassFixture<ReviewsDatabase>
{
    /// <summary>Each table and the refusal its users see, written out here.</summary>
    public static TheoryData<string, string> Refusals => new()
    {
        { "proposal_version", "A submitted version is frozen: it cannot be changed or deleted. Make a new version instead." },
        { "decision", "Decisions and sign-offs are written once: record a new decision instead." },
        { "sign_off", "Decisions and sign-offs are written once: record a new decision instead." },
        { "proposal_comment", "Decisions and sign-offs are written once: record a new decision instead." },
        { "marr_policy_version", "A MARR policy version cannot be changed or deleted; add a new version." },
        { "audit_event", "The audit trail is append-only." },
        { "approval_packet", "An approval packet is stored once and never changed." },
    };

    private static async Task<string> StoredValueAsync(CapReviewDbContext context, WrittenOnceRow row)
    {
        object entity = (await context.FindAsync(row.Entity, row.Key))!;
        return (string)context.Entry(entity).Property(row.Column).CurrentValue!;
    }

    [Theory]
    [MemberData(nameof(Refusals))]
    public async Task A_change_is_refused_on_save(string table, string message)
    {
        var rows = await WrittenOnceRows.CreateAsync(db, $"Interceptor change {table}");
        WrittenOnceRow row = rows[table];
        await using (var context = db.NewContext())
        {
            object entity = (await context.FindAsync(row.Entity, row.Key))!;
            context.Entry(entity).Property(row.Column).CurrentValue = "changed";
            var error = await Assert.ThrowsAsync<RuleViolationException>(() => context.SaveChangesAsync());
            Assert.Equal(message, error.Message);
        }
        await using var check = db.NewContext();
        Assert.Equal(row.Value, await StoredValueAsync(check, row));
    }

    [Theory]
    [MemberData(nameof(Refusals))]
    public async Task A_removal_is_refused_on_save(string table, string message)
    {
        var rows = await WrittenOnceRows.CreateAsync(db, $"Interceptor removal {table}");
        WrittenOnceRow row = rows[table];
        await using (var context = db.NewContext())
        {
            context.Remove((await context.FindAsync(row.Entity, row.Key))!);
            var error = Assert.Throws<RuleViolationException>(() => context.SaveChanges());
            Assert.Equal(message, error.Message);
        }
        await using var check = db.NewContext();
        Assert.Equal(row.Value, await StoredValueAsync(check, row));
    }

    [Fact]
    public async Task Thawing_a_frozen_version_is_a_change_to_it()
    {
        var rows = await WrittenOnceRows.CreateAsync(db, "Interceptor thaw");
        await using var context = db.NewContext();
        var version = await context.ProposalVersions.SingleAsync(v => v.Id == (int)rows["proposal_version"].Id);
        context.Entry(version).Property(v => v.IsFrozen).CurrentValue = false;
        Assert.Throws<RuleViolationException>(() => context.SaveChanges());
    }

    [Fact]
    public async Task A_draft_version_may_still_change()
    {
        var draft = await db.Proposals.CreateDraftAsync(Lead, Draft(), CancellationToken.None);
        await using (var context = db.NewContext())
        {
            var version = await context.ProposalVersions.SingleAsync(v => v.ProposalId == draft.Id);
            context.Entry(version).Property(v => v.Reason).CurrentValue = "Renamed while a draft";
            Assert.Equal(1, await context.SaveChangesAsync());
        }
        Assert.Equal("Renamed while a draft", (await db.Proposals.GetAsync(Lead, draft.Id, CancellationToken.None)).Latest.Reason);
    }

    [Fact]
    public async Task A_context_built_from_bare_options_refuses_too()
    {
        var rows = await WrittenOnceRows.CreateAsync(db, "Interceptor bare options");
        string connection;
        bool postgreSql;
        await using (var configured = db.NewContext())
        {
            connection = configured.Database.GetConnectionString()!;
            postgreSql = configured.Database.IsNpgsql();
        }
        // No registration code runs here: the context adds the interceptor itself, whichever provider.
        await using CapReviewDbContext context = postgreSql
            ? new PostgreSqlReviewsDbContext(new DbContextOptionsBuilder<PostgreSqlReviewsDbContext>().UseNpgsql(connection).Options)
            : new CapReviewDbContext(new DbContextOptionsBuilder<CapReviewDbContext>().UseSqlite(connection).Options);
        var decision = await context.Decisions.SingleAsync(d => d.Id == (int)rows["decision"].Id);
        context.Entry(decision).Property(d => d.Conditions).CurrentValue = "changed";
        Assert.Throws<RuleViolationException>(() => context.SaveChanges());
    }
}
