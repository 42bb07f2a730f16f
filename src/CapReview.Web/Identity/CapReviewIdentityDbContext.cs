using Microsoft.AspNetCore.DataProtection.EntityFrameworkCore;
using Microsoft.AspNetCore.Identity.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Web.Identity;

/// <summary>
/// Users, roles, API tokens and the data-protection keys, in the same database as the domain but in a context and migration history of their
/// own, so that the domain project knows users only by their ids.
/// </summary>
public class CapReviewIdentityDbContext : IdentityDbContext<CapReviewUser>, IDataProtectionKeyContext
{
    public CapReviewIdentityDbContext(DbContextOptions<CapReviewIdentityDbContext> options)
        : base(options)
    {
    }

    /// <summary>For a provider's own context type (<see cref="PostgreSqlIdentityDbContext"/>), which carries its own migrations.</summary>
    protected CapReviewIdentityDbContext(DbContextOptions options)
        : base(options)
    {
    }

    public const string MigrationsHistoryTable = "__identity_migrations_history";

    public DbSet<ApiToken> ApiTokens => Set<ApiToken>();

    /// <summary>The keys that protect sign-in cookies and antiforgery tokens, shared by every app server of the installation.</summary>
    public DbSet<DataProtectionKey> DataProtectionKeys => Set<DataProtectionKey>();

    protected override void OnModelCreating(ModelBuilder builder)
    {
        base.OnModelCreating(builder);
        builder.Entity<CapReviewUser>(u => u.Property(x => x.DisplayName).HasMaxLength(200));
        builder.Entity<ApiToken>(t =>
        {
            t.ToTable("api_token");
            t.Property(x => x.UserId).HasMaxLength(450);
            t.Property(x => x.Name).HasMaxLength(100);
            t.Property(x => x.TokenHash).HasMaxLength(64);
            t.HasIndex(x => x.TokenHash).IsUnique();
            t.HasOne<CapReviewUser>().WithMany().HasForeignKey(x => x.UserId).OnDelete(DeleteBehavior.Cascade);
        });
    }
}
