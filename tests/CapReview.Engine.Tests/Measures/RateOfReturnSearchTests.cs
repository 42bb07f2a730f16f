using CapReview.Engine.Measures;
using CapReview.Engine.Tests.Support;
using CsCheck;
using Microsoft.VisualBasic;

namespace CapReview.Engine.Tests.Measures;

public class RateOfReturnSearchTests
{
    private const double Lowest = -0.999999;
    private const double Highest = 10.0;

    private static RateOfReturnResult Find(params double[] flows) => RateOfReturnSearch.Find(flows, Lowest, Highest);

    public static TheoryData<int, double, double> ConventionalCases()
    {
        var data = new TheoryData<int, double, double>();
        foreach (int n in new[] { 3, 10, 40, 120 })
        {
            foreach (double receipt in new[] { 80.0, 150.0, 400.0 })
            {
                foreach (double growth in new[] { -0.02, 0.0, 0.05 })
                {
                    data.Add(n, receipt, growth);
                }
            }
        }
        return data;
    }

    [Theory]
    [MemberData(nameof(ConventionalCases))]
    public void Conventional_flows_have_the_root_that_VisualBasic_IRR_finds(int n, double receipt, double growth)
    {
        // Outside reference: Microsoft.VisualBasic.Financial.IRR.
        double[] flows = new double[n + 1];
        flows[0] = -1000;
        for (int t = 1; t <= n; t++)
        {
            flows[t] = receipt * Math.Pow(1 + growth, t - 1);
        }
        double[] copy = [.. flows];
        double expected = Financial.IRR(ref copy, 0.1);
        var result = Find(flows);
        Assert.Equal(RateOfReturnKind.Unique, result.Kind);
        Assert.Equal(flows.Sum() > 0, result.CumulativeTestPassed);
        Assert.Equal(1, result.SignChanges);
        Close.Assert(expected, result.UniqueRoot!.Value, 1e-9);
    }

    [Fact]
    public void Three_roots_are_all_found_where_VisualBasic_IRR_reports_one()
    {
        // −1000 (1 + i − 1.1)(1 + i − 1.2)(1 + i − 1.3) in powers of (1 + i): roots 10%, 20%, 30% by construction.
        double[] flows = [-1000, 3600, -4310, 1716];
        var result = Find(flows);
        Assert.Equal(RateOfReturnKind.Several, result.Kind);
        Assert.Equal(3, result.Roots.Count);
        Close.Assert(0.10, result.Roots[0], 1e-12);
        Close.Assert(0.20, result.Roots[1], 1e-12);
        Close.Assert(0.30, result.Roots[2], 1e-12);
        Assert.Null(result.UniqueRoot);
        Assert.Equal(3, result.SignChanges);

        double[] copy = [.. flows];
        double vb = Financial.IRR(ref copy, 0.1);
        Assert.Contains(result.Roots, r => Math.Abs(r - vb) < 1e-6);
    }

    [Fact]
    public void Two_close_roots_inside_one_grid_step_are_both_found()
    {
        // (1 + i − 1.100)(1 + i − 1.102): two roots 0.2 points apart, closer than the scan's grid.
        double a = 1.100, b = 1.102;
        double[] flows = [-1, a + b, -a * b];
        var result = Find(flows);
        Assert.Equal(2, result.Roots.Count);
        Close.Assert(0.100, result.Roots[0], 1e-10);
        Close.Assert(0.102, result.Roots[1], 1e-10);
    }

    [Fact]
    public void A_double_root_is_reported_once()
    {
        // −(1 + i − 1.1)²: the worth touches zero at 10% without crossing.
        var result = Find(-1, 2.2, -1.21);
        Close.Assert(0.10, Assert.Single(result.Roots), 1e-7);
    }

    [Fact]
    public void Flows_with_sign_changes_but_no_real_root_report_none()
    {
        // 1000(1 + i)² − 3000(1 + i) + 2500 has a negative discriminant.
        var result = Find(1000, -3000, 2500);
        Assert.Equal(RateOfReturnKind.None, result.Kind);
        Assert.Equal(2, result.SignChanges);
        double[] copy = [1000, -3000, 2500];
        Assert.Throws<ArgumentException>(() => Financial.IRR(ref copy, 0.1));
    }

