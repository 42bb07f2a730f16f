using CapReview.Reviews.Access;
using CapReview.Reviews.Audit;
using CapReview.Reviews.Common;
using CapReview.Web.Identity;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Api;

public sealed class UserAdministrationTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private static readonly Actor Admin = Actor.Of("admin-test", "Test Admin", Role.Administrator);

    [Fact]
    public async Task An_administrator_creates_a_user_and_the_audit_trail_records_it()
    {
        var users = factory.Services.GetRequiredService<UserAdministration>();
        await users.CreateAsync(Admin, "selma.new@tarnby.example", "Selma New", "first-login-2027", RoleNames.Finance);
        var listed = (await users.ListAsync(Admin, CancellationToken.None)).Single(u => u.Email == "selma.new@tarnby.example");
        Assert.Equal(["Finance"], listed.Roles);
        var events = await factory.Services.GetRequiredService<AuditQueries>().RecentAsync(Admin, 10, CancellationToken.None);
        var created = Assert.Single(events, e => e.Action == "user.created" && e.EntityId == listed.Id);
        Assert.Contains("selma.new@tarnby.example", created.After);
        Assert.True((await factory.Services.GetRequiredService<AuditQueries>().VerifyAsync(Admin, CancellationToken.None)).Intact);
    }

    [Fact]
    public async Task Password_rules_and_roles_are_refused_with_their_reasons()
    {
        var users = factory.Services.GetRequiredService<UserAdministration>();
        var weak = await Assert.ThrowsAsync<RuleViolationException>(() => users.CreateAsync(Admin, "weak@tarnby.example", "Weak", "short", RoleNames.Reviewer));
        Assert.Contains("at least 10 characters", weak.Message);
        await Assert.ThrowsAsync<RuleViolationException>(() => users.CreateAsync(Admin, "role@tarnby.example", "Role", "long-enough-2027", "Owner"));
        await Assert.ThrowsAsync<AccessDeniedException>(() => users.CreateAsync(Actor.Of("x", "x", Role.ProjectLead), "a@b.example", "A", "long-enough-2027", RoleNames.Reviewer));
    }
}
