// Benchmark of the plating engine: streaming STL analysis against a plain stream read of the same
// file, its memory growth, and plateCalc throughput. Run alone with `npm run bench -- plating`.
import { createReadStream, createWriteStream } from 'node:fs';
import { rm } from 'node:fs/promises';
import { once } from 'node:events';
import os from 'node:os';
import path from 'node:path';
import { StlParser, binaryStlChunks, plateCalc, uvSphereMesh } from '../../lib/plating';
import type { BenchRow } from './types';

const SEGMENTS = 1000; // a UV sphere of 1000 segments × 501 bands has 2·1000·500 = 1,000,000 triangles
const BANDS = 501;
const CHUNK_BYTES = 1 << 20;
const RUNS = 5;
const MB = 1024 * 1024;

async function writeStl(file: string): Promise<{ bytes: number; triangles: number }> {
  const mesh = uvSphereMesh(50, SEGMENTS, BANDS);
  const out = createWriteStream(file);
  let bytes = 0;
  for (const chunk of binaryStlChunks(mesh, { header: 'solid benchmark sphere' })) {
    bytes += chunk.length;
    if (!out.write(chunk)) await once(out, 'drain');
  }
  out.end();
  await once(out, 'finish');
  return { bytes, triangles: mesh.triangleCount };
}

type MemoryPeak = { rss: number; arrayBuffers: number };

// Samples memory after every chunk and on a timer, keeping the peak above the starting point.
function memoryWatch() {
  const start = process.memoryUsage();
  const peak: MemoryPeak = { rss: 0, arrayBuffers: 0 };
  const sample = () => {
    const now = process.memoryUsage();
    peak.rss = Math.max(peak.rss, now.rss - start.rss);
    peak.arrayBuffers = Math.max(peak.arrayBuffers, now.arrayBuffers - start.arrayBuffers);
  };
  const timer = setInterval(sample, 5);
  return { sample, stop: () => (clearInterval(timer), sample(), peak) };
}

async function timeRead(file: string, onChunk: (chunk: Uint8Array) => void): Promise<number> {
  const t0 = performance.now();
  for await (const chunk of createReadStream(file, { highWaterMark: CHUNK_BYTES })) onChunk(chunk as Buffer);
  return performance.now() - t0;
}

async function readOnly(file: string): Promise<number> {
  let bytes = 0;
  return timeRead(file, (c) => {
    bytes += c.length;
  });
}

async function readAndParse(file: string, triangles: number, watch?: ReturnType<typeof memoryWatch>) {
  const parser = new StlParser({ unit: 'mm' });
  const ms = await timeRead(file, (c) => {
    parser.push(c);
    watch?.sample();
  });
  const result = parser.finish();
  if (result.triangleCount !== triangles) throw new Error(`parsed ${result.triangleCount} of ${triangles} triangles`);
  return ms;
}

function plateCalcRate(): number {
  let calls = 0;
  let sink = 0;
  const t0 = performance.now();
  while (performance.now() - t0 < 500) {
    for (let i = 0; i < 1000; i++, calls++) {
      sink += plateCalc({
        element: 'Ni', charge: 2, areaDm2: 1 + (i % 50), thicknessUm: 5 + (i % 20),
        efficiency: 0.95, currentDensityAdm2: 2 + (i % 5),
      }).minutes;
    }
  }
  if (!Number.isFinite(sink)) throw new Error('plateCalc returned a non-finite result');
  return calls / ((performance.now() - t0) / 1000);
}

const fmt = (n: number, digits = 1) => n.toFixed(digits);

export async function run(): Promise<BenchRow[]> {
  const file = path.join(os.tmpdir(), `ampwright-bench-${process.pid}-${Date.now()}.stl`);
  try {
    const { bytes, triangles } = await writeStl(file);
    await readOnly(file); // warm the page cache and the JIT before timing
    await readAndParse(file, triangles);

    let bestRead = Infinity;
    let bestParse = Infinity;
    for (let i = 0; i < RUNS; i++) {
      bestRead = Math.min(bestRead, await readOnly(file));
      bestParse = Math.min(bestParse, await readAndParse(file, triangles));
    }
    const watch = memoryWatch();
    await readAndParse(file, triangles, watch);
    const peak = watch.stop();
    const growth = Math.max(peak.rss, peak.arrayBuffers, 0);
    const timeRatio = bestParse / bestRead;
    const memoryRatio = growth / bytes;
    const rate = plateCalcRate();

    return [
      {
        area: 'plating',
        what: `stream-parse binary STL, ${triangles.toLocaleString('en-US')} triangles (${fmt(bytes / MB)} MB)`,
        value: `${fmt(bestParse)} ms`,
        baseline: `stream read only ${fmt(bestRead)} ms`,
        ratio: Number(timeRatio.toFixed(2)),
        target: '≤ 3×',
        met: timeRatio <= 3,
      },
      {
        area: 'plating',
        what: 'peak memory growth while stream-parsing (rss / arrayBuffers, sampled)',
        value: `${fmt(growth / MB)} MB (rss ${fmt(peak.rss / MB)}, arrayBuffers ${fmt(peak.arrayBuffers / MB)})`,
        baseline: `file size ${fmt(bytes / MB)} MB`,
        ratio: Number(memoryRatio.toFixed(3)),
        target: '≤ 1.5× file size',
        met: memoryRatio <= 1.5,
      },
      {
        area: 'plating',
        what: 'plateCalc calls per second',
        value: `${Math.round(rate).toLocaleString('en-US')} calls/s`,
        baseline: '—',
        ratio: null,
        target: '—',
        met: null,
      },
    ];
  } finally {
    await rm(file, { force: true });
  }
}
