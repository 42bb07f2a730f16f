using CapReview.Engine.CashFlows;
using CapReview.Engine.Risk;
using CapReview.Engine.Specifications;

namespace CapReview.Engine.Tests.Risk;

/// <summary>A cancelled simulation stops between trials, not at the end of a block of 1,024.</summary>
public class CancellationTests
{
    // The life varied, so every trial takes the full evaluation: the slow path a block of which takes longest.
    private static readonly ProposalCase Line = new(new ModelSpec
    {
        Horizon = 600,
        PeriodsPerYear = 12,
        Rate = new RateSpec { Value = 0.08 },
        Elements =
        [
            new ElementSpec { Type = ElementKind.Single, Label = "Line", Category = CashFlowCategory.Capital, Period = 0, Amount = -2_000_000 },
            new ElementSpec { Type = ElementKind.Uniform, Label = "Margin", Category = CashFlowCategory.Revenue, First = 1, Last = 400, Amount = 30_000 },
        ],
    });

    [Fact]
    public void A_cancellation_stops_each_worker_within_one_trial()
    {
        UncertainParameter life = new("Life", "horizon", 450, 500, 600);
        using var cancel = new CancellationTokenSource();
        int done = 0, afterCancel = 0;
        void TrialDone(int trial)
        {
            if (cancel.IsCancellationRequested)
            {
                Interlocked.Increment(ref afterCancel);
            }
            else if (Interlocked.Increment(ref done) == 10)
            {
                cancel.Cancel();
            }
        }
        Assert.ThrowsAny<OperationCanceledException>(() =>
            MonteCarlo.Simulate(Line, [life], 100_000, 7, correlations: null, progress: null, TrialDone, cancel.Token));
        // Every other worker finishes at most the trial it was in when the token was cancelled (common practice, no source:
        // the loop checks the token before each trial). Before, each finished its block of up to 1,024.
        Assert.InRange(afterCancel, 0, Environment.ProcessorCount - 1);
    }

    [Fact]
    public void A_cancelled_token_runs_no_trial()
    {
        using var cancel = new CancellationTokenSource();
        cancel.Cancel();
        int trials = 0;
        Assert.ThrowsAny<OperationCanceledException>(() =>
            MonteCarlo.Simulate(Line, [new UncertainParameter("Life", "horizon", 450, 500, 600)], 10_000, 7, null, null, _ => Interlocked.Increment(ref trials), cancel.Token));
        Assert.Equal(0, trials);
    }
}
