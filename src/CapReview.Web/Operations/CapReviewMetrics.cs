using System.Diagnostics.Metrics;
using Microsoft.AspNetCore.Components.Server.Circuits;

namespace CapReview.Web.Operations;

/// <summary>
/// The figures of our own an operator watches, on the meter "CapReview" (read with dotnet-counters or any
/// OpenTelemetry collector): how long evaluations take, and how many interactive circuits are open. Request rate and
/// errors come from ASP.NET Core's own meters.
/// </summary>
public sealed class CapReviewMetrics : IDisposable
{
    public const string MeterName = "CapReview";

    private readonly Meter _meter = new(MeterName);
    private readonly Histogram<double> _evaluation;
    private readonly UpDownCounter<int> _circuits;

    public CapReviewMetrics()
    {
        _evaluation = _meter.CreateHistogram<double>("capreview.evaluation.duration", "ms", "Time to validate and evaluate one model, every measure included.");
        _circuits = _meter.CreateUpDownCounter<int>("capreview.circuits.open", "{circuit}", "Interactive pages' circuits open on this server.");
    }

    public void Evaluated(TimeSpan took) => _evaluation.Record(took.TotalMilliseconds);

    public void CircuitOpened() => _circuits.Add(1);

    public void CircuitClosed() => _circuits.Add(-1);

    public void Dispose() => _meter.Dispose();
}

/// <summary>Counts the circuits as Blazor opens and closes them.</summary>
public sealed class CircuitCounter(CapReviewMetrics metrics) : CircuitHandler
{
    public override Task OnCircuitOpenedAsync(Circuit circuit, CancellationToken cancellationToken)
    {
        metrics.CircuitOpened();
        return Task.CompletedTask;
    }

    public override Task OnCircuitClosedAsync(Circuit circuit, CancellationToken cancellationToken)
    {
        metrics.CircuitClosed();
        return Task.CompletedTask;
    }
}
