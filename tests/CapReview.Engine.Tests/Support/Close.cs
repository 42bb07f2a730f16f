using System.Globalization;

namespace CapReview.Engine.Tests.Support;

/// <summary>The one tolerance helper: relative where the expected value is large, absolute near zero.</summary>
internal static class Close
{
    public static void Assert(double expected, double actual, double relative, string? what = null)
    {
        double scale = Math.Max(1.0, Math.Abs(expected));
        double allowed = relative * scale;
        if (!(Math.Abs(expected - actual) <= allowed))
        {
            throw new Xunit.Sdk.XunitException(string.Create(CultureInfo.InvariantCulture,
                $"{what ?? "value"}: expected {expected:R}, got {actual:R} (difference {Math.Abs(expected - actual):E3}, allowed {allowed:E3})"));
        }
    }

    /// <summary>Relative to the expected value itself, for values far below 1.</summary>
    public static void Relative(double expected, double actual, double relative, string? what = null)
    {
        double allowed = relative * Math.Abs(expected);
        if (!(Math.Abs(expected - actual) <= allowed))
        {
            throw new Xunit.Sdk.XunitException(string.Create(CultureInfo.InvariantCulture,
                $"{what ?? "value"}: expected {expected:R}, got {actual:R} (relative difference {Math.Abs(expected - actual) / Math.Abs(expected):E3}, allowed {relative:E1})"));
        }
    }
}
