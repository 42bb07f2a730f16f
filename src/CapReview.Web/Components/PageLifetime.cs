using Microsoft.AspNetCore.Components.Server.Circuits;

namespace CapReview.Web.Components;

/// <summary>
/// How long an interactive page's work should go on: until its connection to the browser drops or its circuit closes.
/// Blazor keeps a disconnected circuit for minutes in case the browser comes back, and disposes the page's components
/// only then; a simulation or solver run tied to them alone would run on for a page nobody sees. Runs link their
/// cancellation to <see cref="Token"/>, which is cancelled the moment the connection goes down; a page that reconnects
/// starts its next run on a fresh token. One per circuit (scoped).
/// </summary>
public sealed class PageLifetime : CircuitHandler, IDisposable
{
    private readonly Lock _gate = new();
    private CancellationTokenSource _connected = new();

    /// <summary>Cancelled when the browser's connection goes down or the circuit closes.</summary>
    public CancellationToken Token
    {
        get
        {
            lock (_gate)
            {
                return _connected.Token;
            }
        }
    }

    public override Task OnConnectionUpAsync(Circuit circuit, CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            if (_connected.IsCancellationRequested)
            {
                _connected.Dispose();
                _connected = new CancellationTokenSource();
            }
        }
        return Task.CompletedTask;
    }

    public override Task OnConnectionDownAsync(Circuit circuit, CancellationToken cancellationToken)
    {
        Stop();
        return Task.CompletedTask;
    }

    public override Task OnCircuitClosedAsync(Circuit circuit, CancellationToken cancellationToken)
    {
        Stop();
        return Task.CompletedTask;
    }

    /// <summary>Cancels the runs of the page now (the connection went down).</summary>
    public void Stop()
    {
        CancellationTokenSource connected;
        lock (_gate)
        {
            connected = _connected;
        }
        connected.Cancel();
    }

    public void Dispose()
    {
        lock (_gate)
        {
            _connected.Dispose();
        }
    }
}
