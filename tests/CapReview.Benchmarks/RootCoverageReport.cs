using System.Globalization;
using CapReview.Engine.Measures;
using Microsoft.VisualBasic;

namespace CapReview.Benchmarks;

/// <summary>
/// Not a timing: on flows built from known roots, how often each method finds every root. Cases: conventional flows
/// (one root), polynomials with two and three distinct roots in (−60%, 300%], and flows with no real root.
/// </summary>
internal static class RootCoverageReport
{
    public static void Print(int casesPerKind)
    {
        Console.WriteLine("| case | cases | RateOfReturnSearch finds every root | VisualBasic IRR finds a root | VisualBasic IRR fails (throws) | VisualBasic IRR reports only one of several |");
        Console.WriteLine("| --- | ---: | ---: | ---: | ---: | ---: |");
        var random = new Random(20261201);
        foreach (int roots in new[] { 1, 2, 3 })
        {
            int ours = 0, vbFound = 0, vbThrew = 0, vbOnlyOne = 0;
            for (int c = 0; c < casesPerKind; c++)
            {
                double[] known = roots == 1 ? [random.NextDouble() * 0.4] : Distinct(random, roots);
                double[] flows = roots == 1 ? Conventional(known[0], random) : FromRoots(known);
                var found = RateOfReturnSearch.Find(flows, RateOfReturnSearch.LowestAnnual, RateOfReturnSearch.HighestAnnual).Roots;
                if (found.Count == known.Length && found.Zip(known.Order(), (f, k) => Math.Abs(f - k) < 1e-7).All(x => x))
                {
                    ours++;
                }
                try
                {
                    double[] copy = [.. flows];
                    double vb = Financial.IRR(ref copy, 0.1);
                    if (known.Any(k => Math.Abs(k - vb) < 1e-6))
                    {
                        vbFound++;
                        if (known.Length > 1)
                        {
                            vbOnlyOne++;
                        }
                    }
                }
                catch (ArgumentException)
                {
                    vbThrew++;
                }
            }
            string name = roots == 1 ? "conventional, 40 periods, one root" : $"{roots} distinct roots";
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"| {name} | {casesPerKind} | {ours} | {vbFound} | {vbThrew} | {vbOnlyOne} |"));
        }
        int noneOurs = 0, noneVbThrew = 0, noneVbWrong = 0;
        for (int c = 0; c < casesPerKind; c++)
        {
            // a(1 + i)² + b(1 + i) + d with b² < 4ad: no real root at all.
            double a = 500 + random.NextDouble() * 1000, d = 500 + random.NextDouble() * 1000;
            double b = -2 * Math.Sqrt(a * d) * (0.5 + random.NextDouble() * 0.45);
            double[] flows = [a, b, d];
            if (RateOfReturnSearch.Find(flows, RateOfReturnSearch.LowestAnnual, RateOfReturnSearch.HighestAnnual).Roots.Count == 0)
            {
                noneOurs++;
            }
            try
            {
                double[] copy = [.. flows];
                Financial.IRR(ref copy, 0.1);
                noneVbWrong++;
            }
            catch (ArgumentException)
            {
                noneVbThrew++;
            }
        }
        Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"| no real root | {casesPerKind} | {noneOurs} (reports none) | {noneVbWrong} (returns a number) | {noneVbThrew} | – |"));
    }

    private static double[] Distinct(Random random, int count)
    {
        while (true)
        {
            double[] roots = [.. Enumerable.Range(0, count).Select(_ => -0.6 + random.NextDouble() * 3.6).Order()];
            if (roots.Zip(roots.Skip(1), (a, b) => b - a).All(gap => gap > 0.02))
            {
                return roots;
            }
        }
    }

    /// <summary>Coefficients of −Π((1 + i) − (1 + r)) in falling powers: flows whose rates of return are exactly the r.</summary>
    private static double[] FromRoots(double[] roots)
    {
        double[] coefficients = [-1000.0];
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
        return coefficients;
    }

    /// <summary>One outlay and 40 receipts scaled so that the rate of return is exactly <paramref name="rate"/>.</summary>
    private static double[] Conventional(double rate, Random random)
    {
        double[] flows = new double[41];
        double worth = 0;
        for (int t = 1; t <= 40; t++)
        {
            flows[t] = 50 + random.NextDouble() * 150;
            worth += flows[t] / Math.Pow(1 + rate, t);
        }
        flows[0] = -worth;
        return flows;
    }
}
