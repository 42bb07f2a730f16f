using System.Runtime.CompilerServices;

namespace CapReview.Web.Tests;

internal static class WaitTimeout
{
    /// <summary>
    /// bUnit waits 1 s by default for a component's work to show; a panel that analyses a long model on a busy two-core
    /// machine (the whole suite beside other builds) can take longer, and a wait that passes alone but fails under load
    /// is a defect of the test. Set once for the assembly, before any test runs.
    /// </summary>
    [ModuleInitializer]
    internal static void Lengthen() => BunitContext.DefaultWaitTimeout = TimeSpan.FromSeconds(15);
}
