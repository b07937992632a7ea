// A run made while its bath was outside a specification limit opens a nonconformance of its own
// kind ('bath'), which a supervisor must disposition before the lot can be inspected or certified.
// Frozen: never import app code here.
import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table nonconformances drop constraint nonconformances_source_check;
    alter table nonconformances add constraint nonconformances_source_check
      check (source in ('thickness', 'bake', 'bath', 'other'));
  `.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`
    update nonconformances set source = 'other' where source = 'bath';
    alter table nonconformances drop constraint nonconformances_source_check;
    alter table nonconformances add constraint nonconformances_source_check
      check (source in ('thickness', 'bake', 'other'));
  `.execute(db);
}
