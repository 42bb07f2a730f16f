using System.Globalization;
using System.Net.Http.Headers;
using System.Security.Cryptography;
using System.Text;
using System.Text.Json;
using System.Text.RegularExpressions;
using CapReview.Reviews.Storage;
using CapReview.Web.Identity;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Api;

/// <summary>
/// The walk through the whole review in docs/api.md, sent step by step to the real app with one token per person
/// (an administrator, a lead, two board members, finance): a proposal goes from draft to signed packets through the
/// API alone, every answer as documented. Then the packets are downloaded and checked against their hashes, and the
/// audit trail holds the same acts, in the same order, as the pages would have written.
/// </summary>
public sealed partial class DocumentedWalkthrough(ApiFactory factory) : IClassFixture<ApiFactory>
{
    [Fact]
    public async Task A_proposal_goes_from_draft_to_signed_packets_through_the_api_alone()
    {
        var people = new Dictionary<string, HttpClient>
        {
            ["administrator"] = (await factory.TokenClientAsync("walk.admin@tarnby.example", RoleNames.Administrator)).Client,
            ["lead"] = (await factory.TokenClientAsync("walk.lead@tarnby.example", RoleNames.ProjectLead)).Client,
            ["board-1"] = (await factory.TokenClientAsync("walk.board1@tarnby.example", RoleNames.Reviewer)).Client,
            ["board-2"] = (await factory.TokenClientAsync("walk.board2@tarnby.example", RoleNames.Reviewer)).Client,
            ["finance"] = (await factory.TokenClientAsync("walk.finance@tarnby.example", RoleNames.Finance)).Client,
        };
        var kept = new Dictionary<string, string>();
        string document = File.ReadAllText(RepositoryFolder.Path("docs", "api.md")).Replace("\r\n", "\n", StringComparison.Ordinal);
        var steps = StepMarker().Matches(document);
        Assert.True(steps.Count >= 15, $"the walkthrough has only {steps.Count} steps");
        JsonElement last = default;
        foreach (Match step in steps)
        {
            string name = step.Groups["name"].Value;
            Match request = DocumentedJson.HttpBlock().Match(document, step.Index);
            Match response = DocumentedJson.JsonBlock().Match(document, request.Index + request.Length);
            Assert.True(request.Success && response.Success, $"step {name} needs an http block and a json block");
            int status = step.Groups["status"].Success ? int.Parse(step.Groups["status"].Value, CultureInfo.InvariantCulture) : 200;
            string expectedText = Fill(response.Groups[1].Value, kept);
            JsonElement expected = JsonDocument.Parse(expectedText).RootElement;
            HttpClient client = people[step.Groups["who"].Value];
            DateTime giveUp = DateTime.UtcNow.AddMinutes(1);
            while (true)
            {
                var (actualStatus, actual) = await SendAsync(client, Fill(request.Groups[1].Value, kept));
                string? mismatch = actualStatus != status ? $"status {actualStatus}, documented {status}: {actual}" : DocumentedJson.Mismatch(expected, actual, "$");
                if (mismatch is null)
                {
                    last = actual;
                    break;
                }
                Assert.True(step.Groups["waits"].Success && DateTime.UtcNow < giveUp, $"step {name}: {mismatch}");
                await Task.Delay(250);
            }
            if (step.Groups["keeps"].Success)
            {
                foreach (string keep in step.Groups["keeps"].Value.Split(',', StringSplitOptions.TrimEntries))
                {
                    string[] pair = keep.Split('=');
                    kept[pair[0]] = At(last, pair[1]).GetRawText();
                }
            }
        }

        // The last step listed the packets: each downloads byte for byte as its hash says.
        Assert.Equal(2, last.GetArrayLength());
        foreach (JsonElement packet in last.EnumerateArray())
        {
            byte[] pdf = await people["finance"].GetByteArrayAsync(packet.GetProperty("download").GetString());
            Assert.Equal(packet.GetProperty("sha256").GetString(), Convert.ToHexStringLower(SHA256.HashData(pdf)));
            Assert.Equal("%PDF-", Encoding.ASCII.GetString(pdf, 0, 5));
        }

        // The same acts the pages write, in order (the page flow's audit, written out here rather than read from code).
        await using var scope = factory.Services.CreateAsyncScope();
        await using var db = await scope.ServiceProvider.GetRequiredService<IDbContextFactory<CapReviewDbContext>>().CreateDbContextAsync();
        string[] acts = [.. (await db.AuditEvents.OrderBy(e => e.Id).Select(e => e.Action).ToListAsync())
            .Where(a => !a.StartsWith("token.", StringComparison.Ordinal) && !a.StartsWith("user.", StringComparison.Ordinal))];
        Assert.Equal(
        [
            "marr.version-added", "marr.version-added", "marr.version-retired", "cycle.created", "cycle.corrected", "proposal.created", "proposal.edited", "proposal.submitted", "decision.recorded",
            // A revision started while the board has version 2; version 2 approved with the selected portfolio, changed to a rejection, then to a
            // return for changes; the waiting revision resubmitted as version 3 and approved.
            "proposal.edited", "proposal.submitted", "proposal.revision-started", "decision.recorded", "decision.recorded", "decision.recorded", "proposal.submitted",
            "decision.recorded", "cycle.signed-off", "cycle.signed-off",
            "packet.stored", "packet.stored",
            "packet.downloaded", "packet.downloaded",
        ], acts);
    }

