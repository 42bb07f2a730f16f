using CapReview.Reviews.Organisation;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Storage;

/// <summary>The installation's database. Create one per operation through IDbContextFactory.</summary>
public sealed class CapReviewDbContext(DbContextOptions<CapReviewDbContext> options) : DbContext(options)
{
    public DbSet<OrganisationProfile> Organisations => Set<OrganisationProfile>();

    protected override void OnModelCreating(ModelBuilder modelBuilder)
    {
        ArgumentNullException.ThrowIfNull(modelBuilder);
        modelBuilder.Entity<OrganisationProfile>(profile =>
        {
            profile.ToTable("organisation");
            profile.Property(p => p.Id).ValueGeneratedNever();
            profile.Property(p => p.Name).HasMaxLength(200);
            profile.Property(p => p.CurrencyCode).HasMaxLength(3);
            profile.Property(p => p.CultureName).HasMaxLength(20);
        });
    }
}
