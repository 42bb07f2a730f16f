using CapReview.Reviews.Storage;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Tests;

/// <summary>
/// Lifts a table's write-once triggers, as only the database's owner could, so that a test can play the tampering the
/// audit chain and the packet hashes must still detect.
/// </summary>
internal static class TriggerBypass
{
    public static async Task LiftAsync(CapReviewDbContext context, string table)
    {
        if (context.Database.IsNpgsql())
        {
            string disable = $"ALTER TABLE {table} DISABLE TRIGGER USER";
            await context.Database.ExecuteSqlRawAsync(disable);
            return;
        }
        foreach (string operation in new[] { "update", "delete" })
        {
            string drop = $"DROP TRIGGER IF EXISTS \"{table}_written_once_{operation}\"";
            await context.Database.ExecuteSqlRawAsync(drop);
        }
    }
}
