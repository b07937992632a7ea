// Small shared helpers for the local service fakes: paths, ports, HTTP bodies and replies.
import type { IncomingMessage, Server, ServerResponse } from 'node:http';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const here = path.dirname(fileURLToPath(import.meta.url));

/** The repository root, found from this file's own location so the cwd does not matter. */
export const projectRoot = path.resolve(here, '..', '..');

/** `$FAKES_STATE_DIR/<name>`, or `.run/fakes/<name>` under the project root. */
export function resolveStateDir(name: string, env: NodeJS.ProcessEnv = process.env): string {
  const base = env.FAKES_STATE_DIR?.trim() || path.join(projectRoot, '.run', 'fakes');
  return path.resolve(base, name);
}

/** True when the module at `moduleUrl` is the script node was asked to run. */
export function isMainModule(moduleUrl: string): boolean {
  const entry = process.argv[1];
  if (!entry) return false;
  return path.resolve(entry) === fileURLToPath(moduleUrl);
}

export class PortSettingError extends Error {
  constructor(name: string, raw: string) {
    super(`${name} must be a whole number from 0 to 65535, got "${raw}"`);
    this.name = 'PortSettingError';
  }
}

/** Reads a port from the environment; 0 asks the OS for a free port. */
export function portFromEnv(name: string, fallback: number, env: NodeJS.ProcessEnv = process.env): number {
  const raw = env[name]?.trim();
  if (!raw) return fallback;
  if (!/^\d{1,5}$/.test(raw) || Number(raw) > 65535) throw new PortSettingError(name, raw);
  return Number(raw);
}

export class BodyTooLargeError extends Error {
  constructor(limit: number) {
    super(`request body is larger than ${limit} bytes`);
    this.name = 'BodyTooLargeError';
  }
}

export function readBody(req: IncomingMessage, limitBytes = 1_000_000): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    req.on('data', (chunk: Buffer) => {
      size += chunk.length;
      if (size > limitBytes) {
        reject(new BodyTooLargeError(limitBytes));
        req.destroy();
        return;
      }
      chunks.push(chunk);
    });
    req.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    req.on('error', reject);
  });
}

export function sendJson(res: ServerResponse, status: number, body: unknown): void {
  const text = JSON.stringify(body, null, 2);
  res.writeHead(status, {
    'content-type': 'application/json; charset=utf-8',
    'content-length': Buffer.byteLength(text),
    'cache-control': 'no-store',
  });
  res.end(text);
}

export function sendHtml(res: ServerResponse, status: number, html: string): void {
  res.writeHead(status, {
    'content-type': 'text/html; charset=utf-8',
    'content-length': Buffer.byteLength(html),
    'cache-control': 'no-store',
  });
  res.end(html);
}

/** Listens on 127.0.0.1 only: the fakes must never be reachable from other machines. */
export function listenLocal(server: Server, port: number): Promise<number> {
  return new Promise((resolve, reject) => {
    const onError = (err: Error) => reject(err);
    server.once('error', onError);
    server.listen(port, '127.0.0.1', () => {
      server.off('error', onError);
      const address = server.address();
      resolve(typeof address === 'object' && address ? address.port : port);
    });
  });
}

export function closeHttpServer(server: Server): Promise<void> {
  return new Promise((resolve) => {
    if (!server.listening) return resolve();
    server.close(() => resolve());
    // Keep-alive sockets from SDK clients would otherwise hold close() open.
    server.closeAllConnections();
  });
}

/** Runs `close` on SIGINT/SIGTERM and exits, forcing the exit if closing hangs. */
export function exitOnSignals(label: string, close: () => Promise<void>): void {
  const stop = (signal: string) => {
    console.log(`[${label}] ${signal} received, shutting down`);
    setTimeout(() => process.exit(0), 3000).unref();
    close().then(
      () => process.exit(0),
      (err: unknown) => {
        console.error(`[${label}] error while closing:`, err);
        process.exit(1);
      },
    );
  };
  process.once('SIGINT', () => stop('SIGINT'));
  process.once('SIGTERM', () => stop('SIGTERM'));
}
