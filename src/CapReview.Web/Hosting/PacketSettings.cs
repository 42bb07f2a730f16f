using CapReview.Packets;

namespace CapReview.Web.Hosting;

/// <summary>
/// Reads the "Packets" section. A relative certificate path is taken from the content root; the development
/// certificate, unless placed elsewhere, lives in the <see cref="DataFolder"/>.
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
            options.Signing.DevelopmentCertificatePath = Path.Combine(DataFolder.Of(database, contentRoot), options.Signing.DevelopmentCertificatePath);
        }
        return options;
    }
}
