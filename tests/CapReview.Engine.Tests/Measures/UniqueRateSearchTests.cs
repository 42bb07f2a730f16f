using CapReview.Engine.Measures;
using CsCheck;

namespace CapReview.Engine.Tests.Measures;

/// <summary>
/// The search a simulation uses, which stops at a second root, against the full search it replaces: the answer must
/// be the same bit for bit (the full search is the reference; its own roots are checked against outside sources in
/// RateOfReturnSearchTests).
/// </summary>
public class UniqueRateSearchTests
{
    private const double Lowest = -0.999999;
    private const double Highest = 10.0;

    private static bool SameAsFullSearch(double[] flows)
    {
        double? full = RateOfReturnSearch.Find(flows, Lowest, Highest).UniqueRoot;
        double? unique = RateOfReturnSearch.FindUnique(flows, Lowest, Highest);
        return full.HasValue == unique.HasValue && (!full.HasValue || BitConverter.DoubleToInt64Bits(full.Value) == BitConverter.DoubleToInt64Bits(unique!.Value));
    }

    [Fact]
    public void Random_flows_get_the_answer_of_the_full_search() =>
        Gen.Double[-1000, 1000].Array[2, 41].Sample(SameAsFullSearch, iter: 3000);

    [Fact]
    public void Flows_with_known_roots_either_side_of_zero_get_the_answer_of_the_full_search() =>
        // Flows as the coefficients of −Π(x − (1 + r)) with one to four roots, some close together, some negative.
        Gen.Double[-0.9, 3.0].Array[1, 4].Sample(roots =>
        {
            double[] coefficients = [-1.0];
            foreach (double r in roots)
            {
                double[] next = new double[coefficients.Length + 1];
                for (int k = 0; k < coefficients.Length; k++)
                {
                    next[k] += coefficients[k];
                    next[k + 1] -= coefficients[k] * (1 + r);
                }
                coefficients = next;
            }
            return SameAsFullSearch(coefficients);
        }, iter: 3000);

    [Theory]
    // Two roots above zero (about 5.7% and 12.3%), one either side (about −9.8% and 17.7%), none, a double root at
    // 10% (−(x − 1.1)², reported once), three roots (−100, 230, −132, 1: about −99.2%, 4% and 25.2%), and a unique
    // root behind three sign changes (−(x − 1.1)(x² + 1)); roots from a hand scan of the worth, marked as such.
    [InlineData(new[] { -1_000_000.0, 250_000, 250_000, 250_000, 250_000, 250_000, 250_000, 250_000, -350_000, 250_000, 250_000, 250_000, 250_000, 250_000, 250_000, -2_250_000 })]
    [InlineData(new[] { -1_000_000.0, 250_000, 250_000, 250_000, 250_000, 250_000, 250_000, 250_000, -350_000, 250_000, 250_000, 250_000, 250_000, 250_000, 250_000, -1_250_000 })]
    [InlineData(new[] { -1_000_000.0, 280_000, 280_000, 280_000, 280_000, 280_000, 280_000, 280_000, -420_000, 280_000, 280_000, 280_000, 280_000, 280_000, 280_000, -3_220_000 })]
    [InlineData(new[] { -1.0, 2.2, -1.21 })]
    [InlineData(new[] { -100.0, 230, -132, 1 })]
    [InlineData(new[] { -1.0, 1.1, -1.0, 1.1 })]
    public void Flows_with_several_sign_changes_get_the_answer_of_the_full_search(double[] flows) =>
        Assert.True(SameAsFullSearch(flows));

    [Fact]
    public void Two_roots_give_no_unique_rate_and_one_behind_several_sign_changes_gives_it()
    {
        // Two roots, about 5.7% and 12.3% (a hand scan of the worth, marked as such): not unique.
        double[] quarry = [-1_000_000.0, 250_000, 250_000, 250_000, 250_000, 250_000, 250_000, 250_000, -350_000, 250_000, 250_000, 250_000, 250_000, 250_000, 250_000, -2_250_000];
        Assert.Null(RateOfReturnSearch.FindUnique(quarry, Lowest, Highest));
        // −(x − 1.1)(x² + 1) = −x³ + 1.1x² − x + 1.1: flows −1, 1.1, −1, 1.1 (as coefficients of x³ … 1 with x = 1 + i),
        // three sign changes and a single real root at i = 10% (closed form).
        Assert.Equal(0.10, RateOfReturnSearch.FindUnique([-1.0, 1.1, -1.0, 1.1], Lowest, Highest)!.Value, 12);
    }
}
