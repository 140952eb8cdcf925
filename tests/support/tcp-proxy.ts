import net from 'node:net';

/**
 * A loopback TCP relay in front of a server, which a test can cut (every
 * connection dropped, new ones refused) and restore on the same port — the
 * way a database looks from the app while it restarts or the network fails.
 */
export async function startTcpProxy(target: { host: string; port: number }) {
  const open = new Set<net.Socket>();
  let server: net.Server | null = null;
  const track = (s: net.Socket) => {
    open.add(s);
    s.on('close', () => open.delete(s));
    s.on('error', () => s.destroy());
  };
  const listen = (port: number) =>
    new Promise<number>((resolve, reject) => {
      const srv = net.createServer((client) => {
        const upstream = net.connect(target);
        track(client);
        track(upstream);
        client.pipe(upstream).pipe(client);
        client.on('close', () => upstream.destroy());
        upstream.on('close', () => client.destroy());
      });
      srv.once('error', reject);
      srv.listen(port, '127.0.0.1', () => {
        server = srv;
        resolve((srv.address() as net.AddressInfo).port);
      });
    });
  const port = await listen(0);
  const stop = () =>
    new Promise<void>((resolve) => {
      for (const s of open) s.destroy();
      if (!server) return resolve();
      server.close(() => resolve());
      server = null;
    });
  return {
    port,
    /** Drop every connection and refuse new ones. */
    cut: stop,
    /** Accept connections again, on the same port. */
    restore: () => listen(port).then(() => undefined),
    close: stop,
  };
}
