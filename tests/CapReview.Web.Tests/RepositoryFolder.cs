namespace CapReview.Web.Tests;

/// <summary>The repository the tests run from: its root is the folder above the test's output that holds CapReview.sln.</summary>
public static class RepositoryFolder
{
    public static string Root { get; } = Find();

    public static string Path(params string[] parts) => System.IO.Path.Combine([Root, .. parts]);

    private static string Find()
    {
        for (var folder = new DirectoryInfo(AppContext.BaseDirectory); folder is not null; folder = folder.Parent)
        {
            if (File.Exists(System.IO.Path.Combine(folder.FullName, "CapReview.sln")))
            {
                return folder.FullName;
            }
        }
        throw new InvalidOperationException("The repository's root (CapReview.sln) is not above the test's folder.");
    }
}
