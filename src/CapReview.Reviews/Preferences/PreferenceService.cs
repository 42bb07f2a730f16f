using CapReview.Reviews.Access;
using CapReview.Reviews.Common;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Preferences;

/// <summary>
/// What the app remembers for each user (the last cycle, a page's filters). Conveniences, not records: not audited,
/// and a value that cannot be stored is dropped rather than failing the page.
/// </summary>
public sealed class PreferenceService(ReviewWork work, TimeProvider clock)
{
    public const int MaxNameLength = 60;
    public const int MaxValueLength = 2000;

    /// <summary>The name of the preference holding the id of the cycle the user last opened.</summary>
    public const string LastCycle = "last-cycle";

    public Task<string?> GetAsync(Actor actor, string name, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        return work.ReadAsync(db => db.UserPreferences.Where(p => p.UserId == actor.UserId && p.Name == name).Select(p => p.Value)
            .SingleOrDefaultAsync(cancellationToken), cancellationToken);
    }

    public async Task SetAsync(Actor actor, string name, string value, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        ArgumentNullException.ThrowIfNull(name);
        ArgumentNullException.ThrowIfNull(value);
        if (name.Length > MaxNameLength || value.Length > MaxValueLength)
        {
            return;
        }
        await work.RunAsync(async db =>
        {
            var stored = await db.UserPreferences.SingleOrDefaultAsync(p => p.UserId == actor.UserId && p.Name == name, cancellationToken).ConfigureAwait(false);
            if (stored is null)
            {
                db.UserPreferences.Add(new UserPreference { UserId = actor.UserId, Name = name, Value = value, UpdatedAt = clock.GetUtcNow() });
            }
            else if (stored.Value != value)
            {
                stored.Value = value;
                stored.UpdatedAt = clock.GetUtcNow();
            }
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            return true;
        }, cancellationToken).ConfigureAwait(false);
    }
}
