using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Design;

namespace CapReview.Web.Identity;

/// <summary>Lets <c>dotnet ef migrations add --context CapReviewIdentityDbContext</c> build the context without the host.</summary>
internal sealed class DesignTimeIdentityContextFactory : IDesignTimeDbContextFactory<CapReviewIdentityDbContext>
{
    public CapReviewIdentityDbContext CreateDbContext(string[] args) =>
        new(new DbContextOptionsBuilder<CapReviewIdentityDbContext>()
            .UseSqlite("Data Source=design-time.db", o => o.MigrationsHistoryTable(CapReviewIdentityDbContext.MigrationsHistoryTable))
            .Options);
}
