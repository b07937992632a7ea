// Lot sampling: lot size → sample-size code letter → sample size. The seeded table is
// ANSI/ASQ Z1.4 (same as ISO 2859-1 / MIL-STD-105E) Table I, general inspection level II, with
// the sample sizes of Table II-A. A supervisor may replace it with an edited table that passes
// validateSamplingTable.
import { badInput, requireNumber } from '../bath/checks';

export type SamplingRow = {
  minLot: number;
  /** null: and over. */
  maxLot: number | null;
  codeLetter: string;
  sampleSize: number;
};

// Source: ANSI/ASQ Z1.4-2008 Table I (level II) and Table II-A sample sizes.
export const Z14_LEVEL_II: readonly SamplingRow[] = [
  { minLot: 2, maxLot: 8, codeLetter: 'A', sampleSize: 2 },
  { minLot: 9, maxLot: 15, codeLetter: 'B', sampleSize: 3 },
  { minLot: 16, maxLot: 25, codeLetter: 'C', sampleSize: 5 },
  { minLot: 26, maxLot: 50, codeLetter: 'D', sampleSize: 8 },
  { minLot: 51, maxLot: 90, codeLetter: 'E', sampleSize: 13 },
  { minLot: 91, maxLot: 150, codeLetter: 'F', sampleSize: 20 },
  { minLot: 151, maxLot: 280, codeLetter: 'G', sampleSize: 32 },
  { minLot: 281, maxLot: 500, codeLetter: 'H', sampleSize: 50 },
  { minLot: 501, maxLot: 1200, codeLetter: 'J', sampleSize: 80 },
  { minLot: 1201, maxLot: 3200, codeLetter: 'K', sampleSize: 125 },
  { minLot: 3201, maxLot: 10000, codeLetter: 'L', sampleSize: 200 },
  { minLot: 10001, maxLot: 35000, codeLetter: 'M', sampleSize: 315 },
  { minLot: 35001, maxLot: 150000, codeLetter: 'N', sampleSize: 500 },
  { minLot: 150001, maxLot: 500000, codeLetter: 'P', sampleSize: 800 },
  { minLot: 500001, maxLot: null, codeLetter: 'Q', sampleSize: 1250 },
];

/** Problems with an edited table: rows must be ordered, contiguous and end open-ended. */
export function validateSamplingTable(rows: readonly SamplingRow[]): string[] {
  const problems: string[] = [];
  if (!Array.isArray(rows) || rows.length === 0) return ['The table has no rows.'];
  rows.forEach((r, i) => {
    const where = `Row ${i + 1}`;
    if (!Number.isInteger(r.minLot) || r.minLot < 1) problems.push(`${where}: the lowest lot size must be a whole number of at least 1.`);
    if (r.maxLot !== null && (!Number.isInteger(r.maxLot) || r.maxLot < r.minLot)) {
      problems.push(`${where}: the highest lot size must be a whole number not below the lowest.`);
    }
    if (!Number.isInteger(r.sampleSize) || r.sampleSize < 1) problems.push(`${where}: the sample size must be a whole number of at least 1.`);
    if (!r.codeLetter || typeof r.codeLetter !== 'string') problems.push(`${where}: a code letter is needed.`);
    const prev = rows[i - 1];
    if (prev && (prev.maxLot === null || r.minLot !== prev.maxLot + 1)) problems.push(`${where}: must start right after row ${i}.`);
    if (prev && r.sampleSize < prev.sampleSize) problems.push(`${where}: sample sizes must not decrease.`);
    if (i < rows.length - 1 && r.maxLot === null) problems.push(`${where}: only the last row may be open-ended.`);
  });
  if (rows[rows.length - 1]?.maxLot !== null) problems.push('The last row must cover "and over" (no highest lot size).');
  return problems;
}

export type SampleSize = {
  lotSize: number;
  codeLetter: string | null;
  sampleSize: number;
  /** True when the sample is the whole lot (Z1.4: sample size at or above lot size → 100 % inspection). */
  inspectAll: boolean;
};

export function sampleSizeFor(lotSize: number, table: readonly SamplingRow[] = Z14_LEVEL_II): SampleSize {
  const lot = requireNumber(lotSize, 'lotSize', 'Lot size', { integer: true, positive: true });
  const problems = validateSamplingTable(table);
  if (problems.length > 0) throw badInput('table', `The sampling table is not usable: ${problems.join(' ')}`);
  const first = table[0] as SamplingRow;
  if (lot < first.minLot) return { lotSize: lot, codeLetter: null, sampleSize: lot, inspectAll: true };
  const row = table.find((r) => lot >= r.minLot && (r.maxLot === null || lot <= r.maxLot)) as SamplingRow;
  if (row.sampleSize >= lot) return { lotSize: lot, codeLetter: row.codeLetter, sampleSize: lot, inspectAll: true };
  return { lotSize: lot, codeLetter: row.codeLetter, sampleSize: row.sampleSize, inspectAll: false };
}
