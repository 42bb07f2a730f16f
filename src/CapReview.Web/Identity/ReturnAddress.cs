namespace CapReview.Web.Identity;

/// <summary>Where the sign-in form may send the visitor afterwards: a path of this app, never another site.</summary>
public static class ReturnAddress
{
    /// <summary>
    /// True for "/cycles/3" and the like. False for anything a browser could read as another host: "//host", "/\host",
    /// "\\host", a scheme ("https:", "javascript:"), a backslash or a control character anywhere.
    /// </summary>
    public static bool IsLocal(string? address) =>
        !string.IsNullOrEmpty(address) && address[0] == '/'
        && (address.Length == 1 || address[1] != '/')
        && !address.Any(c => c == '\\' || char.IsControl(c))
        && !address.Contains(':', StringComparison.Ordinal);
}
