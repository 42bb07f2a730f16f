using CapReview.Reviews.Common;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.ChangeTracking;
using Microsoft.EntityFrameworkCore.Diagnostics;

namespace CapReview.Reviews.Storage;

/// <summary>
/// Refuses a save of text holding a NUL character (U+0000), naming its field: PostgreSQL cannot store one in any text
/// column and SQLite cuts text short at it, so it would fail with a 500 on one provider and lose text on the other.
/// Here, once, rather than in every service that takes text (titles, comments, conditions, names, reasons).
/// </summary>
public sealed class StorableTextInterceptor : SaveChangesInterceptor
{
    /// <summary>Stateless, so one instance serves every context.</summary>
    public static StorableTextInterceptor Instance { get; } = new();

    private StorableTextInterceptor()
    {
    }

    public override InterceptionResult<int> SavingChanges(DbContextEventData eventData, InterceptionResult<int> result)
    {
        ArgumentNullException.ThrowIfNull(eventData);
        Refuse(eventData.Context);
        return result;
    }

    public override ValueTask<InterceptionResult<int>> SavingChangesAsync(DbContextEventData eventData, InterceptionResult<int> result,
        CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(eventData);
        Refuse(eventData.Context);
        return ValueTask.FromResult(result);
    }

    private static void Refuse(DbContext? context)
    {
        if (context is null)
        {
            return;
        }
        foreach (EntityEntry entry in context.ChangeTracker.Entries().Where(e => e.State is EntityState.Added or EntityState.Modified))
        {
            foreach (PropertyEntry property in entry.Properties)
            {
                if (property.CurrentValue is string text && text.Contains('\0', StringComparison.Ordinal))
                {
                    string field = char.ToLowerInvariant(property.Metadata.Name[0]) + property.Metadata.Name[1..];
                    throw new RuleViolationException($"{field}: the text holds an invisible NUL character (U+0000), which cannot be stored; remove it.");
                }
            }
        }
    }
}
