import 'server-only';
// Turns a part's area entry into stored figures: area (dm²), volume (cm³) when known, and the
// saved calculation that shows how the area was found. An STL is re-read from the stored file,
// never taken from numbers the browser sent.
import type { Kysely } from 'kysely';
import type { Database } from '@/db';
import type { SessionUser } from '@/lib/auth/current-user';
import { AppError } from '@/lib/errors';
import { readFileFor } from '@/lib/files/access';
import { CONTENT_TYPE } from '@/lib/files/sniff';
import { analyzeStl, partMassG, StlError, SUBSTRATES, toStorage, type SubstrateId } from '@/lib/plating';
import type { PartArea } from './schemas';
import { measureShapeEntry } from './shapes';

export type MeasuredArea = {
  areaDm2: number;
  volumeCm3: number | null;
  stlFileId: string | null;
  calculation: { input: Record<string, unknown>; result: Record<string, unknown> } | null;
};

// parts.area_dm2 CHECK: 0 < area < 100000.
const MAX_AREA_DM2 = 100_000;

export async function measurePartArea(actor: SessionUser, area: PartArea, substrate: SubstrateId, trx: Kysely<Database>): Promise<MeasuredArea> {
  const measured = await measure(actor, area, substrate, trx);
  if (!(measured.areaDm2 > 0) || measured.areaDm2 >= MAX_AREA_DM2) {
    throw new AppError('BAD_INPUT', 'Check the highlighted field.', { area: ['That area is outside what a part can have (more than 0 and under 100,000 dm²).'] });
  }
  return measured;
}

async function measure(actor: SessionUser, area: PartArea, substrate: SubstrateId, trx: Kysely<Database>): Promise<MeasuredArea> {
  if (area.method === 'direct') {
    return { areaDm2: toStorage(area.value, area.unit), volumeCm3: null, stlFileId: null, calculation: null };
  }
  if (area.method === 'shape') {
    const outcome = measureShapeEntry(area.entry);
    if (!outcome.ok) throw new AppError('BAD_INPUT', 'Check the highlighted fields.', outcome.fieldErrors);
    return {
      areaDm2: outcome.measure.areaDm2,
      volumeCm3: outcome.measure.volumeCm3,
      stlFileId: null,
      calculation: { input: { method: 'shape', ...area.entry }, result: { ...outcome.measure } },
    };
  }
  const file = await readFileFor(actor, area.fileId, trx);
  if (!file || file.content_type !== CONTENT_TYPE.stl) {
    throw new AppError('BAD_INPUT', 'Check the highlighted field.', { stlFile: ['Upload the STL model again: the stored model was not found.'] });
  }
  try {
    const analysis = analyzeStl(file.bytes, { unit: area.unit, densityGPerCm3: SUBSTRATES[substrate].densityGPerCm3 });
    return {
      areaDm2: analysis.areaDm2,
      volumeCm3: analysis.volumeCm3 > 0 ? analysis.volumeCm3 : null,
      stlFileId: file.id,
      calculation: { input: { method: 'stl', fileId: file.id, fileName: file.name, unit: area.unit }, result: { ...analysis } },
    };
  } catch (e) {
    if (e instanceof StlError) throw new AppError('BAD_INPUT', 'Check the highlighted field.', { stlFile: [e.message] });
    throw e;
  }
}

/** The weight in grams: as entered, else from the volume and the substrate's density, else unknown. */
export function partWeightG(entered: { weight: number | null; weightUnit: Parameters<typeof toStorage>[1] }, volumeCm3: number | null, substrate: SubstrateId): number | null {
  if (entered.weight !== null) return toStorage(entered.weight, entered.weightUnit);
  return volumeCm3 ? partMassG(volumeCm3, SUBSTRATES[substrate].densityGPerCm3) : null;
}
