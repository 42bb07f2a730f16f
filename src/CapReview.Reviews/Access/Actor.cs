namespace CapReview.Reviews.Access;

/// <summary>The signed-in user on whose behalf a domain service acts; the web layer builds it from the sign-in.</summary>
public sealed record Actor(string UserId, string DisplayName, IReadOnlySet<Role> Roles)
{
    public bool Has(Role role) => Roles.Contains(role);

    public static Actor Of(string userId, string displayName, params Role[] roles) => new(userId, displayName, roles.ToHashSet());
}
