using CapReview.Engine.Factors;
using CapReview.Engine.Tests.Support;
using Microsoft.VisualBasic;

namespace CapReview.Engine.Tests.Factors;

/// <summary>Outside reference: Microsoft.VisualBasic.Financial (ships with .NET), end-of-period payments.</summary>
public class CompoundInterestAgainstVisualBasic
{
    public static TheoryData<double, int> Grid()
    {
        var data = new TheoryData<double, int>();
        foreach (double i in new[] { 0.001, 0.005, 0.01, 0.03, 0.05, 0.08, 0.10, 0.15, 0.25, 0.50, 1.0 })
        {
            foreach (int n in new[] { 1, 2, 5, 10, 25, 40, 100, 360 })
            {
                data.Add(i, n);
            }
        }
        return data;
    }

    [Theory]
    [MemberData(nameof(Grid))]
    public void Uniform_series_present_worth_matches_PV(double i, int n) =>
        Close.Relative(-Financial.PV(i, n, 1.0), CompoundInterest.UniformSeriesPresentWorth(i, n), 1e-11);

    [Theory]
    [MemberData(nameof(Grid))]
    public void Uniform_series_compound_amount_matches_FV(double i, int n) =>
        Close.Relative(-Financial.FV(i, n, 1.0), CompoundInterest.UniformSeriesCompoundAmount(i, n), 1e-11);

    [Theory]
    [MemberData(nameof(Grid))]
    public void Capital_recovery_matches_Pmt(double i, int n) =>
        Close.Relative(-Financial.Pmt(i, n, 1.0), CompoundInterest.CapitalRecovery(i, n), 1e-11);

    [Theory]
    [MemberData(nameof(Grid))]
    public void Sinking_fund_matches_Pmt_of_a_future_amount(double i, int n) =>
        Close.Relative(-Financial.Pmt(i, n, 0.0, 1.0), CompoundInterest.SinkingFund(i, n), 1e-11);

    [Theory]
    [MemberData(nameof(Grid))]
    public void Single_payment_factors_match_FV_and_PV_of_one_amount(double i, int n)
    {
        Close.Relative(-Financial.FV(i, n, 0.0, 1.0), CompoundInterest.SinglePaymentCompoundAmount(i, n), 1e-11);
        Close.Relative(-Financial.PV(i, n, 0.0, 1.0), CompoundInterest.SinglePaymentPresentWorth(i, n), 1e-11);
    }

    [Theory]
    [MemberData(nameof(Grid))]
    public void Arithmetic_gradient_present_worth_matches_NPV_of_the_gradient(double i, int n)
    {
        double[] gradient = Enumerable.Range(1, n).Select(k => (double)(k - 1)).ToArray();
        double expected = n == 1 ? 0.0 : Financial.NPV(i, ref gradient);
        Close.Assert(expected, CompoundInterest.ArithmeticGradientPresentWorth(i, n), 1e-11);
    }

    [Theory]
    [MemberData(nameof(Grid))]
    public void Geometric_gradient_present_worth_matches_NPV_of_the_growing_series(double i, int n)
    {
        const double g = 0.04;
        double[] series = Enumerable.Range(1, n).Select(k => Math.Pow(1 + g, k - 1)).ToArray();
        Close.Relative(Financial.NPV(i, ref series), CompoundInterest.GeometricGradientPresentWorth(i, g, n), 1e-11);
    }
}
