using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Storage;

/// <summary>
/// Hands out a provider's own context type where the services ask for the shared one: each provider's context type
/// carries its own migrations (SQLite and PostgreSQL need different ones), the services need not know which.
/// </summary>
public sealed class DerivedContextFactory<TContext, TDerived>(IDbContextFactory<TDerived> derived) : IDbContextFactory<TContext>
    where TContext : DbContext
    where TDerived : TContext
{
    public TContext CreateDbContext() => derived.CreateDbContext();

    public async Task<TContext> CreateDbContextAsync(CancellationToken cancellationToken = default) =>
        await derived.CreateDbContextAsync(cancellationToken).ConfigureAwait(false);
}
