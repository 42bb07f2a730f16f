using CapReview.Web.Formatting;
using CapReview.Web.Hosting;
using CapReview.Web.QuickEvaluation;
using Microsoft.AspNetCore.Components;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Components;

/// <summary>A bUnit context with the services the evaluation components use, interactive, Plotly's JS calls allowed.</summary>
internal static class ComponentTestContext
{
    public static BunitContext Create()
    {
        var context = new BunitContext();
        context.JSInterop.Mode = JSRuntimeMode.Loose;
        context.Services.AddSingleton(new DisplayFormat(new OrganisationOptions { CultureName = "en-IE", CurrencyCode = "EUR" }));
        context.Services.AddSingleton(new CapReview.Reviews.Runs.RunLimitOptions());
        context.Services.AddSingleton<CapReview.Reviews.Runs.RunLimiter>();
        context.Services.AddSingleton<CapReview.Reviews.Risk.RiskRuns>();
        context.Services.AddScoped<CapReview.Web.Components.PageLifetime>();
        context.SetRendererInfo(new RendererInfo("Server", isInteractive: true));
        return context;
    }

    public static QuickEvaluationState Example()
    {
        var state = new QuickEvaluationState(ExampleModel.HeatRecoveryRetrofit(), System.Globalization.CultureInfo.GetCultureInfo("en-IE"));
        state.Recalculate();
        return state;
    }
}
