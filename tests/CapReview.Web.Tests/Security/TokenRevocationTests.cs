using System.Net;
using CapReview.Reviews.Access;
using CapReview.Web.Identity;
using CapReview.Web.Tests.Api;
using CapReview.Web.Tests.Operations;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Security;

/// <summary>Ending an API token: revoked on the command line, or refused with its disabled account.</summary>
public sealed class TokenRevocationTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    [Fact]
    public async Task The_revoke_tokens_verb_ends_every_token_of_a_person_and_the_server_refuses_them_once_its_cache_forgets()
    {
        var (first, _) = await factory.TokenClientAsync("revoked.tokens@tarnby.example", RoleNames.Finance);
        var (second, _) = await factory.TokenClientAsync("revoked.tokens@tarnby.example", RoleNames.Finance);
        using (first)
        using (second)
        {
            Assert.Equal(HttpStatusCode.OK, (await first.GetAsync("/api/v1/cycles")).StatusCode);

            var (exitCode, output) = await AppProcess.RunVerbAsync(factory.Database.Settings, "revoke-tokens", "--email", "revoked.tokens@tarnby.example");
            Assert.Equal(0, exitCode);
            Assert.Contains("2 API token(s) of revoked.tokens@tarnby.example revoked.", output, StringComparison.Ordinal);

            // This server remembered the first token for up to 30 seconds; once that has passed, both are refused.
            factory.Services.GetRequiredService<ApiTokenCache>().Forget();
            Assert.Equal(HttpStatusCode.Unauthorized, (await first.GetAsync("/api/v1/cycles")).StatusCode);
            Assert.Equal(HttpStatusCode.Unauthorized, (await second.GetAsync("/api/v1/cycles")).StatusCode);
        }
    }

    [Fact]
    public async Task A_disabled_accounts_tokens_are_refused_at_once_and_work_again_when_it_is_enabled()
    {
        var (client, userId) = await factory.TokenClientAsync("disabled.tokens@tarnby.example", RoleNames.Finance);
        using (client)
        {
            Assert.Equal(HttpStatusCode.OK, (await client.GetAsync("/api/v1/cycles")).StatusCode);
            var administration = factory.Services.GetRequiredService<UserAdministration>();
            var admin = Actor.Of("tokens-admin", "Tokens Admin", Role.Administrator);
            await administration.SetDisabledAsync(admin, userId, disabled: true);
            Assert.Equal(HttpStatusCode.Unauthorized, (await client.GetAsync("/api/v1/cycles")).StatusCode);
            await administration.SetDisabledAsync(admin, userId, disabled: false);
            Assert.Equal(HttpStatusCode.OK, (await client.GetAsync("/api/v1/cycles")).StatusCode);
        }
    }
}
