import 'server-only';
import { db } from '@/db';
import { isUuid } from '@/lib/files/store';

export async function findFinishes() {
  return db
    .selectFrom('finishes as f')
    .leftJoin('lines as l', 'l.id', 'f.line_id')
    .select(['f.id', 'f.code', 'f.name', 'f.spec_text', 'f.element', 'f.ion_charge', 'f.min_thickness_um', 'f.max_thickness_um', 'f.method', 'f.bake_required', 'f.process_route', 'f.is_active', 'f.family', 'f.family_params', 'l.name as line_name'])
    .orderBy('f.is_active', 'desc')
    .orderBy('f.code')
    .execute();
}

export async function getFinish(finishId: string) {
  if (!isUuid(finishId)) return null;
  return (await db.selectFrom('finishes').selectAll().where('id', '=', finishId).executeTakeFirst()) ?? null;
}

export async function findLineOptions() {
  return db.selectFrom('lines').select(['id', 'name', 'method']).orderBy('name').execute();
}
