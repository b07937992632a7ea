import { CompiledQuery, type Kysely, sql } from 'kysely';
import Papa from 'papaparse';
import { afterAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { AppError } from '@/lib/errors';
import { GRID_COUNT_CAP, gridCsvStream, gridQueryFrom, gridResponse, runGridQuery, type GridColumns } from '@/lib/grid/server';
import { encodeCursor } from '@/lib/grid/query';
import { afterSql } from '@/lib/grid/sql';
import { inRolledBackTransaction } from '../records/helpers';

afterAll(() => db.destroy());

// Our own temporary table, created and filled inside a transaction that is rolled back.
const ROWS = 100_000;
const COLUMNS: GridColumns = {
  code: { expr: 'g.code', type: 'text', searchable: true, header: 'Code' },
  name: { expr: 'g.name', type: 'text', searchable: true, header: 'Name' },
  qty: { expr: 'g.qty', type: 'number', header: 'Quantity' },
  madeOn: { expr: 'g.made_on', type: 'date', header: 'Made on' },
  note: { expr: 'g.note', type: 'text', sortable: false, csv: true },
};

async function withProbeTable<T>(fn: (q: Kysely<any>) => Promise<T>): Promise<T> {
  return inRolledBackTransaction(async (trx) => {
    const q = trx as unknown as Kysely<any>;
    await sql`
      create temporary table h5_grid_probe (
        id integer primary key,
        code text not null,
        name text not null,
        qty integer not null,
        made_on timestamptz not null,
        note text
      ) on commit drop`.execute(q);
    await sql`
      insert into h5_grid_probe
      select i, 'C' || lpad(i::text, 6, '0'), 'Part ' || (i % 997), (i * 7919) % 100000,
             timestamptz '2026-01-01 00:00:00+00' + (i % 365) * interval '1 day',
             case when i = 5 then '=HYPERLINK("x")' when i = 6 then 'a, "quoted" note' else null end
      from generate_series(1, ${ROWS}) as i`.execute(q);
    await sql`create index on h5_grid_probe (qty)`.execute(q);
    await sql`create index on h5_grid_probe (name)`.execute(q);
    await sql`create index on h5_grid_probe (made_on)`.execute(q);
    await sql`analyze h5_grid_probe`.execute(q);
    return fn(q);
  });
}

const base = (q: Kysely<any>) => q.selectFrom('h5_grid_probe as g').select(['g.id', 'g.code', 'g.name', 'g.qty', 'g.made_on as madeOn', 'g.note']);
const OPTS = { columns: COLUMNS, key: 'g.id', defaultSort: { colId: 'code', dir: 'asc' as const }, fileName: 'probe' };
const query = (qs: string) => gridQueryFrom(new URL(`http://x/api/probe?${qs}`), COLUMNS);

describe('grid helper on a real table of 100,000 rows', () => {
  it('pages, sorts, filters and counts, and stays fast', async () => {
    await withProbeTable(async (q) => {
      const started = performance.now();
      const page = await runGridQuery(base(q), { ...OPTS, db: q }, query('offset=0&limit=50&sort=qty:desc'));
      const ms = performance.now() - started;
      // Counted up to the cap; past it the total says "more than GRID_COUNT_CAP".
      expect(page.total).toBe(GRID_COUNT_CAP + 1);
      expect(page.rows).toHaveLength(50);
      const qtys = page.rows.map((r) => r.qty as number);
      expect(qtys).toEqual([...qtys].sort((a, b) => b - a));
      // (i · 7919) mod 100000 over i = 1..100000 hits every residue once (gcd(7919, 100000) = 1), so the top is 99999.
      expect(qtys[0]).toBe(99_999);
      expect(ms).toBeLessThan(2000);

      const filter = encodeURIComponent(JSON.stringify({ qty: { filterType: 'number', type: 'inRange', filter: 1000, filterTo: 1999 } }));
      const filtered = await runGridQuery(base(q), { ...OPTS, db: q }, query(`limit=10&filter=${filter}&sort=qty:asc`));
      expect(filtered.total).toBe(1000);
      expect(filtered.rows.map((r) => r.qty)).toEqual([1000, 1001, 1002, 1003, 1004, 1005, 1006, 1007, 1008, 1009]);
    });
  });

  it('uses the index for a sorted page rather than sorting the whole table', async () => {
    await withProbeTable(async (q) => {
      const built = base(q).orderBy(sql`g.qty desc`).orderBy(sql`g.id desc`).limit(100).offset(0).compile();
      const plan = await sql.raw<{ 'QUERY PLAN': string }>(`explain ${built.sql.replace('$1', '100').replace('$2', '0')}`).execute(q);
      const text = plan.rows.map((r) => r['QUERY PLAN']).join('\n');
      expect(text).toMatch(/Index Scan Backward using h5_grid_probe_qty_idx/);
    });
  });

  it('filters by calendar day and by free text over the searchable columns', async () => {
    await withProbeTable(async (q) => {
      const day = encodeURIComponent(JSON.stringify({ madeOn: { filterType: 'date', type: 'equals', dateFrom: '2026-01-03 00:00:00' } }));
      const onDay = await runGridQuery(base(q), { ...OPTS, db: q }, query(`filter=${day}`));
      // made_on = 2026-01-01 + (i mod 365) days; 2026-01-03 ⇒ i mod 365 = 2: i = 2, 367, … ≤ 100000 → 274 rows.
      expect(onDay.total).toBe(274);
      const search = await runGridQuery(base(q), { ...OPTS, db: q }, query('q=C00012 part'));
      // Codes are "C" + 6 digits, so "C00012" is in C000120…C000129 only (10 rows); "part" is in every name.
      expect(search.total).toBe(10);
      expect(search.rows.every((r) => String(r.code).startsWith('C00012'))).toBe(true);
    });
  });

  it('refuses unknown columns and bad JSON with BAD_INPUT, as a 400 through the route helper', async () => {
    expect(() => query('sort=secret:asc')).toThrow(AppError);
    await withProbeTable(async (q) => {
      try {
        await gridResponse(new Request('http://x/api/probe?filter=%7Bbad'), base(q), { ...OPTS, db: q });
        expect.unreachable();
      } catch (e) {
        expect(e).toBeInstanceOf(AppError);
        expect((e as AppError).status).toBe(400);
      }
      const ok = await gridResponse(new Request('http://x/api/probe?limit=2'), base(q), { ...OPTS, db: q });
      expect(ok.status).toBe(200);
      const body = (await ok.json()) as { rows: { code: string }[]; total: number };
      expect(body.total).toBe(GRID_COUNT_CAP + 1);
      expect(body.rows.map((r) => r.code)).toEqual(['C000001', 'C000002']);
    });
  });

  it('sends an ETag with each page and answers 304, without a body, when the reader already holds it', async () => {
    await withProbeTable(async (q) => {
      const url = 'http://x/api/probe?limit=2';
      const first = await gridResponse(new Request(url), base(q), { ...OPTS, db: q });
      const etag = first.headers.get('etag');
      expect(etag).toMatch(/^W\/"[A-Za-z0-9_-]{27}"$/);
      // Kept by this browser only and asked again every time (RFC 9111 §5.2.2.4 no-cache, §5.2.2.7 private).
      expect(first.headers.get('cache-control')).toBe('private, no-cache');
      const again = await gridResponse(new Request(url, { headers: { 'if-none-match': etag! } }), base(q), { ...OPTS, db: q });
      expect(again.status).toBe(304);
      expect(await again.text()).toBe('');
      expect(again.headers.get('etag')).toBe(etag);
      // A list of validators, and the strong form of a weak one, match as RFC 9110 §13.1.2 compares.
      const listed = await gridResponse(new Request(url, { headers: { 'if-none-match': `"other", ${etag!.slice(2)}` } }), base(q), { ...OPTS, db: q });
      expect(listed.status).toBe(304);
      // Another page, or the same page after a change, is a new validator and a full answer.
      const other = await gridResponse(new Request('http://x/api/probe?limit=3', { headers: { 'if-none-match': etag! } }), base(q), { ...OPTS, db: q });
      expect(other.status).toBe(200);
      await sql`update h5_grid_probe set name = 'changed' where code = 'C000001'`.execute(q);
      const changed = await gridResponse(new Request(url, { headers: { 'if-none-match': etag! } }), base(q), { ...OPTS, db: q });
      expect(changed.status).toBe(200);
      expect(changed.headers.get('etag')).not.toBe(etag);
    });
  });

  it('walks every page by key to the same rows, in the same order, as one sorted read — ties, blanks and timestamps included', async () => {
    // Here the note column sorts too: it is blank on all rows but two, so the cursor must carry "no value".
    const columns: GridColumns = { ...COLUMNS, note: { ...COLUMNS.note!, sortable: true } };
    const opts = { ...OPTS, columns, db: undefined as Kysely<any> | undefined };
    const filter = encodeURIComponent(JSON.stringify({ code: { filterType: 'text', type: 'startsWith', filter: 'C00' } }));
    await withProbeTable(async (q) => {
      opts.db = q;
      for (const [sort, order] of [
        ['name:asc', sql`g.name asc, g.id asc`],
        ['madeOn:desc', sql`g.made_on desc, g.id desc`],
        ['note:asc', sql`g.note asc, g.id asc`],
        ['note:desc', sql`g.note desc, g.id desc`],
        ['code:asc', sql`g.code asc, g.id asc`],
      ] as const) {
        const expected = (await sql<{ id: number }>`select g.id from h5_grid_probe g where g.code like 'C00%' order by ${order}`.execute(q)).rows.map((r) => r.id);
        expect(expected).toHaveLength(9_999);
        const walked: number[] = [];
        let after = '';
        let pages = 0;
        for (;;) {
          const page = await runGridQuery(base(q), opts, gridQueryFrom(new URL(`http://x/api/probe?limit=500&sort=${sort}&filter=${filter}${after ? `&after=${after}` : ''}`), columns));
          walked.push(...page.rows.map((r) => r.id as number));
          pages++;
          if (!page.next) break;
          after = page.next;
        }
        expect(walked, sort).toEqual(expected);
        expect(pages).toBe(20);
        // A deep page by key is the page the offset gives.
        const byOffset = await runGridQuery(base(q), opts, gridQueryFrom(new URL(`http://x/api/probe?offset=9000&limit=500&sort=${sort}&filter=${filter}`), columns));
        expect(byOffset.rows.map((r) => r.id)).toEqual(expected.slice(9000, 9500));
      }
      // A cursor edited by hand to carry what the column cannot hold is refused, not a server error.
      // (Each inside a savepoint: the refused statement would end the test's own transaction.)
      await sql`savepoint forged`.execute(q);
      const forged = encodeCursor({ colId: 'madeOn', dir: 'desc', value: 'not a time', key: '12' });
      await expect(runGridQuery(base(q), opts, gridQueryFrom(new URL(`http://x/api/probe?limit=10&sort=madeOn:desc&after=${forged}`), columns))).rejects.toMatchObject({
        code: 'BAD_INPUT',
        message: 'after is not a page cursor this list gave out.',
      });
      await sql`rollback to savepoint forged`.execute(q);
      const badKey = encodeCursor({ colId: 'code', dir: 'asc', value: 'C000010', key: 'twelve' });
      await expect(runGridQuery(base(q), opts, gridQueryFrom(new URL(`http://x/api/probe?limit=10&after=${badKey}`), columns))).rejects.toMatchObject({ code: 'BAD_INPUT' });
      await sql`rollback to savepoint forged`.execute(q);
      // A cursor only means something in its own order.
      const page = await runGridQuery(base(q), opts, gridQueryFrom(new URL('http://x/api/probe?limit=10'), columns));
      expect(() => gridQueryFrom(new URL(`http://x/api/probe?limit=10&sort=name:desc&after=${page.next}`), columns)).toThrow('after belongs to another sort order');
      // Without a sort the default order applies, and the cursor must be of it too.
      const byName = await runGridQuery(base(q), opts, gridQueryFrom(new URL('http://x/api/probe?limit=10&sort=name:asc'), columns));
      await expect(runGridQuery(base(q), opts, gridQueryFrom(new URL(`http://x/api/probe?limit=10&after=${byName.next}`), columns))).rejects.toThrow('after belongs to another sort order');
      await expect(runGridQuery(base(q), opts, gridQueryFrom(new URL(`http://x/api/probe?limit=10&after=${page.next}`), columns))).resolves.toMatchObject({ rows: expect.any(Array) });
    });
  });

  it('a seek by key reads from the index where the offset counts its way down', async () => {
    await withProbeTable(async (q) => {
      const at = await runGridQuery(base(q), { ...OPTS, db: q }, query('offset=89900&limit=100&sort=qty:asc'));
      const cursor = query(`limit=100&sort=qty:asc&after=${at.next}`);
      const next = await runGridQuery(base(q), { ...OPTS, db: q }, cursor);
      expect(next.rows.map((r) => r.qty)).toEqual(Array.from({ length: 100 }, (_, i) => 90_000 + i));
      // The rows the plan's index scan actually read: the seek's first range against the offset.
      const actualRows = async (built: { sql: string; parameters: readonly unknown[] }) => {
        const plan = await q.executeQuery<{ 'QUERY PLAN': string }>(CompiledQuery.raw(`explain (analyze, format text) ${built.sql}`, [...built.parameters]));
        const line = plan.rows.map((r) => r['QUERY PLAN']).find((l) => l.includes('Index Scan'))!;
        return Number(/actual time=[\d.]+\.\.[\d.]+ rows=(\d+)/.exec(line)![1]);
      };
      const ordered = base(q).orderBy(sql`g.qty asc`).orderBy(sql`g.id asc`).limit(100);
      const [range] = afterSql(COLUMNS, cursor.after!, 'g.id');
      // (the hundred, and the cursor's own row, which the range starts at and the key then passes over)
      expect(await actualRows(ordered.where(range!).compile())).toBe(101);
      expect(await actualRows(ordered.offset(90_000).compile())).toBeGreaterThan(90_000);
    });
  });

  it('streams the filtered rows as CSV in batches, quoted and guarded', async () => {
    await withProbeTable(async (q) => {
      const filter = encodeURIComponent(JSON.stringify({ qty: { filterType: 'number', type: 'lessThan', filter: 2500 } }));
      const stream = gridCsvStream(base(q), OPTS, query(`format=csv&filter=${filter}`));
      const text = await new Response(stream).text();
      const parsed = Papa.parse<string[]>(text.trimEnd(), { newline: '\r\n' });
      expect(parsed.errors).toEqual([]);
      expect(parsed.data[0]).toEqual(['Code', 'Name', 'Quantity', 'Made on', 'note']);
      expect(parsed.data).toHaveLength(1 + 2500);

      const all = await new Response(gridCsvStream(base(q), OPTS, query('format=csv&q=C00000'))).text();
      const rows = Papa.parse<string[]>(all.trimEnd(), { newline: '\r\n' }).data;
      expect(rows.find((r) => r[0] === 'C000005')?.[4]).toBe(`'=HYPERLINK("x")`);
      expect(rows.find((r) => r[0] === 'C000006')?.[4]).toBe('a, "quoted" note');
      expect(all).toContain('"a, ""quoted"" note"');
    });
  });
});
