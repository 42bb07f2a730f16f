using CapReview.Packets;
using Microsoft.Data.Sqlite;

namespace CapReview.Web.Hosting;

/// <summary>
/// Reads the "Packets" section. A relative certificate path is taken from the content root; the development
/// certificate, unless placed elsewhere, lives beside the SQLite database (kept out of the repository by .gitignore).
/// </summary>
public static class PacketSettings
{
    public static PacketOptions Read(IConfiguration configuration, string connectionString, string contentRoot)
    {
        ArgumentNullException.ThrowIfNull(configuration);
        var options = configuration.GetSection("Packets").Get<PacketOptions>() ?? new PacketOptions();
        if (!string.IsNullOrWhiteSpace(options.Signing.CertificatePath))
        {
            options.Signing.CertificatePath = Path.GetFullPath(options.Signing.CertificatePath, contentRoot);
        }
        if (!Path.IsPathRooted(options.Signing.DevelopmentCertificatePath))
        {
            string database = new SqliteConnectionStringBuilder(connectionString).DataSource;
            string folder = Path.GetDirectoryName(Path.GetFullPath(database, contentRoot)) ?? contentRoot;
            options.Signing.DevelopmentCertificatePath = Path.Combine(folder, options.Signing.DevelopmentCertificatePath);
        }
        return options;
    }
}
