import 'server-only';
// The hazards of the bath that runs each finish: the first active tank that serves it (the one a
// quote prices from, lib/quotes/process.ts) and its template's tags. An alkaline zinc finish is
// caustic because its tank is, whatever its name says.
import type { Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import type { Hazard } from '@/lib/bath/hazards';
import { templateHazards } from '@/lib/bath/templates';
import { activeTankFacts } from '@/lib/quotes/pricing-context';
import { tanksForFinish } from '@/lib/quotes/process';

export async function bathHazardsByFinish(finishIds: readonly string[], conn: Kysely<Database> = defaultDb): Promise<Map<string, Hazard[]>> {
  const out = new Map<string, Hazard[]>();
  if (finishIds.length === 0) return out;
  const [finishes, tanks] = await Promise.all([
    conn.selectFrom('finishes').select(['id', 'family', 'family_params', 'element', 'ion_charge', 'method', 'line_id']).where('id', 'in', [...new Set(finishIds)]).execute(),
    activeTankFacts(conn),
  ]);
  for (const f of finishes) {
    const tank = tanksForFinish({ family: f.family, familyParams: f.family_params, element: f.element, ionCharge: f.ion_charge, method: f.method, lineId: f.line_id }, tanks)[0];
    out.set(f.id, templateHazards(tank?.templateId));
  }
  return out;
}
