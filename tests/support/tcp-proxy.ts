import { createServer, connect, type Server, type Socket } from 'node:net';

/**
 * A TCP relay between the app and PostgreSQL that a test can cut and restore, to see what the
 * app does when its database goes away (without stopping the cluster other test files use).
 */
export async function startTcpProxy(target: { host: string; port: number }) {
  const sockets = new Set<Socket>();
  let server: Server | undefined;
  let port = 0;

  let listening = false;
  const listen = () =>
    new Promise<void>((resolve, reject) => {
      if (listening) return resolve();
      server = createServer((client) => {
        const upstream = connect(target.port, target.host);
        for (const s of [client, upstream]) {
          sockets.add(s);
          s.on('close', () => sockets.delete(s));
          s.on('error', () => s.destroy());
        }
        client.pipe(upstream).pipe(client);
      });
      server.once('error', reject);
      server.listen(port, '127.0.0.1', () => {
        listening = true;
        const address = server!.address();
        if (address && typeof address === 'object') port = address.port;
        resolve();
      });
    });

  await listen();
  return {
    get port() {
      return port;
    },
    /** Drops every connection and stops accepting new ones, as a stopped server would. */
    async cut() {
      for (const s of sockets) s.destroy();
      listening = false;
      await new Promise<void>((resolve) => server!.close(() => resolve()));
    },
    /** Accepts connections again on the same port. */
    restore: listen,
    close() {
      for (const s of sockets) s.destroy();
      server?.close();
    },
  };
}
