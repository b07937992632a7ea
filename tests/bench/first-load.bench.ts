// Benchmark of what a phone downloads to open the tank-side page (/floor/tanks/N-NI1 as the demo
// plater): every JavaScript file the served HTML names in a <script src>, summed gzip-compressed
// (node:zlib, default level), against the same sum for an empty page of a minimal Next.js app built
// and served in the same run with the same next, react and react-dom. The minimal app is generated
// in .run/bench-empty-next (git-ignored) with a hard-linked copy of our node_modules: a project of
// its own, so that nothing of ours (proxy.ts, tsconfig paths, next.config) reaches its build. Run alone
// with `npm run bench -- first-load`.
import { execFileSync } from 'node:child_process';
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { TestSessions } from '../helpers/sessions';
import { ROOT, RUN_DIR, runLogged, startApp, startNext } from './next-server';
import type { BenchRow } from './types';

const EMPTY_DIR = path.join(RUN_DIR, 'bench-empty-next');
const EMPTY_PORT = 3301;
const TANK_PAGE = '/floor/tanks/N-NI1';
const TARGET_RATIO = 1.3; // our own target: the plater's page costs at most 30 % more than Next.js itself

const EMPTY_APP: Record<string, string> = {
  'package.json': '{ "private": true }\n',
  // Its own root: without it Next would look for a workspace root (and a proxy.ts) further up.
  'next.config.mjs': "const here = import.meta.dirname;\nexport default { turbopack: { root: here }, outputFileTracingRoot: here };\n",
  'app/layout.tsx': "import type { ReactNode } from 'react';\n\nexport default function RootLayout({ children }: { children: ReactNode }) {\n  return (\n    <html lang=\"en\">\n      <body>{children}</body>\n    </html>\n  );\n}\n",
  'app/page.tsx': 'export default function Page() {\n  return <main />;\n}\n',
};

async function buildEmptyApp(): Promise<void> {
  rmSync(EMPTY_DIR, { recursive: true, force: true });
  for (const [file, text] of Object.entries(EMPTY_APP)) {
    mkdirSync(path.dirname(path.join(EMPTY_DIR, file)), { recursive: true });
    writeFileSync(path.join(EMPTY_DIR, file), text);
  }
  // Hard links: the very same files as ours, no download, and no room taken.
  execFileSync('cp', ['-al', path.join(ROOT, 'node_modules'), path.join(EMPTY_DIR, 'node_modules')]);
  const env: NodeJS.ProcessEnv = { ...process.env, NODE_ENV: 'production', NEXT_TELEMETRY_DISABLED: '1' };
  delete env.NEXT_DIST_DIR;
  runLogged('bench-empty-next-build', EMPTY_DIR, [path.join(EMPTY_DIR, 'node_modules/next/dist/bin/next'), 'build'], env);
}

type FirstLoad = { files: number; rawBytes: number; gzipBytes: number };

/** The JavaScript a browser fetches for `page`: each distinct <script src> of its HTML, as served. */
async function firstLoadJs(base: string, page: string, cookie?: string): Promise<FirstLoad> {
  const res = await fetch(`${base}${page}`, { headers: cookie ? { cookie } : {}, redirect: 'manual' });
  if (res.status !== 200) throw new Error(`${page} answered ${res.status}, not the page`);
  const html = await res.text();
  const sources = new Set([...html.matchAll(/<script\b[^>]*\bsrc="([^"]+)"/g)].map((m) => m[1]!));
  if (sources.size === 0) throw new Error(`${page} names no scripts`);
  let rawBytes = 0;
  let gzipBytes = 0;
  for (const src of sources) {
    const js = await fetch(new URL(src, base));
    if (!js.ok) throw new Error(`${src} answered ${js.status}`);
    const bytes = Buffer.from(await js.arrayBuffer());
    rawBytes += bytes.length;
    gzipBytes += gzipSync(bytes).length;
  }
  return { files: sources.size, rawBytes, gzipBytes };
}

const kb = (bytes: number) => `${(bytes / 1024).toFixed(1)} KB`;

export async function run(): Promise<BenchRow[]> {
  const sessions = new TestSessions();
  await sessions.open();
  const servers: { stop: () => Promise<void> }[] = [];
  try {
    await buildEmptyApp();
    const empty = await startNext({ label: 'bench-empty-next', dir: EMPTY_DIR, port: EMPTY_PORT, readyPath: '/' });
    servers.push(empty);
    const app = await startApp();
    servers.push(app);
    const tank = await firstLoadJs(app.url, TANK_PAGE, sessions.cookie('plater'));
    const bare = await firstLoadJs(empty.url, '/');
    const ratio = tank.gzipBytes / bare.gzipBytes;
    return [
      {
        area: 'web',
        what: `first-load JS of ${TANK_PAGE} (plater), ${tank.files} scripts, ${kb(tank.rawBytes)} uncompressed`,
        value: `${kb(tank.gzipBytes)} gzip`,
        baseline: `empty Next.js page: ${kb(bare.gzipBytes)} gzip, ${bare.files} scripts`,
        ratio,
        target: `≤ ${TARGET_RATIO}×`,
        met: ratio <= TARGET_RATIO,
      },
    ];
  } finally {
    for (const s of servers.reverse()) await s.stop();
    await sessions.close();
  }
}
