// The ten-shop-years generator, small form (scale 0.002) in a database of its own: every row it
// writes passes the schema's checks, the same seed gives the same rows, the books add up, and the
// lists the benchmarks time answer over it.
import { sql } from 'kysely';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDb } from '@/db/kysely';
import { createPool } from '@/db/pool';
import { generateShopYears, type ShopYearsCounts } from '@/lib/seed/shop-years';
import { databaseNamed, prepareTestDatabase, TEST_DATABASE_URL } from '../../helpers/test-db';

const SCALE = 0.002;
const Y = new Date().getUTCFullYear(); // the history fills the ten years before this one
const names = ['ampwright_years_a', 'ampwright_years_b'];
const urlOf = (name: string) => databaseNamed(TEST_DATABASE_URL, name);

async function admin(statement: string): Promise<void> {
  const c = new pg.Client({ connectionString: urlOf('postgres') });
  await c.connect();
  try {
    await c.query(statement);
  } finally {
    await c.end();
  }
}

const counts: ShopYearsCounts[] = [];
const fingerprints: string[] = [];

beforeAll(async () => {
  for (const name of names) {
    await admin(`drop database if exists ${name}`);
    await admin(`create database ${name}`);
    await prepareTestDatabase(urlOf(name));
    const db = createDb(createPool(urlOf(name)));
    try {
      counts.push(await generateShopYears(db, urlOf(name), { seed: 7, scale: SCALE }));
      // What the generator decided, without the ids and times the database chose for itself.
      const r = await sql<{ f: string }>`
        select md5(string_agg(x, '|' order by x)) as f from (
          select q.number || ':' || q.status || ':' || q.total_cents || ':' || c.code as x from quotes q join customers c on c.id = q.customer_id where q.number < ${`Q${Y}`}
          union all select w.number || ':' || w.quantity_ordered || ':' || w.total_cents from work_orders w where w.number < ${`W${Y}`}
          union all select a.idempotency_key || ':' || a.value || ':' || a.verdict from analyses a where a.idempotency_key like 'years-%'
          union all select i.number || ':' || i.status || ':' || i.paid_cents from invoices i where i.number < ${`I${Y}`}
        ) t`.execute(db);
      fingerprints.push(r.rows[0]!.f);
    } finally {
      await db.destroy();
    }
  }
}, 600_000);

afterAll(async () => {
  for (const name of names) await admin(`drop database if exists ${name}`);
});

describe('ten shop-years, small form', () => {
  it('writes the sizes asked for, scaled', () => {
    const c = counts[0]!;
    expect(c.tanks).toBe(40);
    // 5 million × 0.002 = 10,000 values, split evenly over the active analytes (floor of the share).
    expect(c.analyses).toBeGreaterThanOrEqual(10_000 - c.analytes);
    expect(c.quotes).toBeGreaterThanOrEqual(100);
    expect(c.workOrders).toBeGreaterThanOrEqual(100);
    expect(c.readings).toBeGreaterThanOrEqual(500);
  });

  it('gives the same rows for the same seed', () => {
    expect(counts[1]).toEqual(counts[0]);
    expect(fingerprints[1]).toBe(fingerprints[0]);
  });

  it('keeps the books: every generated invoice is paid in full by its payments or still open, and numbers run without a gap', async () => {
    const db = createDb(createPool(urlOf(names[0]!)));
    try {
      const wrong = await sql<{ number: string }>`
        select i.number from invoices i left join payments p on p.invoice_id = i.id
        where i.number < ${`I${Y}`}
        group by i.id having coalesce(sum(p.amount_cents), 0) <> i.paid_cents
           or (i.status = 'paid') <> (i.paid_cents = i.total_cents)
           or i.total_cents <> (select sum(amount_cents) from invoice_lines l where l.invoice_id = i.id)`.execute(db);
      expect(wrong.rows).toEqual([]);
      const open = await sql<{ n: number }>`select count(*)::int as n from invoices where number < ${`I${Y}`} and status = 'issued'`.execute(db);
      expect(open.rows[0]!.n).toBeGreaterThan(0);
      const gaps = await sql<{ year: string; n: number; top: number }>`
        select left(number, 5) as year, count(*)::int as n, max(split_part(number, '-', 2)::int) as top from quotes where number < ${`Q${Y}`} group by 1`.execute(db);
      for (const g of gaps.rows) expect(g.top, g.year).toBe(g.n);
      // The counters carry on from the history.
      const counter = await sql<{ last_seq: number }>`select last_seq from number_counters where series = 'quote' and year = ${Y - 6}`.execute(db);
      expect(counter.rows[0]?.last_seq).toBe(gaps.rows.find((g) => g.year === `Q${Y - 6}`)?.n);
    } finally {
      await db.destroy();
    }
  });

  it('refuses to run twice on the same database', async () => {
    const db = createDb(createPool(urlOf(names[0]!)));
    try {
      await expect(generateShopYears(db, urlOf(names[0]!), { seed: 7, scale: SCALE })).rejects.toThrow(/already holds the generated shop history/);
    } finally {
      await db.destroy();
    }
  });
});
