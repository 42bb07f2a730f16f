namespace CapReview.Reviews.Interchange;

/// <summary>A user of this installation as a cycle document names them.</summary>
public sealed record KnownPerson(string UserId, string Name, string Email);

/// <summary>
/// The installation's users, looked up by id (to name them in an export) and by e-mail (to give an imported
/// proposal to its lead when they have an account here). The identity store lives outside the domain.
/// </summary>
public interface IPeopleDirectory
{
    Task<KnownPerson?> FindAsync(string userId, CancellationToken cancellationToken);

    Task<KnownPerson?> FindByEmailAsync(string email, CancellationToken cancellationToken);
}
