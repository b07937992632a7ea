// npm run bench — runs every tests/bench/*.bench.ts module and prints one table. Nothing is
// asserted on time: each figure stands beside a baseline measured in the same run.
import { readdirSync } from 'node:fs';
import { createRequire } from 'node:module';
import os from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import type { BenchModule, BenchRow } from './types';

// Server modules start with `import 'server-only'`, which throws outside React Server Components.
// The benchmarks run in plain Node (the PDF renderer needs React's full build, not the
// react-server one), so here the guard is an empty module, as vitest's alias makes it in the tests.
const requireHere = createRequire(__filename);
const serverOnly = requireHere.resolve('server-only');
requireHere.cache[serverOnly] = { id: serverOnly, filename: serverOnly, loaded: true, exports: {} } as unknown as NodeJS.Module;

function machine(): string {
  const cpus = os.cpus();
  return `${cpus.length} × ${cpus[0]?.model.trim() ?? 'unknown CPU'}, ${(os.totalmem() / 2 ** 30).toFixed(0)} GiB, Node ${process.version}, ${os.platform()} ${os.release()}`;
}

function table(rows: BenchRow[]): string {
  const header = ['area', 'what', 'value', 'baseline (same run)', 'ratio', 'target', 'met'];
  const body = rows.map((r) => [r.area, r.what, r.value, r.baseline, r.ratio === null ? '—' : `${r.ratio.toFixed(2)}×`, r.target, r.met === null ? '—' : r.met ? 'yes' : 'NO']);
  const widths = header.map((h, i) => Math.max(h.length, ...body.map((b) => b[i]!.length)));
  const line = (cells: string[]) => `| ${cells.map((c, i) => c.padEnd(widths[i]!)).join(' | ')} |`;
  return [line(header), `|${widths.map((w) => '-'.repeat(w + 2)).join('|')}|`, ...body.map(line)].join('\n');
}

async function main() {
  const only = process.argv[2];
  const dir = __dirname;
  const files = readdirSync(dir).filter((f) => f.endsWith('.bench.ts') && (!only || f.startsWith(only))).sort();
  const rows: BenchRow[] = [];
  for (const f of files) {
    const started = Date.now();
    try {
      const mod = (await import(pathToFileURL(path.join(dir, f)).href)) as BenchModule;
      rows.push(...(await mod.run()));
      console.error(`[bench] ${f} done in ${((Date.now() - started) / 1000).toFixed(1)} s`);
    } catch (err) {
      console.error(`[bench] ${f} failed:`, err instanceof Error ? err.message : err);
      rows.push({ area: f.replace('.bench.ts', ''), what: 'failed to run', value: String(err instanceof Error ? err.message : err).slice(0, 80), baseline: '—', ratio: null, target: '—', met: null });
    }
  }
  console.log(`\nMachine: ${machine()}\n`);
  console.log(table(rows));
  process.exit(0);
}
void main();
