// The office lists (quotes, work orders) answer a repeated read without running their query:
// list_data_version counts the committed changes to every table those lists read, and an app
// process keeps a list's answer under that count (lib/grid/list-cache.ts). The count moves at
// commit (a deferred trigger, once per transaction however many rows it wrote), so a writer holds
// the one row only for the moment of its commit and two writers never wait on each other for
// their whole transactions; a transaction that rolls back moves nothing. Users count only when a
// name changes (the lists show names; a sign-in's bookkeeping is not a change to them).
// Frozen: never import app code here.
import { type Kysely, sql } from 'kysely';

const TABLES = ['quotes', 'work_orders', 'customers', 'parts', 'finishes'] as const;

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table list_data_version (
      id boolean primary key default true check (id),
      version bigint not null default 0,
      changed_at timestamptz not null default now()
    );
    insert into list_data_version default values;

    create function list_data_changed() returns trigger language plpgsql as $$
    begin
      -- Once per transaction: the first of its deferred events counts the change, the rest return.
      if current_setting('ampwright.list_data_counted', true) = 'yes' then
        return null;
      end if;
      perform set_config('ampwright.list_data_counted', 'yes', true);
      update list_data_version set version = version + 1, changed_at = now();
      return null;
    end $$;

    -- A sent quote turns "expired" when its date passes: the lists ask for the next such instant.
    create index quotes_sent_expiry on quotes (expires_at) where status = 'sent';
  `.execute(db);
  for (const table of TABLES) {
    await sql`
      create constraint trigger ${sql.raw(`${table}_list_data_changed`)}
        after insert or update or delete on ${sql.table(table)}
        deferrable initially deferred
        for each row execute function list_data_changed()
    `.execute(db);
  }
  await sql`
    create constraint trigger users_list_data_changed_on_insert_or_delete
      after insert or delete on users deferrable initially deferred
      for each row execute function list_data_changed();
    create constraint trigger users_list_data_changed_on_rename
      after update on users deferrable initially deferred
      for each row when (old.name is distinct from new.name) execute function list_data_changed();
  `.execute(db);
  // Emptying a table fires no row trigger: count it at once (tests and scripts only).
  for (const table of [...TABLES, 'users']) {
    await sql`
      create trigger ${sql.raw(`${table}_list_data_truncated`)} after truncate on ${sql.table(table)}
        for each statement execute function list_data_changed()
    `.execute(db);
  }
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const table of [...TABLES, 'users']) {
    await sql`drop trigger ${sql.raw(`${table}_list_data_truncated`)} on ${sql.table(table)}`.execute(db);
  }
  await sql`
    drop trigger users_list_data_changed_on_rename on users;
    drop trigger users_list_data_changed_on_insert_or_delete on users;
  `.execute(db);
  for (const table of TABLES) {
    await sql`drop trigger ${sql.raw(`${table}_list_data_changed`)} on ${sql.table(table)}`.execute(db);
  }
  await sql`
    drop index quotes_sent_expiry;
    drop function list_data_changed();
    drop table list_data_version;
  `.execute(db);
}
