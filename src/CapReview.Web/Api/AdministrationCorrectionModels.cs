using CapReview.Reviews.Access;
using CapReview.Reviews.Audit;
using CapReview.Web.Identity;

namespace CapReview.Web.Api;

/// <summary>Why a MARR policy version is retired as a mistake.</summary>
public sealed record RetirementRequest(string? Reason);

/// <summary>An open cycle's corrected capital limit and dates, with the cycle's revision the caller started from.</summary>
public sealed record CycleTermsRequest(decimal? CapitalLimit, DateOnly? OpensOn, DateOnly? ClosesOn, int? Revision);

/// <summary>The roles a person is to have (at least one).</summary>
public sealed record RolesRequest(IReadOnlyList<Role>? Roles);

/// <summary>A person as an administrator sees them.</summary>
public sealed record UserResponse(string Id, string Email, string Name, IReadOnlyList<Role> Roles, bool Disabled, bool TwoStep)
{
    public static UserResponse From(UserSummary user)
    {
        ArgumentNullException.ThrowIfNull(user);
        return new(user.Id, user.Email, user.DisplayName, [.. user.Roles.Select(Enum.Parse<Role>)], user.Disabled, user.TwoStep);
    }
}

/// <summary>One audit event, with the person and the item named.</summary>
public sealed record AuditEventResponse(long Id, DateTimeOffset At, string UserId, string Person, string Action, string Item, string? ProposalReference, string? Before, string? After, string Hash)
{
    public static AuditEventResponse From(AuditRow row)
    {
        ArgumentNullException.ThrowIfNull(row);
        return new(row.Id, row.At, row.UserId, row.Person, row.Action, row.Item, row.ProposalReference, row.Before, row.After, row.Hash);
    }
}

/// <summary>The events a filter found, newest first; <c>more</c> when more matched than <c>limit</c>.</summary>
public sealed record AuditEventsResponse(IReadOnlyList<AuditEventResponse> Events, bool More);
