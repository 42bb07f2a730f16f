using CapReview.Web.Hosting;

WebApplicationBuilder builder = WebApplication.CreateBuilder(args);
builder.AddCapReview();

WebApplication app = builder.Build();
await app.InitializeDatabaseAsync();
app.UseCapReview();
await app.RunAsync();

/// <summary>The web host; public so that tests can start the real app.</summary>
public partial class Program;
