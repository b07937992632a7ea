// The line's schedule: what a tank can run in a day (its cycle time, the work area one rack or
// barrel load carries, and the shifts it is manned), and the supervisor's placements of a job on
// a tank and day, which the planner keeps where they were put. The plan itself is computed from
// the open work orders each time it is asked for, so it never goes stale.
// Frozen: never import app code here.
import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table tanks
      add column cycle_minutes numeric not null default 60 check (cycle_minutes > 0 and cycle_minutes <= 1440),
      add column load_area_dm2 numeric check (load_area_dm2 > 0 and load_area_dm2 <= 100000),
      add column shifts_per_day smallint not null default 1 check (shifts_per_day between 0 and 3),
      add column shift_hours numeric not null default 8 check (shift_hours > 0 and shift_hours <= 12);

    create table schedule_placements (
      work_order_id uuid primary key references work_orders(id) on delete cascade,
      tank_id uuid not null references tanks(id) on delete cascade,
      day date not null,
      placed_by text references users(id) on delete set null,
      placed_at timestamptz not null default now()
    );
    create index schedule_placements_tank_day on schedule_placements (tank_id, day);

    -- The open work orders the planner reads, by finish.
    create index work_orders_open_by_finish on work_orders (finish_id, due_date)
      where state in ('accepted', 'received', 'in_process');

    alter table quotes add column turnaround_days integer check (turnaround_days between 0 and 365);
  `.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`
    alter table quotes drop column turnaround_days;
    drop index work_orders_open_by_finish;
    drop table schedule_placements;
    alter table tanks drop column cycle_minutes, drop column load_area_dm2, drop column shifts_per_day, drop column shift_hours;
  `.execute(db);
}
