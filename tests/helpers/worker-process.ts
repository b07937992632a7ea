// The background worker as its own process (docker-free-scripts/worker.ts, started the way demo.sh
// starts it), so a test can kill it like a crash would and read what it logged.
import { type ChildProcess, spawn } from 'node:child_process';
import path from 'node:path';

export type WorkerProcess = {
  child: ChildProcess;
  lines: string[];
  exit: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
  hasExited(): boolean;
  waitForLine(pattern: RegExp, timeoutMs?: number): Promise<string>;
};

const root = path.resolve(__dirname, '../..');

export async function startWorkerProcess(env: Record<string, string>): Promise<WorkerProcess> {
  const child = spawn(process.execPath, ['--conditions=react-server', '--import', 'tsx', 'docker-free-scripts/worker.ts'], {
    cwd: root,
    env: { ...process.env, SMTP_PORT: process.env.SMTP_PORT ?? '2526', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const lines: string[] = [];
  for (const stream of [child.stdout, child.stderr]) {
    let rest = '';
    stream?.setEncoding('utf8').on('data', (chunk: string) => {
      const parts = (rest + chunk).split('\n');
      rest = parts.pop() ?? '';
      lines.push(...parts);
    });
  }
  let exited = false;
  const exit = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) =>
    child.on('exit', (code, signal) => {
      exited = true;
      resolve({ code, signal });
    }),
  );
  const worker: WorkerProcess = {
    child,
    lines,
    exit,
    hasExited: () => exited,
    async waitForLine(pattern, timeoutMs = 30_000) {
      const end = Date.now() + timeoutMs;
      for (;;) {
        const hit = lines.find((l) => pattern.test(l));
        if (hit) return hit;
        if (exited || Date.now() > end) throw new Error(`worker did not log ${pattern}; it logged:\n${lines.join('\n')}`);
        await new Promise((r) => setTimeout(r, 100));
      }
    },
  };
  await worker.waitForLine(/^\[worker\] started: /);
  return worker;
}
