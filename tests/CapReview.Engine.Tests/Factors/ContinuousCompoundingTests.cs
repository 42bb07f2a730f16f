using CapReview.Engine.Factors;
using CapReview.Engine.Tests.Support;
using Microsoft.VisualBasic;

namespace CapReview.Engine.Tests.Factors;

public class ContinuousCompoundingTests
{
    [Theory]
    [InlineData(0.05, 10)]
    [InlineData(0.10, 25)]
    [InlineData(0.18, 1)]
    public void End_of_period_forms_equal_the_discrete_factors_at_e_to_the_r_minus_1(double r, int n)
    {
        // Common practice, no source: continuous compounding at r is discrete compounding at e^r − 1;
        // the discrete side is checked through Microsoft.VisualBasic.Financial.
        double i = Math.Exp(r) - 1.0;
        Close.Relative(-Financial.PV(i, n, 1.0), ContinuousCompounding.UniformSeriesPresentWorth(r, n), 1e-11);
        Close.Relative(-Financial.FV(i, n, 1.0), ContinuousCompounding.UniformSeriesCompoundAmount(r, n), 1e-11);
        Close.Relative(-Financial.Pmt(i, n, 1.0), ContinuousCompounding.CapitalRecovery(r, n), 1e-11);
        Close.Relative(-Financial.Pmt(i, n, 0.0, 1.0), ContinuousCompounding.SinkingFund(r, n), 1e-11);
        Close.Relative(Math.Exp(r * n), ContinuousCompounding.SinglePaymentCompoundAmount(r, n), 1e-14);
        Close.Relative(Math.Exp(-r * n), ContinuousCompounding.SinglePaymentPresentWorth(r, n), 1e-14);
    }

    [Theory]
    [InlineData(0.08, 10)]
    [InlineData(0.02, 40)]
    public void Uniform_flow_forms_equal_the_integral_of_the_discount(double r, int n)
    {
        // ∫₀ⁿ e^(−rt) dt by composite Simpson's rule with 20,000 panels: common practice, no source.
        const int panels = 20000;
        double h = (double)n / panels;
        double sum = 1.0 + Math.Exp(-r * n);
        for (int k = 1; k < panels; k++)
        {
            sum += (k % 2 == 1 ? 4.0 : 2.0) * Math.Exp(-r * k * h);
        }
        double integral = sum * h / 3.0;
        Close.Relative(integral, ContinuousCompounding.UniformFlowPresentWorth(r, n), 1e-12);
        Close.Relative(integral * Math.Exp(r * n), ContinuousCompounding.UniformFlowCompoundAmount(r, n), 1e-12);
    }

    [Fact]
    public void At_zero_rate_the_continuous_forms_take_their_limits()
    {
        Assert.Equal(12.0, ContinuousCompounding.UniformSeriesPresentWorth(0.0, 12));
        Assert.Equal(12.0, ContinuousCompounding.UniformFlowPresentWorth(0.0, 12));
        Assert.Equal(12.0, ContinuousCompounding.UniformFlowCompoundAmount(0.0, 12));
        Assert.Equal(1.0 / 12.0, ContinuousCompounding.CapitalRecovery(0.0, 12), 15);
    }

    [Fact]
    public void Tiny_continuous_rates_keep_their_precision()
    {
        // (P/Ā, r, n) = n − r n²/2 + r² n³/6 − … ; at r = 1e-9, n = 100 the series is exact to double precision.
        const double r = 1e-9;
        const int n = 100;
        double series = n - r * n * n / 2.0 + r * r * n * n * n / 6.0;
        Close.Relative(series, ContinuousCompounding.UniformFlowPresentWorth(r, n), 1e-15);
    }
}
