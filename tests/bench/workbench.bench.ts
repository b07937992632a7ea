// Benchmark of the estimator's workbench: the recompute the page runs on every keystroke
// (recomputeWorkbench, the same function the client component calls), timed in Node against the
// 16 ms of one frame at 60 Hz. Run alone with `npm run bench -- workbench`.
import { analyzeStl, cubeMesh, makeBinaryStl } from '../../lib/plating';
import { defaultForm, type WorkbenchForm } from '../../lib/estimating/form-state';
import { recomputeWorkbench } from '../../lib/estimating/recompute';
import { stlGeometryOf } from '../../lib/estimating/stl-file';
import type { BenchRow } from './types';

const FRAME_MS = 16;
const WARM_UP = 200;
const RUNS = 2000;

// Each run changes one keystroke's worth of the form, as typing does, so nothing is cached.
function timeRecomputes(base: WorkbenchForm, system: 'metric' | 'us'): { median: number; p99: number } {
  const times: number[] = [];
  for (let i = 0; i < WARM_UP + RUNS; i++) {
    const form = { ...base, quantity: String(100 + (i % 900)), efficiencyPct: String(80 + (i % 20)) };
    const t0 = performance.now();
    const view = recomputeWorkbench(form, system);
    const ms = performance.now() - t0;
    if (!view.result) throw new Error(`the benchmark form has errors: ${JSON.stringify(view.fieldErrors)}`);
    if (i >= WARM_UP) times.push(ms);
  }
  times.sort((a, b) => a - b);
  return { median: times[times.length >> 1]!, p99: times[Math.floor(times.length * 0.99)]! };
}

export async function run(): Promise<BenchRow[]> {
  const cube = stlGeometryOf('cube.stl', analyzeStl(makeBinaryStl(cubeMesh(20))));
  const cases: { what: string; form: WorkbenchForm; system: 'metric' | 'us' }[] = [
    { what: 'workbench recompute, shape, metric', form: defaultForm('metric', []), system: 'metric' },
    {
      what: 'workbench recompute, STL part, insoluble anodes, US units',
      form: { ...defaultForm('us', []), geometryMode: 'stl', stl: cube, anodes: 'insoluble', substrate: 'carbon-steel', hardnessHrc: '40', contactMaterial: 'aluminium' },
      system: 'us',
    },
  ];
  return cases.map(({ what, form, system }) => {
    const { median, p99 } = timeRecomputes(form, system);
    return {
      area: 'workbench',
      what: `${what} (median of ${RUNS}; p99 ${p99.toFixed(3)} ms)`,
      value: `${median.toFixed(3)} ms`,
      baseline: `one frame ${FRAME_MS} ms`,
      ratio: Number((median / FRAME_MS).toFixed(4)),
      target: '< 1× (inside one frame)',
      met: median < FRAME_MS,
    };
  });
}

// Alone: print the rows.
