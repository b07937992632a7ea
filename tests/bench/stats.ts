// Figures the benchmarks share: a quantile of measured times, and the median time (and size) of
// repeated renders. One benchmark alone: `npm run bench -- <file name start>`, e.g. `-- billing`.
import { performance } from 'node:perf_hooks';

/** The q-quantile (0 … 1) of xs, the nearest rank below; the median at q = 0.5. */
export function quantile(xs: readonly number[], q: number): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor(q * s.length))]!;
}

export const median = (xs: readonly number[]): number => quantile(xs, 0.5);

/** Milliseconds that one awaited piece of work takes. */
export async function elapsed(work: () => Promise<unknown>): Promise<number> {
  const t0 = performance.now();
  await work();
  return performance.now() - t0;
}

/** Median time of `runs` renders, and the size of what one render made. */
export async function medianRender(runs: number, render: () => Promise<Buffer>): Promise<{ ms: number; bytes: number }> {
  const times: number[] = [];
  let bytes = 0;
  for (let i = 0; i < runs; i++) times.push(await elapsed(async () => (bytes = (await render()).length)));
  return { ms: median(times), bytes };
}
