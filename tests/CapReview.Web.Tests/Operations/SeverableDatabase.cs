using System.Net;
using System.Net.Sockets;
using CapReview.Reviews.Storage;
using Microsoft.Data.Sqlite;
using Npgsql;

namespace CapReview.Web.Tests.Operations;

/// <summary>
/// A database a test can take away from a running app and give back. SQLite: the database's folder is moved away
/// (the file can no longer be opened) and back. PostgreSQL: the app reaches the server through a loopback relay of
/// ours, which drops every connection and refuses new ones while cut, as a server that went down would.
/// </summary>
public sealed class SeverableDatabase : IAsyncDisposable
{
    private readonly string? _folder;
    private readonly Relay? _relay;

    private SeverableDatabase(DatabaseSettings settings, string? folder, Relay? relay)
    {
        Settings = settings;
        _folder = folder;
        _relay = relay;
    }

    public DatabaseSettings Settings { get; }

    /// <summary>A database of its own on SQLite; on PostgreSQL, <paramref name="postgres"/> reached through the relay.</summary>
    public static SeverableDatabase Create(CapReview.TestSupport.TestDatabase postgres)
    {
        ArgumentNullException.ThrowIfNull(postgres);
        if (postgres.IsPostgreSql)
        {
            var target = new NpgsqlConnectionStringBuilder(postgres.Settings.ConnectionString);
            var relay = new Relay(target.Host!, target.Port);
            target.Host = "127.0.0.1";
            target.Port = relay.Port;
            target.Timeout = 3;
            return new SeverableDatabase(new DatabaseSettings(DatabaseProvider.PostgreSql, target.ConnectionString), null, relay);
        }
        string folder = Directory.CreateTempSubdirectory("capreview-severable-").FullName;
        return new SeverableDatabase(DatabaseSettings.Sqlite($"Data Source={Path.Combine(folder, "capreview.db")};Pooling=False"), folder, null);
    }

    public void Cut()
    {
        if (_relay is not null)
        {
            _relay.Cut();
            return;
        }
        SqliteConnection.ClearAllPools();
        Directory.Move(_folder!, _folder + "-away");
    }

    public void Restore()
    {
        if (_relay is not null)
        {
            _relay.Restore();
            return;
        }
        Directory.Move(_folder + "-away", _folder!);
    }

    public async ValueTask DisposeAsync()
    {
        if (_relay is not null)
        {
            await _relay.DisposeAsync();
            return;
        }
        SqliteConnection.ClearAllPools();
        foreach (string folder in new[] { _folder!, _folder + "-away" }.Where(Directory.Exists))
        {
            Directory.Delete(folder, recursive: true);
        }
    }

    /// <summary>Copies bytes both ways between each accepted connection and the server, until cut.</summary>
    private sealed class Relay : IAsyncDisposable
    {
        private readonly string _host;
        private readonly int _serverPort;
        private readonly List<TcpClient> _open = [];
        private TcpListener? _listener;

        public Relay(string host, int serverPort)
        {
            _host = host;
            _serverPort = serverPort;
            var probe = new TcpListener(IPAddress.Loopback, 0);
            probe.Start();
            Port = ((IPEndPoint)probe.LocalEndpoint).Port;
            probe.Stop();
            Restore();
        }

        public int Port { get; }

        public void Restore()
        {
            _listener = new TcpListener(IPAddress.Loopback, Port);
            _listener.Server.SetSocketOption(SocketOptionLevel.Socket, SocketOptionName.ReuseAddress, true);
            _listener.Start();
            TcpListener listener = _listener;
            _ = Task.Run(async () =>
            {
                while (true)
                {
                    TcpClient client;
                    try
                    {
                        client = await listener.AcceptTcpClientAsync();
                    }
                    catch (Exception ex) when (ex is SocketException or ObjectDisposedException)
                    {
                        return;
                    }
                    var server = new TcpClient();
                    try
                    {
                        await server.ConnectAsync(_host, _serverPort);
                    }
                    catch (SocketException)
                    {
                        client.Dispose();
                        server.Dispose();
                        continue;
                    }
                    lock (_open)
                    {
                        _open.Add(client);
                        _open.Add(server);
                    }
                    _ = Pump(client, server);
                    _ = Pump(server, client);
                }
            });
        }

        public void Cut()
        {
            _listener?.Stop();
            _listener = null;
            lock (_open)
            {
                foreach (TcpClient connection in _open)
                {
                    connection.Dispose();
                }
                _open.Clear();
            }
        }

        public ValueTask DisposeAsync()
        {
            Cut();
            return ValueTask.CompletedTask;
        }

        private static async Task Pump(TcpClient from, TcpClient to)
        {
            try
            {
                await from.GetStream().CopyToAsync(to.GetStream());
            }
            catch (Exception ex) when (ex is IOException or ObjectDisposedException or InvalidOperationException)
            {
                // Cut, or the other side closed.
            }
            finally
            {
                from.Dispose();
                to.Dispose();
            }
        }
    }
}
