using CapReview.Packets;
using Microsoft.Data.Sqlite;

namespace CapReview.Web.Hosting;

/// <summary>
/// Reads the "Packets" section. A relative certificate path is taken from the content root; the development
/// certificate, unless placed elsewhere, lives beside the SQLite database, or in the content root's db/ folder on
/// PostgreSQL (kept out of the repository by .gitignore).
/// </summary>
public static class PacketSettings
{
    public static PacketOptions Read(IConfiguration configuration, Reviews.Storage.DatabaseSettings database, string contentRoot)
    {
        ArgumentNullException.ThrowIfNull(database);
        ArgumentNullException.ThrowIfNull(configuration);
        var options = configuration.GetSection("Packets").Get<PacketOptions>() ?? new PacketOptions();
        if (!string.IsNullOrWhiteSpace(options.Signing.CertificatePath))
        {
            options.Signing.CertificatePath = Path.GetFullPath(options.Signing.CertificatePath, contentRoot);
        }
        if (!Path.IsPathRooted(options.Signing.DevelopmentCertificatePath))
        {
            string folder = database.Provider == Reviews.Storage.DatabaseProvider.Sqlite
                ? Path.GetDirectoryName(Path.GetFullPath(new SqliteConnectionStringBuilder(database.ConnectionString).DataSource, contentRoot)) ?? contentRoot
                : Path.Combine(contentRoot, "db");
            options.Signing.DevelopmentCertificatePath = Path.Combine(folder, options.Signing.DevelopmentCertificatePath);
        }
        return options;
    }
}
