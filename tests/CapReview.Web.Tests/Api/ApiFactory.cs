using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;

namespace CapReview.Web.Tests.Api;

/// <summary>The real app in memory, on a temporary SQLite file of its own.</summary>
public sealed class ApiFactory : WebApplicationFactory<Program>
{
    private readonly string _folder = Directory.CreateTempSubdirectory("capreview-api-").FullName;

    public string DatabaseFile => Path.Combine(_folder, "capreview.db");

    protected override void ConfigureWebHost(IWebHostBuilder builder)
    {
        builder.UseEnvironment("Development");
        builder.UseSetting("ConnectionStrings:CapReview", $"Data Source={DatabaseFile};Pooling=False");
    }

    protected override void Dispose(bool disposing)
    {
        base.Dispose(disposing);
        if (disposing)
        {
            try
            {
                Directory.Delete(_folder, recursive: true);
            }
            catch (IOException)
            {
                // Left for the system's temporary-file cleanup.
            }
        }
    }
}