    [Fact]
    public void Flows_of_one_sign_have_no_rate_of_return()
    {
        var result = Find(-100, -20, -20);
        Assert.Equal(RateOfReturnKind.None, result.Kind);
        Assert.Equal(0, result.SignChanges);
        Assert.False(result.CumulativeTestPassed);
    }

    [Fact]
    public void Negative_rates_are_found()
    {
        // −1000 now, 600 and 300 later: the investment loses money, IRR about −7.3%.
        double[] flows = [-1000, 600, 300];
        double[] copy = [.. flows];
        Close.Assert(Financial.IRR(ref copy, -0.05), Find(flows).UniqueRoot!.Value, 1e-9);
    }

    [Fact]
    public void A_zero_rate_root_is_exact()
    {
        var result = Find(-100, 50, 50);
        Assert.Equal(0.0, Assert.Single(result.Roots));
    }

    [Fact]
    public void Roots_near_minus_100_percent_are_found()
    {
        var result = Find(-1, 0.0001);
        Close.Assert(-0.9999, Assert.Single(result.Roots), 1e-12);
    }

    [Fact]
    public void Flows_far_below_the_others_do_not_produce_false_roots()
    {
        var result = Find(-613.6281682884705, 1, 0, 3.234e-16, 7.569e-89);
        var root = Assert.Single(result.Roots);
        Assert.True(Math.Abs(FlowWorth.ScaledWorth([-613.6281682884705, 1, 0, 3.234e-16, 7.569e-89], root)) < 1e-9 * 614);
    }

    [Fact]
    public void Roots_above_the_range_are_not_reported() =>
        Assert.Equal(RateOfReturnKind.None, Find(-1, 20).Kind);

    [Fact]
    public void Cumulative_test_fails_when_the_running_total_recrosses()
    {
        var result = Find(-100, 300, -250);
        Assert.False(result.CumulativeTestPassed);
        Assert.Equal(2, result.CumulativeSignChanges);
    }

    [Fact]
    public void Worth_is_zero_at_every_reported_root() =>
        Gen.Double[-1000, 1000].Array[2, 41].Sample(flows =>
        {
            var result = Find(flows);
            foreach (double root in result.Roots)
            {
                // Zero to 1e-9 of the gross worth, or to what the rate itself can resolve: near −100% a double holds
                // 1 + i to about 1e-10, so the worth there is known only to its slope times a few units in the last place.
                double worth = FlowWorth.ScaledWorth(flows, root);
                double gross = FlowWorth.ScaledGross(flows, root);
                if (Math.Abs(worth) > 1e-9 * gross + 1e-14 * Math.Abs(ScaledSlope(flows, root)))
                {
                    return false;
                }
            }
            return result.Roots.Count <= result.SignChanges;
        }, iter: 2000);

    /// <summary>d/di of the present worth (i ≥ 0) or of the future worth (i &lt; 0), by the power rule.</summary>
    private static double ScaledSlope(double[] flows, double i)
    {
        int n = flows.Length - 1;
        double slope = 0;
        for (int t = 0; t <= n; t++)
        {
            slope += i >= 0 ? -t * flows[t] * Math.Pow(1 + i, -t - 1) : (n - t) * flows[t] * Math.Pow(1 + i, n - t - 1);
        }
        return slope;
    }

    [Fact]
    public void Every_root_of_a_polynomial_built_from_known_roots_is_found() =>
        Gen.Double[-0.6, 3.0].Array[1, 5].Sample(roots =>
        {
            // Flows are the coefficients of −Π(x − (1 + r)), so the roots are known exactly. Roots closer than two
            // points are ill-conditioned in double precision (rounding the coefficients moves them by 1e-7 or more).
            double[] distinct = roots.Select(r => Math.Round(r, 2)).Distinct().OrderBy(r => r).ToArray();
            if (distinct.Zip(distinct.Skip(1), (a, b) => b - a).Any(d => d < 0.02))
            {
                return true;
            }
            double[] coefficients = [-1.0];
            foreach (double r in distinct)
            {
                double[] next = new double[coefficients.Length + 1];
                for (int k = 0; k < coefficients.Length; k++)
                {
                    next[k] += coefficients[k];
                    next[k + 1] -= coefficients[k] * (1 + r);
                }
                coefficients = next;
            }
            var found = Find(coefficients).Roots;
            return found.Count == distinct.Length && found.Zip(distinct, (f, r) => Math.Abs(f - r) < 1e-6).All(ok => ok);
        }, iter: 1000);
}