    private static async Task<(int Status, JsonElement Body)> SendAsync(HttpClient client, string block)
    {
        string[] lines = block.Split('\n');
        string[] requestLine = lines[0].Split(' ');
        int blank = block.IndexOf("\n\n", StringComparison.Ordinal);
        using var message = new HttpRequestMessage(new HttpMethod(requestLine[0]), requestLine[1]);
        if (blank > 0)
        {
            message.Content = new StringContent(block[(blank + 2)..], Encoding.UTF8);
            message.Content.Headers.ContentType = new MediaTypeHeaderValue("application/json");
        }
        using HttpResponseMessage answer = await client.SendAsync(message);
        string text = await answer.Content.ReadAsStringAsync();
        return ((int)answer.StatusCode, text.Length == 0 ? default : JsonDocument.Parse(text).RootElement.Clone());
    }

    /// <summary>
    /// The request or response with each <c>{name}</c> an earlier answer kept: as JSON in a body, and in the request
    /// line (a query string) a kept text without its quotes.
    /// </summary>
    private static string Fill(string text, Dictionary<string, string> kept)
    {
        int lineEnd = text.IndexOf('\n', StringComparison.Ordinal);
        string first = lineEnd < 0 ? text : text[..lineEnd];
        if (first.StartsWith("GET ", StringComparison.Ordinal) || first.StartsWith("PUT ", StringComparison.Ordinal)
            || first.StartsWith("POST ", StringComparison.Ordinal) || first.StartsWith("DELETE ", StringComparison.Ordinal))
        {
            string line = Placeholder().Replace(first, m => kept.TryGetValue(m.Groups[1].Value, out string? value)
                ? Uri.EscapeDataString(value.StartsWith('"') ? JsonDocument.Parse(value).RootElement.GetString()! : value) : m.Value);
            return line + (lineEnd < 0 ? "" : Placeholder().Replace(text[lineEnd..], m => kept.TryGetValue(m.Groups[1].Value, out string? value) ? value : m.Value));
        }
        // In a documented response a kept text may stand inside a string ("{reference} Heat recovery"): without its quotes there.
        return Placeholder().Replace(text, m => kept.TryGetValue(m.Groups[1].Value, out string? value)
            ? (value.StartsWith('"') && m.Index > 0 && text[m.Index - 1] != ' ' && text[m.Index - 1] != ':' ? value[1..^1] : value) : m.Value);
    }

    /// <summary>A kept value's place in an answer: a property name, or a path such as <c>0.id</c> (the first item's id).</summary>
    private static JsonElement At(JsonElement answer, string path)
    {
        foreach (string part in path.Split('.'))
        {
            answer = int.TryParse(part, NumberStyles.None, CultureInfo.InvariantCulture, out int index) ? answer[index] : answer.GetProperty(part);
        }
        return answer;
    }

    [GeneratedRegex(@"<!-- step: (?<name>[\w-]+) as (?<who>[\w-]+)(?: \(answers (?<status>\d{3})\))?(?<waits> waits)?(?: keeps (?<keeps>[\w=,. ]+))? -->")]
    private static partial Regex StepMarker();

    [GeneratedRegex(@"\{(\w+)\}")]
    private static partial Regex Placeholder();
}
