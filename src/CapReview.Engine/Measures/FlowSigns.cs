namespace CapReview.Engine.Measures;

/// <summary>
/// The sign evidence of a cash-flow sequence, gathered in two passes: sign changes of the flows, of their running
/// sums from the start and from the end, and the cumulative (Norström) test. Values within 1e-12 of the gross flow count
/// as zero and are skipped.
/// </summary>
/// <param name="FlowChanges">Sign changes of the flows.</param>
/// <param name="ForwardCumulativeChanges">Sign changes of the running sums from period 0.</param>
/// <param name="BackwardCumulativeChanges">Sign changes of the running sums from period n.</param>
/// <param name="CumulativeTestPassed">Norström's test.</param>
/// <param name="Total">Σ F_t, the worth at i = 0.</param>
/// <param name="Gross">Σ |F_t|.</param>
/// <param name="Receipts">Σ of the positive flows.</param>
/// <param name="Payments">Σ of the magnitudes of the negative flows.</param>
/// <param name="MeanTimeGap">Mean time of the receipts less mean time of the payments (weighted by amount).</param>
internal readonly record struct FlowSigns(
    int FlowChanges,
    int ForwardCumulativeChanges,
    int BackwardCumulativeChanges,
    bool CumulativeTestPassed,
    double Total,
    double Gross,
    double Receipts,
    double Payments,
    double MeanTimeGap)
{
    public static FlowSigns Of(ReadOnlySpan<double> flows)
    {
        double gross = 0.0;
        double total = 0.0;
        double receipts = 0.0, payments = 0.0, receiptTime = 0.0, paymentTime = 0.0;
        for (int t = 0; t < flows.Length; t++)
        {
            double f = flows[t];
            gross += Math.Abs(f);
            total += f;
            double received = Math.Max(f, 0.0);
            double paid = received - f;
            receipts += received;
            payments += paid;
            receiptTime += t * received;
            paymentTime += t * paid;
        }
        double negligible = 1e-12 * gross;

        // The running sums from the end are total − S_(t−1); sign changes read the same in either direction, so one
        // pass counts all three sequences.
        var flowSigns = new SignCounter(negligible);
        var forward = new SignCounter(negligible);
        var backward = new SignCounter(negligible);
        double running = 0.0;
        for (int t = 0; t < flows.Length; t++)
        {
            backward.Add(total - running);
            flowSigns.Add(flows[t]);
            running += flows[t];
            forward.Add(running);
        }

        // Norström (1972): cumulative flows that start negative, change sign once and end non-zero.
        bool cumulativeTest = forward.First < 0 && forward.Changes == 1 && Math.Abs(total) > negligible;
        double gap = receipts > 0.0 && payments > 0.0 ? receiptTime / receipts - paymentTime / payments : 0.0;
        return new FlowSigns(flowSigns.Changes, forward.Changes, backward.Changes, cumulativeTest, total, gross, receipts, payments, gap);
    }

    private struct SignCounter(double negligible)
    {
        private int _last;

        public int Changes { get; private set; }

        public int First { get; private set; }

        public void Add(double value)
        {
            if (Math.Abs(value) <= negligible)
            {
                return;
            }
            int sign = value > 0.0 ? 1 : -1;
            if (_last != 0 && sign != _last)
            {
                Changes++;
            }
            if (First == 0)
            {
                First = sign;
            }
            _last = sign;
        }
    }
}
