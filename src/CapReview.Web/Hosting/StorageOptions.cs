namespace CapReview.Web.Hosting;

/// <summary>
/// Which database the installation uses (Storage:Provider, Sqlite by default or PostgreSql) and where: for SQLite a
/// file, unless a connection string named CapReview is set; for PostgreSQL that connection string, which is required.
/// </summary>
public sealed class StorageOptions
{
    public Reviews.Storage.DatabaseProvider Provider { get; set; } = Reviews.Storage.DatabaseProvider.Sqlite;

    /// <summary>
    /// Path of the SQLite file, relative to the content root. Development settings point it at the repository's
    /// <c>db/</c> folder; a deployment sets it (or the connection string) explicitly.
    /// </summary>
    public string DatabasePath { get; set; } = "db/capreview.db";

    /// <summary>The database to use, with a clear message when PostgreSQL is chosen without its connection string.</summary>
    public Reviews.Storage.DatabaseSettings Database(string? configured, string contentRoot) => Provider switch
    {
        Reviews.Storage.DatabaseProvider.PostgreSql => string.IsNullOrWhiteSpace(configured)
            ? throw new InvalidOperationException("Storage:Provider is PostgreSql: set the connection string ConnectionStrings:CapReview (Host=…;Database=…;Username=…;Password=…), for example in the environment as ConnectionStrings__CapReview.")
            : new(Provider, configured),
        _ => Reviews.Storage.DatabaseSettings.Sqlite(SqliteConnectionString(configured, contentRoot)),
    };

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
