// A small round-robin in front of several app processes on loopback: each new TCP connection goes
// to the next upstream in turn, as a plain load balancer would. Counts what each upstream was given.
import net from 'node:net';

export type RoundRobin = { url: string; port: number; connections: number[]; close(): Promise<void> };

export async function startRoundRobin(upstreamPorts: readonly number[]): Promise<RoundRobin> {
  const connections = upstreamPorts.map(() => 0);
  const sockets = new Set<net.Socket>();
  let next = 0;
  const track = (s: net.Socket) => {
    sockets.add(s);
    s.on('close', () => sockets.delete(s));
    s.on('error', () => s.destroy());
  };
  const server = net.createServer((client) => {
    const i = next++ % upstreamPorts.length;
    connections[i]! += 1;
    const upstream = net.connect(upstreamPorts[i]!, '127.0.0.1');
    track(client);
    track(upstream);
    client.pipe(upstream).pipe(client);
    client.on('close', () => upstream.destroy());
    upstream.on('close', () => client.destroy());
  });
  const port = await new Promise<number>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => resolve((server.address() as net.AddressInfo).port));
  });
  return {
    url: `http://127.0.0.1:${port}`,
    port,
    connections,
    close: () =>
      new Promise<void>((resolve) => {
        for (const s of sockets) s.destroy();
        server.close(() => resolve());
      }),
  };
}
