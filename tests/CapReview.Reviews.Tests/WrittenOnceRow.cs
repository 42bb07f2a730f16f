using CapReview.Reviews.Audit;

namespace CapReview.Reviews.Tests;

/// <summary>A row written once: its entity type and key, a text column (named as its property) and the value it holds.</summary>
internal sealed record WrittenOnceRow(Type Entity, long Id, string Column, string Value)
{
    /// <summary>The key as the entity declares it: only audit events have a long one.</summary>
    public object Key => Entity == typeof(AuditEvent) ? Id : (object)checked((int)Id);
}
