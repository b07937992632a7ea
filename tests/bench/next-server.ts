// The web benchmarks' servers: a production build of the app into its own folder (.next-bench,
// rebuilt only when a source changed), `next start` on a loopback port of its own, and a stop that
// always runs. Every server started here is stopped when the benchmark ends, fails or is interrupted.
import { type ChildProcess, execFileSync, spawn } from 'node:child_process';
import { closeSync, existsSync, openSync, readdirSync, readFileSync, statSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';

export const ROOT = path.resolve(__dirname, '../..');
export const RUN_DIR = path.join(ROOT, '.run');
export const BENCH_DIST_DIR = '.next-bench';
export const BENCH_APP_PORT = 3300;

/** `pid` leads the server's own process group (what `next start` forks is in it too). */
export type RunningServer = { url: string; pid: number; stop: () => Promise<void> };

const running = new Set<ChildProcess>();

function killGroup(child: ChildProcess): void {
  try {
    if (child.pid && child.exitCode === null) process.kill(-child.pid, 'SIGTERM');
  } catch {
    // already gone
  }
}

// Children run in their own process group (so a stop reaches anything they fork), which also means
// Ctrl-C does not reach them: stop them here before this process goes.
process.once('exit', () => running.forEach(killGroup));
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.once(signal, () => {
    running.forEach(killGroup);
    process.exit(130);
  });
}

function portFree(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = net.connect({ host: '127.0.0.1', port });
    socket.once('connect', () => {
      socket.destroy();
      resolve(false);
    });
    socket.once('error', () => resolve(true));
  });
}

const logTail = (file: string) => (existsSync(file) ? readFileSync(file, 'utf8').split('\n').slice(-30).join('\n') : '');

/** Runs `node <script> <args>` in `cwd`, output to a log under .run; throws with the log's tail on failure. */
export function runLogged(label: string, cwd: string, args: string[], env: NodeJS.ProcessEnv): void {
  const log = path.join(RUN_DIR, `${label}.log`);
  const fd = openSync(log, 'w');
  try {
    execFileSync(process.execPath, args, { cwd, env, stdio: ['ignore', fd, fd] });
  } catch {
    throw new Error(`${label} failed (see ${log}):\n${logTail(log)}`);
  } finally {
    closeSync(fd);
  }
}

/**
 * Starts `node <args>` (a server listening on `port`) in its own process group and waits until
 * `readyPath` answers. Refuses a port already in use: an old server there would not be this build.
 */
export async function startServer(opts: { label: string; cwd: string; args: string[]; port: number; env: NodeJS.ProcessEnv; readyPath: string }): Promise<RunningServer> {
  const url = `http://127.0.0.1:${opts.port}`;
  if (!(await portFree(opts.port))) throw new Error(`port ${opts.port} is in use; stop what runs there and run again`);
  const log = path.join(RUN_DIR, `${opts.label}.log`);
  const fd = openSync(log, 'w');
  const child = spawn(process.execPath, opts.args, { cwd: opts.cwd, env: opts.env, stdio: ['ignore', fd, fd], detached: true });
  closeSync(fd);
  running.add(child);
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  const stop = async () => {
    killGroup(child);
    await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
    running.delete(child);
  };
  const end = Date.now() + 60_000;
  while (true) {
    if (child.exitCode !== null) {
      running.delete(child);
      throw new Error(`${opts.label} exited before it answered (see ${log}):\n${logTail(log)}`);
    }
    try {
      await fetch(`${url}${opts.readyPath}`, { signal: AbortSignal.timeout(2000) });
      return { url, pid: child.pid!, stop };
    } catch {
      if (Date.now() > end) {
        await stop();
        throw new Error(`${opts.label} did not answer ${url}${opts.readyPath} within 60 s (see ${log})`);
      }
      await new Promise((r) => setTimeout(r, 250));
    }
  }
}

/** `next start` of the Next.js app in `dir` on 127.0.0.1:port (production). */
export function startNext(opts: { label: string; dir: string; port: number; env?: Record<string, string>; readyPath: string }): Promise<RunningServer> {
  return startServer({
    label: opts.label,
    cwd: opts.dir,
    args: [path.join(opts.dir, 'node_modules/next/dist/bin/next'), 'start', '-H', '127.0.0.1', '-p', String(opts.port)],
    port: opts.port,
    env: { ...process.env, NODE_ENV: 'production', NEXT_TELEMETRY_DISABLED: '1', ...opts.env },
    readyPath: opts.readyPath,
  });
}

// What the app's build is made of: when none changed since the last bench build, it is reused.
const APP_SOURCES = ['app', 'components', 'lib', 'db', 'fonts', 'proxy.ts', 'next.config.mjs', 'tailwind.config.ts', 'postcss.config.mjs', 'tsconfig.json', 'package.json', 'package-lock.json'];

function newestChange(p: string): number {
  if (!existsSync(p)) return 0;
  const s = statSync(p);
  if (!s.isDirectory()) return s.mtimeMs;
  return readdirSync(p).reduce((m, f) => Math.max(m, newestChange(path.join(p, f))), s.mtimeMs);
}

let appBuild: Promise<void> | undefined;

/** Builds the app into .next-bench once per run, and only when a source is newer than that build. */
export function buildApp(): Promise<void> {
  appBuild ??= (async () => {
    const buildId = path.join(ROOT, BENCH_DIST_DIR, 'BUILD_ID');
    const built = existsSync(buildId) ? statSync(buildId).mtimeMs : 0;
    if (built > Math.max(...APP_SOURCES.map((s) => newestChange(path.join(ROOT, s))))) return;
    console.error(`[bench] building the app into ${BENCH_DIST_DIR} (a few minutes on 2 cores)`);
    runLogged('bench-build', ROOT, [path.join(ROOT, 'node_modules/next/dist/bin/next'), 'build'], {
      ...process.env,
      NODE_ENV: 'production',
      NEXT_TELEMETRY_DISABLED: '1',
      NEXT_DIST_DIR: BENCH_DIST_DIR,
    });
  })();
  return appBuild;
}

/** The app, built and served from .next-bench against the bench database (DATABASE_URL). */
export async function startApp(env: Record<string, string> = {}): Promise<RunningServer> {
  await buildApp();
  const url = `http://127.0.0.1:${BENCH_APP_PORT}`;
  return startNext({
    label: 'bench-app',
    dir: ROOT,
    port: BENCH_APP_PORT,
    env: { NEXT_DIST_DIR: BENCH_DIST_DIR, APP_URL: url, ...env },
    readyPath: '/api/health',
  });
}
