using CapReview.Reviews.Common;

namespace CapReview.Reviews.Runs;

/// <summary>A simulation or solver run refused because the person, or the server, already has as many going as allowed.</summary>
public sealed class RunLimitReachedException(string message) : ReviewException(message);
