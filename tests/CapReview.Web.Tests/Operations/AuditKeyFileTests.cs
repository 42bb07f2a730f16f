using System.Security.Cryptography;
using CapReview.Reviews.Audit;
using CapReview.Web.Hosting;

namespace CapReview.Web.Tests.Operations;

/// <summary>The audit chain's keys kept in a file outside the database: made once, kept private, rotated by a line.</summary>
public sealed class AuditKeyFileTests : IDisposable
{
    private readonly string _folder = Directory.CreateTempSubdirectory("capreview-audit-key-").FullName;

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    [Fact]
    public void The_key_is_made_once_readable_by_its_owner_only_and_a_later_line_rotates_it()
    {
        string path = Path.Combine(_folder, "audit-chain.key");
        AuditKey first = AuditKeyFile.LoadOrCreate(path).Current;
        Assert.Equal(AuditKeyRing.MinimumSecretBytes, first.Secret.Length);
        Assert.Equal(first.Secret, AuditKeyFile.LoadOrCreate(path).Current.Secret);
        if (!OperatingSystem.IsWindows())
        {
            Assert.Equal(UnixFileMode.UserRead | UnixFileMode.UserWrite, File.GetUnixFileMode(path));
        }

        File.AppendAllText(path, $"rotated-2028 {Convert.ToBase64String(RandomNumberGenerator.GetBytes(48))}{Environment.NewLine}");
        AuditKeyRing rotated = AuditKeyFile.LoadOrCreate(path);
        Assert.Equal("rotated-2028", rotated.Current.Id);
        Assert.Equal(first.Secret, rotated.Find(first.Id)!.Secret);
    }

    [Fact]
    public void A_key_shorter_than_the_hash_is_refused_when_the_chain_first_needs_it()
    {
        string path = Path.Combine(_folder, "short.key");
        File.WriteAllText(path, $"short {Convert.ToBase64String(new byte[16])}\n");
        AuditKeyRing ring = AuditKeyFile.LoadOrCreate(path);
        var refused = Assert.Throws<InvalidOperationException>(() => ring.Current);
        Assert.Contains("at least 32 bytes", refused.Message, StringComparison.Ordinal);
    }
}
