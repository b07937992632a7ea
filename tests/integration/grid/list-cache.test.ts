// The office lists' kept answers (lib/grid/list-cache.ts): a repeated read runs no list query, a
// committed write anywhere the lists read (here from another connection, as another app process
// or a script would) is seen by the next read, a rolled-back one changes nothing, and a sent
// quote's expiry changes the list with no write at all.
import { sql } from 'kysely';
import { afterAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { gridResponse } from '@/lib/grid/server';
import { QUOTE_GRID, quoteGridSelect } from '@/lib/quotes/queries';
import { WORK_ORDER_GRID, workOrderGridSelect } from '@/lib/orders/queries';
import { statementLog } from '../../helpers/statement-log';
import { makeCustomer } from '../quotes/fixtures';

const { db: watched, sent } = statementLog();

afterAll(() => db.destroy());

let made = 0;
const quoteNumber = () => `Q9${String(Math.floor(Math.random() * 1000)).padStart(3, '0')}-${String(Date.now() % 1e7).padStart(7, '0')}${made++}`;
const rateSet = async () => (await db.selectFrom('rate_sets').select('id').limit(1).executeTakeFirstOrThrow()).id;
const aQuote = async (customerId: string, v: { status?: 'draft' | 'sent'; total_cents: number; number?: string; expiresIn?: string }) =>
  db
    .insertInto('quotes')
    .values({
      number: v.number ?? quoteNumber(),
      customer_id: customerId,
      rate_set_id: await rateSet(),
      valid_days: 30,
      status: v.status ?? 'draft',
      total_cents: v.total_cents,
      ...(v.expiresIn ? { sent_at: sql<Date>`now()`, expires_at: sql<Date>`now() + ${v.expiresIn}::interval` } : {}),
    })
    .execute();

const nameOf = async (customerId: string) => (await db.selectFrom('customers').select('name').where('id', '=', customerId).executeTakeFirstOrThrow()).name;

const version = async () => Number((await db.selectFrom('list_data_version').select('version').executeTakeFirstOrThrow()).version);

async function quotes(qs: string, etag?: string) {
  sent.length = 0;
  const res = await gridResponse(new Request(`http://x/api/quotes?${qs}`, { headers: etag ? { 'if-none-match': etag } : {} }), quoteGridSelect(watched), { ...QUOTE_GRID, db: watched });
  const text = await res.text();
  return { status: res.status, etag: res.headers.get('etag')!, body: text ? (JSON.parse(text) as { rows: Record<string, unknown>[]; total: number }) : null, statements: [...sent] };
}

describe('kept list answers', () => {
  it('answers a repeated read from memory and a revalidation with 304, each after one single-row read', async () => {
    const c = await makeCustomer();
    await aQuote(c.id, { total_cents: 100 });
    const qs = `limit=5&filter=${encodeURIComponent(JSON.stringify({ customer: { filterType: 'text', type: 'equals', filter: await nameOf(c.id) } }))}`;
    const first = await quotes(qs);
    expect(first.status).toBe(200);
    expect(first.etag).toMatch(/^W\/"l[A-Za-z0-9_-]{27}"$/);
    expect(first.statements.some((s) => /from "quotes" as "q"/.test(s))).toBe(true);

    const again = await quotes(qs);
    expect(again.status).toBe(200);
    expect(again.body).toEqual(first.body);
    expect(again.etag).toBe(first.etag);
    expect(again.statements).toHaveLength(1);
    expect(again.statements[0]).toMatch(/from list_data_version/);

    const revalidated = await quotes(qs, first.etag);
    expect(revalidated.status).toBe(304);
    expect(revalidated.body).toBeNull();
    expect(revalidated.statements).toHaveLength(1);
  });

  it('sees a write committed on another connection at the next read, a rename included', async () => {
    const c = await makeCustomer();
    const number = quoteNumber();
    await aQuote(c.id, { number, total_cents: 1234 });
    const qs = `limit=5&filter=${encodeURIComponent(JSON.stringify({ number: { filterType: 'text', type: 'equals', filter: number } }))}`;
    const name = await nameOf(c.id);
    const before = await quotes(qs);
    expect(before.body!.rows[0]!.customer).toBe(name);

    const v = await version();
    await db.updateTable('customers').set({ name: `${name} renamed` }).where('id', '=', c.id).execute();
    expect(await version()).toBe(v + 1);
    const after = await quotes(qs, before.etag);
    expect(after.status).toBe(200);
    expect(after.etag).not.toBe(before.etag);
    expect(after.body!.rows[0]!.customer).toBe(`${name} renamed`);
  });

  it('counts a transaction once however many rows and tables it writes, and a rolled-back one not at all', async () => {
    const c = await makeCustomer();
    const v = await version();
    await db.transaction().execute(async (trx) => {
      const rate_set_id = await rateSet();
      await trx.insertInto('quotes').values([1, 2, 3].map((i) => ({ number: quoteNumber(), customer_id: c.id, rate_set_id, valid_days: 30, total_cents: i }))).execute();
      await trx.updateTable('customers').set({ phone: '555 0100' }).where('id', '=', c.id).execute();
      await trx.updateTable('parts').set({ description: 'counted once' }).where('customer_id', '=', c.id).execute();
    });
    expect(await version()).toBe(v + 1);

    await expect(
      db.transaction().execute(async (trx) => {
        await trx.updateTable('customers').set({ name: 'never committed' }).where('id', '=', c.id).execute();
        throw new Error('roll back');
      }),
    ).rejects.toThrow('roll back');
    expect(await version()).toBe(v + 1);
  });

  it('counts a change to a user only when a name the lists show changes', async () => {
    const c = await makeCustomer();
    const v = await version();
    await db.updateTable('users').set({ unit_system: 'us' }).where('id', '=', c.contact.id).execute();
    expect(await version()).toBe(v);
    await db.updateTable('users').set({ name: 'Renamed Buyer' }).where('id', '=', c.contact.id).execute();
    expect(await version()).toBe(v + 1);
  });

  it('turns a sent quote to "expired" when its date passes, with no write in between', async () => {
    const c = await makeCustomer();
    const number = quoteNumber();
    await aQuote(c.id, { number, status: 'sent', total_cents: 500, expiresIn: '1.5 seconds' });
    const qs = `limit=5&filter=${encodeURIComponent(JSON.stringify({ number: { filterType: 'text', type: 'equals', filter: number } }))}`;
    const sentNow = await quotes(qs);
    expect(sentNow.body!.rows[0]!.status).toBe('sent');
    const v = await version();
    await new Promise((r) => setTimeout(r, 1_700));
    const later = await quotes(qs, sentNow.etag);
    expect(await version()).toBe(v);
    expect(later.status).toBe(200);
    expect(later.body!.rows[0]!.status).toBe('expired');
  });

  it('keeps the work-order list the same way', async () => {
    const res = await gridResponse(new Request('http://x/api/work-orders?limit=3'), workOrderGridSelect(), WORK_ORDER_GRID);
    const etag = res.headers.get('etag')!;
    expect(etag).toMatch(/^W\/"l/);
    const again = await gridResponse(new Request('http://x/api/work-orders?limit=3', { headers: { 'if-none-match': etag } }), workOrderGridSelect(), WORK_ORDER_GRID);
    expect(again.status).toBe(304);
  });

  it('with AMPWRIGHT_LIST_CACHE=off, validates the bytes as every other list does', async () => {
    process.env.AMPWRIGHT_LIST_CACHE = 'off';
    try {
      const res = await quotes('limit=2');
      expect(res.etag).toMatch(/^W\/"[A-Za-z0-9_-]{27}"$/);
      expect(res.statements.some((s) => /from "quotes" as "q"/.test(s))).toBe(true);
    } finally {
      delete process.env.AMPWRIGHT_LIST_CACHE;
    }
  });
});

describe('what the count follows', () => {
  it('has a trigger on every table the kept lists read, their search included', async () => {
    const compiled = [
      quoteGridSelect().compile().sql,
      workOrderGridSelect().compile().sql,
      sql`select 1 where ${WORK_ORDER_GRID.search('%x%')}`.compile(db).sql,
    ].join('\n');
    const tables = new Set([...compiled.matchAll(/\b(?:from|join)\s+"?([a-z_]+)"?/g)].map((m) => m[1]!));
    expect(tables.size).toBeGreaterThanOrEqual(6);
    const triggers = await sql<{ table: string }>`
      select distinct c.relname as table from pg_trigger t join pg_class c on c.oid = t.tgrelid
      where t.tgfoid = 'list_data_changed'::regproc and not t.tgisinternal`.execute(db);
    const followed = new Set(triggers.rows.map((r) => r.table));
    for (const table of tables) expect(followed, `list_data_version does not follow ${table}`).toContain(table);
  });
});
