using CapReview.Web.Hosting;

WebApplicationBuilder builder = WebApplication.CreateBuilder(args);
builder.AddCapReview();

WebApplication app = builder.Build();
if (CommandLine.Handles(args))
{
    await app.InitializeDatabaseAsync();
    return await CommandLine.RunAsync(app, args);
}
await app.Services.GetRequiredService<CapReview.Web.Operations.DatabasePreparation>().StartAsync(app);
app.UseCapReview();
await app.RunAsync();
return 0;

/// <summary>The web host; public so that tests can start the real app.</summary>
public partial class Program;
