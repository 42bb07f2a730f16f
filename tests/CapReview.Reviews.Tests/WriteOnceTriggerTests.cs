using CapReview.Reviews.Storage;
using Microsoft.EntityFrameworkCore;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests;

/// <summary>
/// The database's own triggers (migration WriteOnceTriggers): bulk updates and deletes and raw SQL never pass through
/// the change tracker, yet cannot change or delete a row written once. Runs on SQLite, and on PostgreSQL when
/// CAPREVIEW_TEST_POSTGRES is set.
/// </summary>
public sealed class WriteOnceTriggerTests(ReviewsDatabase db) : IClassFixture<ReviewsDatabase>
{
    public static TheoryData<string> Tables => [.. WrittenOnceRows.TriggerTables];

    private static Task<int> BulkUpdateAsync(CapReviewDbContext c, string table, WrittenOnceRow row)
    {
        int id = checked((int)row.Id);
        return table switch
        {
            "proposal_version" => c.ProposalVersions.Where(x => x.Id == id).ExecuteUpdateAsync(s => s.SetProperty(x => x.Reason, "changed")),
            "decision" => c.Decisions.Where(x => x.Id == id).ExecuteUpdateAsync(s => s.SetProperty(x => x.Conditions, "changed")),
            "sign_off" => c.SignOffs.Where(x => x.Id == id).ExecuteUpdateAsync(s => s.SetProperty(x => x.DisplayName, "changed")),
            "marr_policy_version" => c.MarrPolicyVersions.Where(x => x.Id == id).ExecuteUpdateAsync(s => s.SetProperty(x => x.Reason, "changed")),
            "audit_event" => c.AuditEvents.Where(x => x.Id == row.Id).ExecuteUpdateAsync(s => s.SetProperty(x => x.UserId, "changed")),
            "approval_packet" => c.ApprovalPackets.Where(x => x.Id == id).ExecuteUpdateAsync(s => s.SetProperty(x => x.FileName, "changed")),
            _ => throw new ArgumentOutOfRangeException(nameof(table)),
        };
    }

    private static Task<int> BulkDeleteAsync(CapReviewDbContext c, string table, WrittenOnceRow row)
    {
        int id = checked((int)row.Id);
        return table switch
        {
            "proposal_version" => c.ProposalVersions.Where(x => x.Id == id).ExecuteDeleteAsync(),
            "decision" => c.Decisions.Where(x => x.Id == id).ExecuteDeleteAsync(),
            "sign_off" => c.SignOffs.Where(x => x.Id == id).ExecuteDeleteAsync(),
            "marr_policy_version" => c.MarrPolicyVersions.Where(x => x.Id == id).ExecuteDeleteAsync(),
            "audit_event" => c.AuditEvents.Where(x => x.Id == row.Id).ExecuteDeleteAsync(),
            "approval_packet" => c.ApprovalPackets.Where(x => x.Id == id).ExecuteDeleteAsync(),
            _ => throw new ArgumentOutOfRangeException(nameof(table)),
        };
    }

    /// <summary>The refusal is the database's: its message, wherever the provider puts it, says the row is written once.</summary>
    private static async Task AssertRefusedAsync(Func<Task> act)
    {
        Exception? error = await Record.ExceptionAsync(act);
        Assert.NotNull(error);
        string messages = "";
        for (Exception? e = error; e is not null; e = e.InnerException)
        {
            messages += e.Message + "\n";
        }
        Assert.Contains("written once", messages);
    }

    private async Task AssertUnchangedAsync(string table, WrittenOnceRow row)
    {
        await using var context = db.NewContext();
        object? entity = await context.FindAsync(row.Entity, row.Key);
        Assert.NotNull(entity);
        Assert.Equal(row.Value, context.Entry(entity).Property(row.Column).CurrentValue);
        // Counted in SQL too, so that no tracked copy can stand in for the stored row.
        string count = $"SELECT COUNT(*) AS \"Value\" FROM {table} WHERE \"Id\" = {row.Id}";
        Assert.Equal(1, await context.Database.SqlQueryRaw<int>(count).SingleAsync());
    }

