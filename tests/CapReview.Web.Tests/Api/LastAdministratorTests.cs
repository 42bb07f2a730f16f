using System.Net;
using System.Text;
using System.Text.Json;
using CapReview.Web.Identity;

namespace CapReview.Web.Tests.Api;

/// <summary>An installation always keeps an administrator who can sign in: the last one cannot lose the role.</summary>
public sealed class LastAdministratorTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private static StringContent Json(string body) => new(body, Encoding.UTF8, "application/json");

    [Fact]
    public async Task The_last_administrator_keeps_the_role_until_someone_else_has_it()
    {
        var (first, firstId) = await factory.TokenClientAsync("only.admin@tarnby.example", RoleNames.Administrator);
        using (var refused = await first.PutAsync($"/api/v1/users/{firstId}/roles", Json("""{ "roles": ["finance"] }""")))
        {
            Assert.Equal(HttpStatusCode.BadRequest, refused.StatusCode);
            using JsonDocument problem = JsonDocument.Parse(await refused.Content.ReadAsStringAsync());
            Assert.Equal("Roles: only.admin@tarnby.example is the last administrator; make someone else an administrator first.",
                problem.RootElement.GetProperty("errors").GetProperty("roles")[0].GetString());
        }

        var (second, secondId) = await factory.TokenClientAsync("second.admin@tarnby.example", RoleNames.Administrator);
        using (var allowed = await second.PutAsync($"/api/v1/users/{firstId}/roles", Json("""{ "roles": ["finance"] }""")))
        {
            Assert.Equal(HttpStatusCode.OK, allowed.StatusCode);
        }
        using (var self = await second.PutAsync($"/api/v1/users/{secondId}/roles", Json("""{ "roles": ["reviewer"] }""")))
        {
            Assert.Equal(HttpStatusCode.BadRequest, self.StatusCode);
        }
        using var demoted = await first.GetAsync("/api/v1/users");
        Assert.Equal(HttpStatusCode.Forbidden, demoted.StatusCode);
    }
}
