// Starts the built app (`next start`, built into .next-test by the test command) against the test
// database, once for all browser tests, and stops it afterwards.
import { type ChildProcess, spawn } from 'node:child_process';
import path from 'node:path';
import { prepareTestDatabase, TEST_DATABASE_URL } from './test-db';

export const E2E_PORT = Number(process.env.APP_PORT ?? 3100);
export const E2E_URL = `http://127.0.0.1:${E2E_PORT}`;

let server: ChildProcess | undefined;

async function waitForHealth(timeoutMs: number): Promise<void> {
  const end = Date.now() + timeoutMs;
  while (Date.now() < end) {
    try {
      const r = await fetch(`${E2E_URL}/api/health`);
      if (r.ok) return;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`the app did not answer ${E2E_URL}/api/health within ${timeoutMs} ms`);
}

async function portAnswers(): Promise<boolean> {
  try {
    await fetch(`${E2E_URL}/api/health`, { signal: AbortSignal.timeout(1000) });
    return true;
  } catch {
    return false;
  }
}

export default async function setup(): Promise<() => Promise<void>> {
  // Never test an old server left on the port: its build would not match this one.
  if (await portAnswers()) throw new Error(`port ${E2E_PORT} is already in use; stop what runs there (an old 'next start'?) and run again`);
  await prepareTestDatabase();
  const root = path.resolve(__dirname, '../..');
  server = spawn(path.join(root, 'node_modules/.bin/next'), ['start', '-H', '127.0.0.1', '-p', String(E2E_PORT)], {
    cwd: root,
    env: {
      ...process.env,
      NODE_ENV: 'production',
      NEXT_DIST_DIR: process.env.NEXT_DIST_DIR ?? '.next-test',
      DATABASE_URL: TEST_DATABASE_URL,
      APP_URL: E2E_URL,
      DEMO_MODE: '1',
      SMTP_PORT: process.env.SMTP_PORT ?? '2526',
      MAILBOX_URL: process.env.MAILBOX_URL ?? `http://127.0.0.1:${process.env.MAILBOX_PORT ?? 2581}`,
    },
    stdio: ['ignore', 'inherit', 'inherit'],
    // Its own process group, so that stopping it also stops the next-server child it forks.
    detached: true,
  });
  await waitForHealth(60_000);
  return async () => {
    if (server?.pid) {
      try {
        process.kill(-server.pid, 'SIGTERM');
      } catch {
        // already gone
      }
    }
  };
}
