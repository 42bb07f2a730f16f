using System.Security.Cryptography;
using CapReview.Reviews.Audit;

namespace CapReview.Web.Hosting;

/// <summary>
/// The audit chain's keys in a file outside the database: one key a line, its id, a space, the secret in base64; the
/// last line keys new events (append a line to rotate, keep the old ones to verify what they keyed). Made with one
/// random key when missing, readable by its owner only.
/// </summary>
public static class AuditKeyFile
{
    /// <summary>The ring in the file, read (and made, if missing) when the chain first needs a key.</summary>
    public static AuditKeyRing LoadOrCreate(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        return AuditKeyRing.Deferred(() =>
        {
            if (!File.Exists(path))
            {
                Create(path);
            }
            var keys = File.ReadAllLines(path)
                .Select(l => l.Trim())
                .Where(l => l.Length > 0 && !l.StartsWith('#'))
                .Select(l => l.Split(' ', 2, StringSplitOptions.TrimEntries))
                .Select(p => p.Length == 2 ? new AuditKey(p[0], Convert.FromBase64String(p[1]))
                    : throw new InvalidOperationException($"{path}: each line is a key id, a space and the secret in base64."))
                .ToList();
            return keys.Count > 0 ? (keys, keys[^1].Id) : throw new InvalidOperationException($"{path} holds no audit key.");
        });
    }

    private static void Create(string path)
    {
        Directory.CreateDirectory(Path.GetDirectoryName(Path.GetFullPath(path))!);
        string line = $"local-1 {Convert.ToBase64String(RandomNumberGenerator.GetBytes(AuditKeyRing.MinimumSecretBytes))}{Environment.NewLine}";
        try
        {
            // CreateNew: when two processes start on one database at once, the second reads the first one's key.
            var options = new FileStreamOptions { Mode = FileMode.CreateNew, Access = FileAccess.Write };
            if (!OperatingSystem.IsWindows())
            {
                options.UnixCreateMode = UnixFileMode.UserRead | UnixFileMode.UserWrite;
            }
            using var writer = new StreamWriter(path, options);
            writer.Write(line);
        }
        catch (IOException) when (File.Exists(path))
        {
            // Made meanwhile by another process.
        }
    }
}
