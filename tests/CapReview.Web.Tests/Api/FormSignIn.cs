using System.Text.RegularExpressions;

namespace CapReview.Web.Tests.Api;

/// <summary>Signs in through the real form, as a browser would: fetches the form for its antiforgery token, then posts it.</summary>
public static partial class FormSignIn
{
    /// <summary>A client that behaves as a browser towards the forms: keeps cookies, shows redirects instead of following them.</summary>
    public static HttpClient NewBrowser(Microsoft.AspNetCore.Mvc.Testing.WebApplicationFactory<Program> app)
    {
        ArgumentNullException.ThrowIfNull(app);
        return app.CreateClient(new Microsoft.AspNetCore.Mvc.Testing.WebApplicationFactoryClientOptions { AllowAutoRedirect = false, HandleCookies = true });
    }

    /// <summary>The form's answer (a redirect when the sign-in succeeded); the client keeps the cookies when it handles them.</summary>
    public static async Task<HttpResponseMessage> PostAsync(HttpClient client, string email, string password)
    {
        ArgumentNullException.ThrowIfNull(client);
        string form = await client.GetStringAsync(new Uri("/signin", UriKind.Relative));
        return await PostFormAsync(client, "/signin", form, "signin", ("Input.Email", email), ("Input.Password", password));
    }

    /// <summary>
    /// Posts one of the forms of a page already fetched, as the browser would: the page's antiforgery token, the form's
    /// name (Blazor's <c>_handler</c>; none for the sign-out) and the fields.
    /// </summary>
    public static Task<HttpResponseMessage> PostFormAsync(HttpClient client, string path, string page, string? form, params (string Name, string Value)[] fields)
    {
        ArgumentNullException.ThrowIfNull(client);
        var values = new Dictionary<string, string> { ["__RequestVerificationToken"] = AntiforgeryToken(page) };
        if (form is not null)
        {
            values["_handler"] = form;
        }
        foreach (var (name, value) in fields)
        {
            values[name] = value;
        }
        return client.PostAsync(new Uri(path, UriKind.Relative), new FormUrlEncodedContent(values));
    }

    /// <summary>The antiforgery token a rendered form carries.</summary>
    public static string AntiforgeryToken(string html) => TokenField().Match(html) is { Success: true } match
        ? match.Groups[1].Value
        : throw new InvalidOperationException("The page has no antiforgery token.");

    [GeneratedRegex("name=\"__RequestVerificationToken\" value=\"([^\"]+)\"")]
    private static partial Regex TokenField();
}
