namespace CapReview.Web.Hosting;

/// <summary>Where the embedded database lives. A connection string named CapReview, when set, takes precedence.</summary>
public sealed class StorageOptions
{
    /// <summary>
    /// Path of the SQLite file, relative to the content root. Development settings point it at the repository's
    /// <c>db/</c> folder; a deployment sets it (or the connection string) explicitly.
    /// </summary>
    public string DatabasePath { get; set; } = "db/capreview.db";

    /// <summary>The SQLite connection string, creating the file's folder when it is missing.</summary>
    public string SqliteConnectionString(string? configured, string contentRoot)
    {
        if (!string.IsNullOrWhiteSpace(configured))
        {
            return configured;
        }
        string path = Path.GetFullPath(DatabasePath, contentRoot);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        return $"Data Source={path}";
    }
}
