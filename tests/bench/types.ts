// One row of the benchmark table that `npm run bench` prints. Nothing is asserted on time:
// each figure is shown beside the baseline measured in the same run, and the target it aims for.
export type BenchRow = {
  area: string;
  what: string;
  value: string; // the measured figure with its unit, e.g. "41.2 ms"
  baseline: string; // the reference measured in the same run, e.g. "read only 15.0 ms"
  ratio: number | null; // value / baseline where both are comparable
  target: string; // e.g. "≤ 3×"
  met: boolean | null;
};

export type BenchModule = { run: () => Promise<BenchRow[]> };
