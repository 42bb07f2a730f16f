using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Design;

namespace CapReview.Reviews.Storage.PostgreSql;

/// <summary>The domain's database on PostgreSQL: the same model, with the migrations in this folder.</summary>
public sealed class PostgreSqlReviewsDbContext(DbContextOptions<PostgreSqlReviewsDbContext> options) : CapReviewDbContext(options);

/// <summary>Lets <c>dotnet ef migrations add … --context PostgreSqlReviewsDbContext</c> build the context without a server.</summary>
internal sealed class PostgreSqlDesignTimeFactory : IDesignTimeDbContextFactory<PostgreSqlReviewsDbContext>
{
    public PostgreSqlReviewsDbContext CreateDbContext(string[] args) =>
        new(new DbContextOptionsBuilder<PostgreSqlReviewsDbContext>().UseNpgsql("Host=localhost;Database=design_time").Options);
}
