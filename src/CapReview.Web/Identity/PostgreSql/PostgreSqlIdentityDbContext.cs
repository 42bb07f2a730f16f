using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Design;

namespace CapReview.Web.Identity;

/// <summary>Users, roles and tokens on PostgreSQL: the same model, with the migrations in Identity/PostgreSql/Migrations.</summary>
public sealed class PostgreSqlIdentityDbContext(DbContextOptions<PostgreSqlIdentityDbContext> options) : CapReviewIdentityDbContext(options);

/// <summary>Lets <c>dotnet ef migrations add … --context PostgreSqlIdentityDbContext</c> build the context without a server.</summary>
internal sealed class PostgreSqlIdentityDesignTimeFactory : IDesignTimeDbContextFactory<PostgreSqlIdentityDbContext>
{
    public PostgreSqlIdentityDbContext CreateDbContext(string[] args) =>
        new(new DbContextOptionsBuilder<PostgreSqlIdentityDbContext>()
            .UseNpgsql("Host=localhost;Database=design_time", npgsql => npgsql.MigrationsHistoryTable(CapReviewIdentityDbContext.MigrationsHistoryTable)).Options);
}
