using System.Globalization;
using CapReview.Engine.Factors;

namespace CapReview.Engine.Tests.Factors;

/// <summary>Reference/factor-table.csv: handbook interest-table values (from memory; see the file's header).</summary>
public class CompoundInterestTableTests
{
    public static TheoryData<double, int, string, double> Rows()
    {
        var data = new TheoryData<double, int, string, double>();
        string[] lines = File.ReadAllLines(Path.Combine(AppContext.BaseDirectory, "Reference", "factor-table.csv"))
            .Where(l => !l.StartsWith('#')).ToArray();
        string[] header = lines[0].Split(',');
        foreach (string line in lines.Skip(1))
        {
            string[] cells = line.Split(',');
            double rate = double.Parse(cells[0], CultureInfo.InvariantCulture);
            int periods = int.Parse(cells[1], CultureInfo.InvariantCulture);
            for (int c = 2; c < cells.Length; c++)
            {
                data.Add(rate, periods, header[c] + "|" + cells[c], double.Parse(cells[c], CultureInfo.InvariantCulture));
            }
        }
        return data;
    }

    [Theory]
    [MemberData(nameof(Rows))]
    public void Factor_agrees_with_the_printed_table_to_its_last_place(double i, int n, string factorAndText, double printed)
    {
        string[] parts = factorAndText.Split('|');
        int decimals = parts[1].Length - parts[1].IndexOf('.') - 1;
        double actual = parts[0] switch
        {
            "FP" => CompoundInterest.SinglePaymentCompoundAmount(i, n),
            "PF" => CompoundInterest.SinglePaymentPresentWorth(i, n),
            "AF" => CompoundInterest.SinkingFund(i, n),
            "FA" => CompoundInterest.UniformSeriesCompoundAmount(i, n),
            "AP" => CompoundInterest.CapitalRecovery(i, n),
            "PA" => CompoundInterest.UniformSeriesPresentWorth(i, n),
            "PG" => CompoundInterest.ArithmeticGradientPresentWorth(i, n),
            "AG" => CompoundInterest.ArithmeticGradientUniformSeries(i, n),
            _ => throw new InvalidOperationException(parts[0]),
        };
        Assert.Equal(printed, Math.Round(actual, decimals), 12);
    }
}
