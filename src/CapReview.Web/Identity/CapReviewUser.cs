using Microsoft.AspNetCore.Identity;

namespace CapReview.Web.Identity;

/// <summary>A person who signs in to CapReview.</summary>
public sealed class CapReviewUser : IdentityUser
{
    /// <summary>The name shown on pages, decisions and packets.</summary>
    public string DisplayName { get; set; } = "";
}
