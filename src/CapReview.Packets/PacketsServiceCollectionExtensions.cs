using CapReview.Packets.Signing;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Packets;

/// <summary>Registers packet making; needs the services of <c>AddReviews</c>.</summary>
public static class PacketsServiceCollectionExtensions
{
    public static IServiceCollection AddPackets(this IServiceCollection services, PacketOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        services.AddSingleton(options);
        services.AddSingleton<PacketCertificateSource>();
        services.AddSingleton<PacketService>();
        services.AddSingleton<PacketJobRunner>();
        services.AddSingleton<Signing.CycleDocumentSigning>();
        return services;
    }
}