    [Theory]
    [MemberData(nameof(Tables))]
    public async Task A_bulk_update_is_refused(string table)
    {
        var rows = await WrittenOnceRows.CreateAsync(db, $"Bulk update {table}");
        await using (var context = db.NewContext())
        {
            await AssertRefusedAsync(() => BulkUpdateAsync(context, table, rows[table]));
        }
        await AssertUnchangedAsync(table, rows[table]);
    }

    [Theory]
    [MemberData(nameof(Tables))]
    public async Task A_bulk_delete_is_refused(string table)
    {
        var rows = await WrittenOnceRows.CreateAsync(db, $"Bulk delete {table}");
        await using (var context = db.NewContext())
        {
            await AssertRefusedAsync(() => BulkDeleteAsync(context, table, rows[table]));
        }
        await AssertUnchangedAsync(table, rows[table]);
    }

    [Theory]
    [MemberData(nameof(Tables))]
    public async Task Raw_sql_cannot_update_or_delete(string table)
    {
        var rows = await WrittenOnceRows.CreateAsync(db, $"Raw SQL {table}");
        WrittenOnceRow row = rows[table];
        await using (var context = db.NewContext())
        {
            string update = $"UPDATE {table} SET \"{row.Column}\" = 'changed' WHERE \"Id\" = {row.Id}";
            await AssertRefusedAsync(() => context.Database.ExecuteSqlRawAsync(update));
            string delete = $"DELETE FROM {table} WHERE \"Id\" = {row.Id}";
            await AssertRefusedAsync(() => context.Database.ExecuteSqlRawAsync(delete));
            // Every row at once, the way a careless script would.
            string deleteAll = $"DELETE FROM {table}";
            await AssertRefusedAsync(() => context.Database.ExecuteSqlRawAsync(deleteAll));
        }
        await AssertUnchangedAsync(table, row);
    }

    [Theory]
    [MemberData(nameof(Tables))]
    public async Task Truncating_is_refused_on_postgresql(string table)
    {
        await using var context = db.NewContext();
        if (!context.Database.IsNpgsql())
        {
            // SQLite has no TRUNCATE; its DELETE without WHERE fires the triggers (Raw_sql_cannot_update_or_delete).
            return;
        }
        var rows = await WrittenOnceRows.CreateAsync(db, $"Truncate {table}");
        // CASCADE, so that a referencing table cannot be what refuses.
        string truncate = $"TRUNCATE {table} CASCADE";
        await AssertRefusedAsync(() => context.Database.ExecuteSqlRawAsync(truncate));
        await AssertUnchangedAsync(table, rows[table]);
    }

    [Fact]
    public async Task A_draft_version_takes_updates_including_the_one_that_freezes_it_and_none_after()
    {
        var draft = await db.Proposals.CreateDraftAsync(Lead, Draft(), CancellationToken.None);
        await using var context = db.NewContext();
        var versions = context.ProposalVersions.Where(v => v.ProposalId == draft.Id);
        Assert.Equal(1, await versions.ExecuteUpdateAsync(s => s.SetProperty(v => v.Reason, "Edited while a draft")));
        Assert.Equal(1, await versions.ExecuteUpdateAsync(s => s.SetProperty(v => v.IsFrozen, true)));
        await AssertRefusedAsync(() => versions.ExecuteUpdateAsync(s => s.SetProperty(v => v.Reason, "Edited after freezing")));
        await AssertRefusedAsync(() => versions.ExecuteUpdateAsync(s => s.SetProperty(v => v.IsFrozen, false)));
        var stored = await versions.AsNoTracking().SingleAsync();
        Assert.Equal("Edited while a draft", stored.Reason);
        Assert.True(stored.IsFrozen);
    }
}
