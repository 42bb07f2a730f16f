using System.Text.RegularExpressions;

namespace CapReview.Web.Tests.Api;

/// <summary>Signs in through the real form, as a browser would: fetches the form for its antiforgery token, then posts it.</summary>
public static partial class FormSignIn
{
    /// <summary>The form's answer (a redirect when the sign-in succeeded); the client keeps the cookies when it handles them.</summary>
    public static async Task<HttpResponseMessage> PostAsync(HttpClient client, string email, string password)
    {
        ArgumentNullException.ThrowIfNull(client);
        string form = await client.GetStringAsync(new Uri("/signin", UriKind.Relative));
        using var content = new FormUrlEncodedContent(new Dictionary<string, string>
        {
            ["__RequestVerificationToken"] = AntiforgeryToken(form),
            ["_handler"] = "signin",
            ["Input.Email"] = email,
            ["Input.Password"] = password,
        });
        return await client.PostAsync(new Uri("/signin", UriKind.Relative), content);
    }

    /// <summary>The antiforgery token a rendered form carries.</summary>
    public static string AntiforgeryToken(string html) => TokenField().Match(html) is { Success: true } match
        ? match.Groups[1].Value
        : throw new InvalidOperationException("The page has no antiforgery token.");

    [GeneratedRegex("name=\"__RequestVerificationToken\" value=\"([^\"]+)\"")]
    private static partial Regex TokenField();
}
