namespace CapReview.Reviews.Portfolio;

/// <summary>
/// Where two ranked proposals change places, read against the ranking it came from: the annual MARR values at which
/// their annual worths over their lives are equal (the same MARR for both), and, at the MARRs of the ranking's what-if
/// (each proposal's own MARR plus the what-if's points), which of the two is ahead.
/// </summary>
/// <param name="First">The first proposal's reference.</param>
/// <param name="Second">The second proposal's reference.</param>
/// <param name="Rates">The annual MARR values, from 0 % to 40 %, at which they change places.</param>
/// <param name="MarrShift">The what-if's effective annual points added to every MARR (0 for the cycle's own).</param>
/// <param name="FirstMarr">The first proposal's MARR in this what-if, effective annual.</param>
/// <param name="SecondMarr">The second proposal's MARR in this what-if, effective annual.</param>
/// <param name="Ahead">The reference of the one ranked higher in this what-if.</param>
public sealed record SwapAnswer(string First, string Second, IReadOnlyList<double> Rates, double MarrShift, double FirstMarr, double SecondMarr, string Ahead)
{
    /// <summary>The swap rates above the higher of the two what-if MARRs: raising the MARR that far changes their order.</summary>
    public IReadOnlyList<double> Above => [.. Rates.Where(r => r > Math.Max(FirstMarr, SecondMarr))];

    /// <summary>The swap rates below the lower of the two what-if MARRs: lowering the MARR that far changes their order.</summary>
    public IReadOnlyList<double> Below => [.. Rates.Where(r => r < Math.Min(FirstMarr, SecondMarr))];
}
