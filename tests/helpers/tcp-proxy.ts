// A TCP relay to another address that a test can cut (every connection dropped, new ones refused)
// and restore on the same port: the database going away and coming back, for one client only.
import net from 'node:net';

export type TcpProxy = { port: number; cut(): Promise<void>; restore(): Promise<void>; close(): Promise<void> };

export async function startTcpProxy(target: { host: string; port: number }): Promise<TcpProxy> {
  const sockets = new Set<net.Socket>();
  const track = (s: net.Socket) => {
    sockets.add(s);
    s.on('close', () => sockets.delete(s));
    s.on('error', () => s.destroy());
  };
  const server = net.createServer((client) => {
    const upstream = net.connect(target.port, target.host);
    track(client);
    track(upstream);
    client.pipe(upstream).pipe(client);
    client.on('close', () => upstream.destroy());
    upstream.on('close', () => client.destroy());
  });
  const listen = (port: number) =>
    new Promise<number>((resolve, reject) => {
      server.once('error', reject);
      server.listen(port, '127.0.0.1', () => {
        server.off('error', reject);
        resolve((server.address() as net.AddressInfo).port);
      });
    });
  const stop = () =>
    new Promise<void>((resolve) => {
      for (const s of sockets) s.destroy();
      if (!server.listening) return resolve();
      server.close(() => resolve());
    });
  const port = await listen(0);
  return { port, cut: stop, restore: async () => void (await listen(port)), close: stop };
}
