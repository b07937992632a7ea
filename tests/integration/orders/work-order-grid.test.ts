import { CompiledQuery, sql, type Kysely } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db, type Database } from '@/db';
import { GRID_COUNT_CAP, gridQueryFrom, runGridQuery } from '@/lib/grid/server';
import { orderSql, whereSql } from '@/lib/grid/sql';
import { WORK_ORDER_GRID_COLUMNS, workOrderGridSelect, workOrderSearch } from '@/lib/orders/queries';
import { inRolledBackTransaction } from '../records/helpers';
import { finishId, makeCustomer, type TestCustomer } from '../quotes/fixtures';

afterAll(() => db.destroy());

// 100 000 work orders of our own, inserted inside a transaction that is rolled back.
const ROWS = 100_000;
const OPTS = { columns: WORK_ORDER_GRID_COLUMNS, key: 'w.number', defaultSort: { colId: 'number', dir: 'desc' as const } };
let cust: TestCustomer;
let finish: string;

beforeAll(async () => {
  [cust, finish] = await Promise.all([makeCustomer(), finishId('ZN-B633-SC2')]);
});

async function withManyOrders<T>(fn: (q: Kysely<Database>) => Promise<T>): Promise<T> {
  return inRolledBackTransaction(async (trx) => {
    // Filling the table is the slow part, not what is measured.
    await sql`set local statement_timeout = '180s'`.execute(trx);
    await sql`
      insert into work_orders (number, customer_id, part_id, finish_id, po_number, due_date, quantity_ordered, state, unit_price_cents, pricing_basis, total_cents)
      select 'W2988-' || lpad(i::text, 6, '0'), ${cust.id}, ${cust.parts.screw}, ${finish}, 'PO-' || (i % 5000),
             date '2026-01-01' + (i % 400), 100 + i % 900,
             (array['accepted','received','in_process','plated','baked','inspected','shipped','invoiced'])[1 + i % 8],
             12.5, 'piece', 1250 * (1 + i % 10)
      from generate_series(1, ${ROWS}) as i`.execute(trx);
    await sql`analyze work_orders`.execute(trx);
    await sql`set local statement_timeout = '15s'`.execute(trx);
    return fn(trx);
  });
}

/** EXPLAIN ANALYZE of the page query the grid would run for this query string. */
async function planOf(q: Kysely<Database>, qs: string): Promise<string> {
  const query = gridQueryFrom(new URL(`http://x/api/work-orders?${qs}`), WORK_ORDER_GRID_COLUMNS);
  const where = whereSql(WORK_ORDER_GRID_COLUMNS, query);
  let qb = workOrderGridSelect(q);
  if (where) qb = qb.where(where);
  const built = orderSql(WORK_ORDER_GRID_COLUMNS, query.sort, OPTS.defaultSort, OPTS.key)
    .reduce((b, term) => b.orderBy(term), qb)
    .limit(query.limit)
    .offset(query.offset)
    .compile();
  const r = await q.executeQuery<{ 'QUERY PLAN': string }>(CompiledQuery.raw(`explain (analyze, costs off) ${built.sql}`, [...built.parameters]));
  return r.rows.map((x) => x['QUERY PLAN']).join('\n');
}

async function timed(q: Kysely<Database>, qs: string) {
  const started = performance.now();
  const page = await runGridQuery(workOrderGridSelect(q), { ...OPTS, db: q }, gridQueryFrom(new URL(`http://x/api/work-orders?${qs}`), WORK_ORDER_GRID_COLUMNS));
  return { page, ms: performance.now() - started };
}

// Time budgets are loose (the shared test machine is busy); the plans are the real check. The quick
// search reads every row (ILIKE over four columns has no index here), so it gets a wider budget.
const BUDGET_MS = 3000;
const SEARCH_BUDGET_MS = 6000;

