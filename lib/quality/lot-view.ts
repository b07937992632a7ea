import 'server-only';
// The lot record and its bath condition for the screens, read with the app's database.
import { db } from '@/db';
import { bathSnapshot } from './certificate/bath-snapshot';
import type { BathSnapshot } from './certificate/content';
import { loadLot } from './lot';
import type { LotRecord } from './lot-types';

export async function getLotView(workOrderId: string): Promise<{ lot: LotRecord; bath: BathSnapshot } | null> {
  const lot = await loadLot(db, workOrderId);
  if (!lot) return null;
  return { lot, bath: await bathSnapshot(db, lot.runs) };
}
