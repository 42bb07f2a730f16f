using CapReview.Web.Hosting;

WebApplicationBuilder builder = WebApplication.CreateBuilder(args);
builder.AddCapReview();

WebApplication app = builder.Build();
await app.InitializeDatabaseAsync();
if (CommandLine.Handles(args))
{
    return await CommandLine.RunAsync(app, args);
}
await app.EnsureDemoAsync();
app.UseCapReview();
await app.RunAsync();
return 0;

/// <summary>The web host; public so that tests can start the real app.</summary>
public partial class Program;
