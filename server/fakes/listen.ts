import type { Server } from 'node:net';

/** Listens on host:port (0 = any free port) and resolves with the bound port. */
export function listen(server: Server, port: number, host: string): Promise<number> {
  return new Promise((resolve, reject) => {
    const onError = (err: Error) => reject(err);
    server.once('error', onError);
    server.listen(port, host, () => {
      server.off('error', onError);
      const address = server.address();
      if (!address || typeof address === 'string') return reject(new Error('server has no TCP address'));
      resolve(address.port);
    });
  });
}
