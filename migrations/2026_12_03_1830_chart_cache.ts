// Control charts of long ranges are worked out once per change of their analyte, not per request.
// Each analyte counts the changes to its analyses (a statement trigger: one update per INSERT,
// UPDATE or COPY, however many rows), and chart_cache keeps a chart's JSON under that count, so a
// reader whose count matches gets the stored answer and any new or corrected analysis makes the
// next reader work it out again. All in PostgreSQL, so every app process shares it.
// Frozen: never import app code here.
import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table tank_analytes add column analyses_version bigint not null default 0;

    create function tank_analytes_count_analyses() returns trigger language plpgsql as $$
    begin
      update tank_analytes t set analyses_version = t.analyses_version + 1
      where t.id in (select distinct c.analyte_id from changed c);
      return null;
    end $$;
    create trigger analyses_counted_on_insert after insert on analyses
      referencing new table as changed for each statement execute function tank_analytes_count_analyses();
    create trigger analyses_counted_on_update after update on analyses
      referencing new table as changed for each statement execute function tank_analytes_count_analyses();

    create table chart_cache (
      analyte_id uuid not null references tank_analytes (id) on delete cascade,
      -- the range, the limits' basis and the unit system the chart was drawn for
      view text not null check (length(view) <= 200),
      -- what the chart was worked out from: the output's format, the analyte's count of changes, its limits and names
      version text not null check (length(version) <= 400),
      body text not null,
      created_at timestamptz not null default now(),
      primary key (analyte_id, view)
    );
  `.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`
    drop table chart_cache;
    drop trigger analyses_counted_on_update on analyses;
    drop trigger analyses_counted_on_insert on analyses;
    drop function tank_analytes_count_analyses();
    alter table tank_analytes drop column analyses_version;
  `.execute(db);
}
