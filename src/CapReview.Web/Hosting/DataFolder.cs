using Microsoft.Data.Sqlite;

namespace CapReview.Web.Hosting;

/// <summary>
/// Where the installation keeps files it makes for itself when none is configured (the development signing
/// certificate, the audit chain's key file): beside the SQLite database, or the content root's db/ folder on
/// PostgreSQL (kept out of the repository by .gitignore).
/// </summary>
public static class DataFolder
{
    public static string Of(Reviews.Storage.DatabaseSettings database, string contentRoot)
    {
        ArgumentNullException.ThrowIfNull(database);
        return database.Provider == Reviews.Storage.DatabaseProvider.Sqlite
            ? Path.GetDirectoryName(Path.GetFullPath(new SqliteConnectionStringBuilder(database.ConnectionString).DataSource, contentRoot)) ?? contentRoot
            : Path.Combine(contentRoot, "db");
    }
}
