// Starts the built app (`next start`) as a child in its own process group, against a given
// database, and stops it again. Used by the e2e set-up and by the load and fault runs.
import { type ChildProcess, spawn } from 'node:child_process';
import path from 'node:path';

export const ROOT = path.resolve(__dirname, '../..');

export type AppServer = { url: string; pid: number; stop: () => Promise<void> };

export async function answersHealth(url: string, timeoutMs = 1000): Promise<boolean> {
  try {
    await fetch(`${url}/api/health`, { signal: AbortSignal.timeout(timeoutMs) });
    return true;
  } catch {
    return false;
  }
}

export async function waitForHealth(url: string, timeoutMs: number): Promise<void> {
  const end = Date.now() + timeoutMs;
  while (Date.now() < end) {
    try {
      const r = await fetch(`${url}/api/health`, { signal: AbortSignal.timeout(2000) });
      if (r.ok) return;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`the app did not answer ${url}/api/health within ${timeoutMs} ms`);
}

export async function startAppServer(options: {
  port: number;
  databaseUrl: string;
  distDir?: string;
  env?: Record<string, string>;
  stdio?: 'inherit' | 'ignore';
}): Promise<AppServer> {
  const url = `http://127.0.0.1:${options.port}`;
  // Never test an old server left on the port: its build would not match this one.
  if (await answersHealth(url)) throw new Error(`port ${options.port} is already in use; stop what runs there (an old 'next start'?) and run again`);
  const child: ChildProcess = spawn(path.join(ROOT, 'node_modules/.bin/next'), ['start', '-H', '127.0.0.1', '-p', String(options.port)], {
    cwd: ROOT,
    env: {
      ...process.env,
      NODE_ENV: 'production',
      NEXT_DIST_DIR: options.distDir ?? process.env.NEXT_DIST_DIR ?? '.next-test',
      DATABASE_URL: options.databaseUrl,
      APP_URL: url,
      DEMO_MODE: '1',
      SMTP_PORT: process.env.SMTP_PORT ?? '2526',
      MAILBOX_URL: process.env.MAILBOX_URL ?? `http://127.0.0.1:${process.env.MAILBOX_PORT ?? 2581}`,
      ...options.env,
    },
    stdio: ['ignore', options.stdio ?? 'inherit', options.stdio ?? 'inherit'],
    // Its own process group, so that stopping it also stops the next-server child it forks.
    detached: true,
  });
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  const stop = async () => {
    if (!child.pid || child.exitCode !== null) return;
    try {
      process.kill(-child.pid, 'SIGTERM');
    } catch {
      return; // already gone
    }
    await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
  };
  try {
    await waitForHealth(url, 60_000);
  } catch (err) {
    await stop();
    throw err;
  }
  return { url, pid: child.pid!, stop };
}
