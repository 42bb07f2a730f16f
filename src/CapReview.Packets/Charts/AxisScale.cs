namespace CapReview.Packets.Charts;

/// <summary>Round tick values (1, 2 or 5 times a power of ten) covering a range, for chart axes.</summary>
internal static class AxisScale
{
    private static readonly double[] Multiples = [1.0, 2.0, 5.0, 10.0];

    public static IReadOnlyList<double> Ticks(double low, double high, int wanted = 6)
    {
        if (!(high > low))
        {
            (low, high) = (low - 1, low + 1);
        }
        double rough = (high - low) / Math.Max(1, wanted - 1);
        double power = Math.Pow(10, Math.Floor(Math.Log10(rough)));
        double step = Multiples.Select(m => m * power).First(s => s >= rough);
        double first = Math.Floor(low / step) * step;
        double last = Math.Ceiling(high / step) * step;
        var ticks = new List<double>();
        for (double t = first; t <= last + step / 2; t += step)
        {
            ticks.Add(Math.Abs(t) < step * 1e-9 ? 0.0 : t);
        }
        return ticks;
    }
}
