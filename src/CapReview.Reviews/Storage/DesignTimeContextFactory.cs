using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Design;

namespace CapReview.Reviews.Storage;

/// <summary>Lets <c>dotnet ef migrations add</c> build the context without starting the web app.</summary>
internal sealed class DesignTimeContextFactory : IDesignTimeDbContextFactory<CapReviewDbContext>
{
    public CapReviewDbContext CreateDbContext(string[] args) =>
        new(new DbContextOptionsBuilder<CapReviewDbContext>().UseSqlite("Data Source=design-time.db").Options);
}
