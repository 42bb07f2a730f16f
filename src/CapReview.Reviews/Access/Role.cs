namespace CapReview.Reviews.Access;

/// <summary>What a user may do in CapReview.</summary>
public enum Role
{
    /// <summary>Writes and submits their own proposals.</summary>
    ProjectLead,

    /// <summary>A board member: reviews submitted proposals, decides and signs off.</summary>
    Reviewer,

    /// <summary>Reads decided cycles and downloads packets.</summary>
    Finance,

    /// <summary>Manages users, roles, the MARR policy and budget cycles.</summary>
    Administrator,
}
