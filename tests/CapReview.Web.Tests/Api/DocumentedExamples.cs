using System.Globalization;
using System.Net.Http.Headers;
using System.Text;
using System.Text.Json;
using System.Text.RegularExpressions;

namespace CapReview.Web.Tests.Api;

/// <summary>Every example in docs/api.md is sent to the real app and must get the response the document shows.</summary>
public sealed partial class DocumentedExamples(ApiFactory factory) : IClassFixture<ApiFactory>
{
    public static TheoryData<string> Names()
    {
        var names = new TheoryData<string>();
        foreach (Match m in ExampleMarker().Matches(ApiDocument()))
        {
            names.Add(m.Groups[1].Value);
        }
        return names;
    }

    [Theory]
    [MemberData(nameof(Names))]
    public async Task Example_gets_the_documented_response(string name)
    {
        string document = ApiDocument();
        Match marker = ExampleMarker().Matches(document).Single(m => m.Groups[1].Value == name);
        int start = marker.Index;
        Match request = DocumentedJson.HttpBlock().Match(document, start);
        Match response = DocumentedJson.JsonBlock().Match(document, request.Index + request.Length);
        Assert.True(request.Success && response.Success, $"example {name} needs an http block and a json block");

        string[] lines = request.Groups[1].Value.Split('\n');
        string[] requestLine = lines[0].Split(' ');
        int blank = request.Groups[1].Value.IndexOf("\n\n", StringComparison.Ordinal);
        string body = blank < 0 ? "" : request.Groups[1].Value[(blank + 2)..];

        // The cycles the examples read come first, so their numbers are the document's whatever the examples' order.
        await ExampleCycles.EnsureAsync(factory);
        // The documented "Authorization: Bearer <your token>" is this test's own token: a lead's, or a board member's.
        using HttpClient client = marker.Groups[3].Success
            ? (await factory.TokenClientAsync("examples.board@tarnby.example", CapReview.Web.Identity.RoleNames.Reviewer)).Client
            : await factory.CreateAuthenticatedClientAsync();
        using var content = new StringContent(body, Encoding.UTF8);
        content.Headers.ContentType = new MediaTypeHeaderValue("application/json");
        using var message = new HttpRequestMessage(new HttpMethod(requestLine[0]), requestLine[1]) { Content = body.Length == 0 ? null : content };
        using HttpResponseMessage actual = await client.SendAsync(message);
        if (Environment.GetEnvironmentVariable("CAPREVIEW_SHOW_EXAMPLES") is { Length: > 0 } folder)
        {
            await File.WriteAllTextAsync(Path.Combine(folder, name + ".json"), await actual.Content.ReadAsStringAsync());
        }

        JsonElement expected = JsonDocument.Parse(response.Groups[1].Value).RootElement;
        int status = marker.Groups[2].Success ? int.Parse(marker.Groups[2].Value, CultureInfo.InvariantCulture)
            : expected.TryGetProperty("status", out JsonElement s) ? s.GetInt32() : 200;
        Assert.Equal(status, (int)actual.StatusCode);
        JsonElement got = JsonDocument.Parse(await actual.Content.ReadAsStringAsync()).RootElement;
        Assert.Null(DocumentedJson.Mismatch(expected, got, "$"));
    }

    private static string ApiDocument() =>
        File.ReadAllText(RepositoryFolder.Path("docs", "api.md")).Replace("\r\n", "\n", StringComparison.Ordinal);

    [GeneratedRegex(@"<!-- example: ([\w-]+)(?: \(answers (\d{3})\))?( \(as a board member\))? -->")]
    private static partial Regex ExampleMarker();
}
