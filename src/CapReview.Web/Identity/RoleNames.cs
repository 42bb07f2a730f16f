using CapReview.Reviews.Access;

namespace CapReview.Web.Identity;

/// <summary>The Identity role names of the domain's roles: the enum's names.</summary>
public static class RoleNames
{
    public const string ProjectLead = nameof(Role.ProjectLead);
    public const string Reviewer = nameof(Role.Reviewer);
    public const string Finance = nameof(Role.Finance);
    public const string Administrator = nameof(Role.Administrator);

    public static IReadOnlyList<string> All { get; } = [ProjectLead, Reviewer, Finance, Administrator];

    public static string Describe(string role) => role switch
    {
        ProjectLead => "Project lead",
        Reviewer => "Board member",
        Finance => "Finance",
        Administrator => "Administrator",
        _ => role,
    };
}