describe('the work-order list with 100,000 orders', () => {
  it('pages in number order and by due date from their indexes, filters by state, and searches within budget', async () => {
    await withManyOrders(async (q) => {
      const plan = await planOf(q, 'offset=0&limit=100');
      expect(plan).toMatch(/Index Scan Backward using work_orders_number_key/);
      expect(plan).not.toMatch(/Sort Method: external/);
      const first = await timed(q, 'offset=0&limit=100');
      // 100,000 and more: counted up to the cap, then "more than" (lib/grid/server.ts).
      expect(first.page.total).toBe(GRID_COUNT_CAP + 1);
      expect(first.page.rows[0]!.number).toBe('W2988-100000');
      expect(first.ms).toBeLessThan(BUDGET_MS);

      expect(await planOf(q, 'limit=100&sort=due_date:asc')).toMatch(/Index Scan using work_orders_due_idx/);

      const filter = encodeURIComponent(JSON.stringify({ state: { filterType: 'text', type: 'equals', filter: 'plated' } }));
      const plated = await timed(q, `limit=50&filter=${filter}`);
      expect(plated.page.total).toBe(GRID_COUNT_CAP + 1); // an eighth of 100,000 is past the cap too
      expect(plated.page.rows.every((r) => r.state === 'plated')).toBe(true);
      expect(plated.ms).toBeLessThan(BUDGET_MS);

      const search = await timed(q, 'limit=100&q=W2988-0012');
      // W2988-001200 … W2988-001299: 100 orders.
      expect(search.page.total).toBe(100);
      expect(search.ms).toBeLessThan(SEARCH_BUDGET_MS);

      // The list's own search looks the number up in its trigram index instead of reading every order.
      const searched = gridQueryFrom(new URL('http://x/api/work-orders?limit=100&q=W2988-0012'), WORK_ORDER_GRID_COLUMNS);
      const built = workOrderGridSelect(q).where(whereSql(WORK_ORDER_GRID_COLUMNS, searched, workOrderSearch)!).orderBy('w.number', 'desc').limit(100).compile();
      const plan2 = (await q.executeQuery<{ 'QUERY PLAN': string }>(CompiledQuery.raw(`explain (analyze, costs off) ${built.sql}`, [...built.parameters]))).rows.map((x) => x['QUERY PLAN']).join('\n');
      expect(plan2).toMatch(/Bitmap Index Scan on work_orders_number_trgm/);
      const indexed = await runGridQuery(workOrderGridSelect(q), { ...OPTS, db: q, search: workOrderSearch }, searched);
      expect(indexed.rows.map((r) => r.number)).toEqual(search.page.rows.map((r) => r.number));
    });
  }, 240_000);

  it("finds by its own search exactly the orders the search over every column finds", async () => {
    const [some] = await db
      .selectFrom('work_orders as w')
      .innerJoin('parts as p', 'p.id', 'w.part_id')
      .innerJoin('customers as c', 'c.id', 'w.customer_id')
      .select(['w.number', 'w.po_number', 'p.part_number', 'c.name'])
      .orderBy('w.number')
      .limit(1)
      .execute();
    const words = [
      some!.number, some!.number.slice(-3), some!.po_number, some!.part_number, some!.part_number.slice(1, 5), some!.name.split(' ')[0]!,
      `${some!.name.split(' ')[0]} ${some!.part_number}`, 'zz-no-such-thing', '%', '_', 'a',
    ];
    for (const w of words) {
      const query = gridQueryFrom(new URL(`http://x/api/work-orders?limit=500&q=${encodeURIComponent(w)}`), WORK_ORDER_GRID_COLUMNS);
      const [every, own] = await Promise.all([
        runGridQuery(workOrderGridSelect(), OPTS, query),
        runGridQuery(workOrderGridSelect(), { ...OPTS, search: workOrderSearch }, query),
      ]);
      expect(own.rows.map((r) => r.number), w).toEqual(every.rows.map((r) => r.number));
      expect(own.total, w).toBe(every.total);
      if (words.indexOf(w) < 6) expect(every.total, w).toBeGreaterThan(0);
    }
  });
});
