using CapReview.Reviews.Audit;

namespace CapReview.Web.Hosting;

/// <summary>
/// Reads the "Audit" section: the chain's keys (<c>Audit:Keys:{id}</c> = secret in base64, <c>Audit:CurrentKey</c>)
/// from configuration, e.g. environment variables or a secret store; otherwise from <c>Audit:KeyFile</c>, by default
/// <c>audit-chain.key</c> in the <see cref="DataFolder"/>. <c>Audit:HeadLog</c> names the head log the
/// <c>audit-head</c> command appends to.
/// </summary>
public sealed record AuditKeySettings(AuditKeyRing Keys, string? KeyFile, string? HeadLog)
{
    public static AuditKeySettings Read(IConfiguration configuration, Reviews.Storage.DatabaseSettings database, string contentRoot)
    {
        ArgumentNullException.ThrowIfNull(configuration);
        string? headLog = configuration["Audit:HeadLog"] is { Length: > 0 } log ? Path.GetFullPath(log, contentRoot) : null;
        var configured = configuration.GetSection("Audit:Keys").GetChildren()
            .Select(c => new AuditKey(c.Key, Convert.FromBase64String(c.Value ?? ""))).ToList();
        if (configured.Count > 0)
        {
            return new(new AuditKeyRing(configured, configuration["Audit:CurrentKey"] ?? configured[^1].Id), null, headLog);
        }
        string path = configuration["Audit:KeyFile"] is { Length: > 0 } file
            ? Path.GetFullPath(file, contentRoot)
            : Path.Combine(DataFolder.Of(database, contentRoot), "audit-chain.key");
        return new(AuditKeyFile.LoadOrCreate(path), path, headLog);
    }
}
