using System.Numerics;
using System.Runtime.Intrinsics;

namespace CapReview.Engine.Measures;

/// <summary>
/// The sign evidence of a cash-flow sequence: sign changes of the flows (exact: every non-zero flow counts) and of their
/// running sums from the start and from the end, the cumulative (Norström) test, and the totals the first guess of a
/// rate needs. A running sum within its own rounding error of zero, (k + 1)·ε·Σ|F| over its k + 1 terms, counts as zero
/// and is skipped. For the common case of a single sign change it takes one pass.
/// </summary>
/// <param name="FlowChanges">Sign changes of the flows.</param>
/// <param name="ForwardCumulativeChanges">Sign changes of the running sums from period 0.</param>
/// <param name="BackwardCumulativeChanges">Sign changes of the running sums from period n; −1 (not counted) when the flows change sign once.</param>
/// <param name="CumulativeTestPassed">Norström's test.</param>
/// <param name="FirstSign">Sign of the first non-zero flow: the sign of the present worth as i → ∞.</param>
/// <param name="LastSign">Sign of the last non-zero flow: the sign of the future worth as i → −100%.</param>
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
    int FirstSign,
    int LastSign,
    double Total,
    double Gross,
    double Receipts,
    double Payments,
    double MeanTimeGap)
{
    private const double Epsilon = 2.3e-16;

    public static FlowSigns Of(ReadOnlySpan<double> flows)
    {
        (double gross, double total, double receipts, double receiptTime, double paymentTime,
            double firstNonZero, double lastNonZero, int flowChanges) = Accumulate(flows);
        int firstSign = Math.Sign(firstNonZero), lastSign = Math.Sign(lastNonZero);
        int totalSign = SignOf(total, flows.Length * Epsilon * gross);

        int forwardChanges, backwardChanges, firstForward;
        if (flowChanges == 1)
        {
            // One sign change: the running sums keep the first flow's sign, then move monotonically the other way, so
            // they change sign once exactly when the total has the other sign. The sums from the end are not needed:
            // the root's side follows from the signs alone (see RateOfReturnSearch).
            firstForward = firstSign;
            forwardChanges = totalSign == -firstSign ? 1 : 0;
            backwardChanges = -1;
        }
        else
        {
            (forwardChanges, firstForward) = RunningChanges(flows, fromEnd: false);
            (backwardChanges, _) = RunningChanges(flows, fromEnd: true);
        }
        double payments = receipts - total;
        double gap = receipts > 0.0 && payments > 0.0 ? receiptTime / receipts - paymentTime / payments : 0.0;
        // Norström (1972): cumulative flows that start negative, change sign once and end non-zero.
        bool cumulativeTest = firstForward < 0 && forwardChanges == 1 && totalSign != 0;
        return new FlowSigns(flowChanges, forwardChanges, backwardChanges, cumulativeTest, firstSign, lastSign,
            total, gross, receipts, payments, gap);
    }

    /// <summary>
    /// The one pass over the flows: totals, amount-weighted times, and the sign changes of the non-zero flows. Four
    /// periods at a time where the processor has 256-bit vectors and no flow is zero (a sign change is then a negative
    /// product of neighbours); one at a time otherwise.
    /// </summary>
    private static (double Gross, double Total, double Receipts, double ReceiptTime, double PaymentTime,
        double FirstNonZero, double LastNonZero, int Changes) Accumulate(ReadOnlySpan<double> flows)
    {
        if (Vector256.IsHardwareAccelerated && flows.Length >= 8)
        {
            var vectorised = AccumulateFourAtATime(flows);
            if (vectorised.HasValue)
            {
                return vectorised.Value;
            }
        }
        return AccumulateOneAtATime(flows);
    }

    internal static (double Gross, double Total, double Receipts, double ReceiptTime, double PaymentTime,
        double FirstNonZero, double LastNonZero, int Changes)? AccumulateFourAtATime(ReadOnlySpan<double> flows)
    {
        Vector256<double> total = Vector256<double>.Zero, receipts = Vector256<double>.Zero;
        Vector256<double> receiptTime = Vector256<double>.Zero, weighted = Vector256<double>.Zero;
        Vector256<double> time = Vector256.Create(0.0, 1.0, 2.0, 3.0), four = Vector256.Create(4.0);
        Vector256<double> zero = Vector256<double>.Zero;
        int changes = 0;
        int t = 0;
        for (; t + 4 <= flows.Length; t += 4)
        {
            Vector256<double> f = Vector256.Create(flows.Slice(t, 4));
            if (Vector256.EqualsAny(f, zero))
            {
                return null;
            }
            Vector256<double> received = Vector256.MaxNative(f, zero);
            total += f;
            receipts += received;
            receiptTime = Vector256.FusedMultiplyAdd(time, received, receiptTime);
            weighted = Vector256.FusedMultiplyAdd(time, f, weighted);
            time += four;
            if (t > 0)
            {
                Vector256<double> before = Vector256.Create(flows.Slice(t - 1, 4));
                changes += BitOperations.PopCount(Vector256.LessThan(f * before, zero).ExtractMostSignificantBits());
            }
            else
            {
                changes += (flows[1] * flows[0] < 0.0 ? 1 : 0) + (flows[2] * flows[1] < 0.0 ? 1 : 0) + (flows[3] * flows[2] < 0.0 ? 1 : 0);
            }
        }
        double sumTotal = Vector256.Sum(total), sumReceipts = Vector256.Sum(receipts);
        double sumReceiptTime = Vector256.Sum(receiptTime), sumWeighted = Vector256.Sum(weighted);
        for (; t < flows.Length; t++)
        {
            double f = flows[t];
            if (f == 0.0)
            {
                return null;
            }
            double received = f > 0.0 ? f : 0.0;
            sumTotal += f;
            sumReceipts += received;
            sumReceiptTime += t * received;
            sumWeighted += t * f;
            changes += f * flows[t - 1] < 0.0 ? 1 : 0;
        }
        // Σ|F| = Σ F⁺ + Σ F⁻ and Σ t F⁻ = Σ t F⁺ − Σ t F.
        double gross = 2.0 * sumReceipts - sumTotal;
        return (gross, sumTotal, sumReceipts, sumReceiptTime, sumReceiptTime - sumWeighted, flows[0], flows[^1], changes);
    }

    internal static (double Gross, double Total, double Receipts, double ReceiptTime, double PaymentTime,
        double FirstNonZero, double LastNonZero, int Changes) AccumulateOneAtATime(ReadOnlySpan<double> flows)
    {
        double gross = 0.0, total = 0.0, receipts = 0.0, receiptTime = 0.0, paymentTime = 0.0, time = 0.0;
        double firstNonZero = 0.0, lastNonZero = 0.0;
        int changes = 0;
        foreach (double f in flows)
        {
            double received = f > 0.0 ? f : 0.0;
            gross += Math.Abs(f);
            total += f;
            receipts += received;
            receiptTime += time * received;
            paymentTime += time * (received - f);
            time += 1.0;
            if (f != 0.0)
            {
                changes += f * lastNonZero < 0.0 ? 1 : 0;
                firstNonZero = firstNonZero == 0.0 ? f : firstNonZero;
                lastNonZero = f;
            }
        }
        return (gross, total, receipts, receiptTime, paymentTime, firstNonZero, lastNonZero, changes);
    }

    /// <summary>Sign changes of the running sums from the start or from the end, and the first sign they take.</summary>
    private static (int Changes, int FirstSign) RunningChanges(ReadOnlySpan<double> flows, bool fromEnd)
    {
        double running = 0.0, gross = 0.0;
        int changes = 0, last = 0, first = 0;
        for (int k = 0; k < flows.Length; k++)
        {
            double f = flows[fromEnd ? flows.Length - 1 - k : k];
            running += f;
            gross += Math.Abs(f);
            int sign = SignOf(running, (k + 1) * Epsilon * gross);
            if (sign != 0)
            {
                changes += sign != last && last != 0 ? 1 : 0;
                first = first == 0 ? sign : first;
                last = sign;
            }
        }
        return (changes, first);
    }

    private static int SignOf(double value, double negligible) => value > negligible ? 1 : value < -negligible ? -1 : 0;
}
