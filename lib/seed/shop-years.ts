// Ten years of a busy (invented) shop on top of the demo seed, for the benchmarks at size:
// ~40 tanks with several analyses a day each (≈ 5 million values), 200 customers with their parts,
// 50,000 quotes, 50,000 work orders with a run and thickness readings each, 50,000 invoices with
// their payments. Deterministic by seed: the same seed and scale give the same rows. The analysis
// values and the thickness readings (the bulk) go in with COPY; the records go in as INSERT …
// SELECT over generate_series, priced from the demo's own rows, so every row passes the schema's
// checks. History is dated in the ten calendar years before the demo's own, so its numbers
// (Q2016-00001 …) never meet the shop's counters. `scale` shrinks every count (the test command
// runs 0.002).
import { pipeline } from 'node:stream/promises';
import { Readable } from 'node:stream';
import { sql, type Kysely, type RawBuilder } from 'kysely';
import pg from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import type { Database } from '@/db/types';
import { setupTankAnalytes } from '@/lib/bath/analytes';
import { judgeValue } from '@/lib/bath/verdict';

export const SHOP_YEARS_MARKER = 'seed.shop-years';
const OPEN_DAYS = 45;

export type ShopYearsOptions = { seed: number; scale: number; years?: number; log?: (line: string) => void };

export type ShopYearsCounts = {
  tanks: number;
  analytes: number;
  analyses: number;
  customers: number;
  parts: number;
  quotes: number;
  workOrders: number;
  readings: number;
  invoices: number;
  payments: number;
};

/** mulberry32: a small, well-known 32-bit PRNG; deterministic by seed. */
function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A standard normal deviate (Box–Muller). */
function gaussian(rand: () => number): number {
  return Math.sqrt(-2 * Math.log(1 - rand())) * Math.cos(2 * Math.PI * rand());
}

/** A number in [0, 1) from the seed, a salt and a row number, inside SQL: hashtext is stable. */
const h = (seed: number, salt: string, g: RawBuilder<unknown> | ReturnType<typeof sql.ref>) =>
  sql<number>`((hashtext(${`${seed}:${salt}:`} || ${g}::text)::bigint & 2147483647) / 2147483648.0)`;

const round = (n: number) => Math.max(1, Math.round(n));

/** A sequence number zero-padded to `digits`, never cut when it is longer (lpad would cut it). */
const pad = (expr: string, digits: number) => sql.raw(`(case when length((${expr})::text) < ${digits} then lpad((${expr})::text, ${digits}, '0') else (${expr})::text end)`);

async function copyRows(url: string, statement: string, rows: AsyncIterable<string> | Iterable<string>): Promise<void> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const stream = client.query(copyFrom(statement));
    await pipeline(Readable.from(rows), stream);
  } finally {
    await client.end();
  }
}

export async function alreadyGenerated(db: Kysely<Database>): Promise<boolean> {
  return !!(await db.selectFrom('audit_log').select('id').where('action', '=', SHOP_YEARS_MARKER).executeTakeFirst());
}

/** Fills `db` (whose URL is `url`, for COPY) with the shop's history. Refuses to run twice. */
export async function generateShopYears(database: Kysely<Database>, url: string, options: ShopYearsOptions): Promise<ShopYearsCounts> {
  // One connection throughout: the generator's working tables are temporary (per connection).
  return database.connection().execute((db) => generateOn(db, url, options));
}

async function generateOn(db: Kysely<Database>, url: string, options: ShopYearsOptions): Promise<ShopYearsCounts> {
  const { seed, scale } = options;
  const years = options.years ?? 10;
  const log = options.log ?? (() => {});
  if (!(scale > 0 && scale <= 1)) throw new Error('scale must be in (0, 1]');
  if (await alreadyGenerated(db)) throw new Error('this database already holds the generated shop history');
  const thisYear = new Date().getUTCFullYear();
  const firstYear = thisYear - years;
  const start = Date.UTC(firstYear, 0, 1);
  const end = Date.UTC(thisYear, 0, 1) - 60_000;
  const span = end - start;
  const n = {
    tanks: 40,
    customers: round(200 * Math.sqrt(scale)),
    partsPerCustomer: 10,
    quotes: round(50_000 * scale),
    workOrders: round(50_000 * scale),
    analyses: round(5_000_000 * scale),
    readingsPerOrder: 5,
  };

  // Tanks: the demo's, and copies of them under codes of their own up to forty in all.
  const demoTanks = await db.selectFrom('tanks').select(['id', 'code']).where('is_active', '=', true).orderBy('code').execute();
  const extra = Math.max(0, n.tanks - demoTanks.length);
  for (let i = 0; i < extra; i++) {
    const from = demoTanks[i % demoTanks.length]!;
    const code = `H${String(i + 1).padStart(2, '0')}-${from.code}`.slice(0, 16);
    await sql`insert into tanks (line_id, code, name, template_id, volume_l, element, ion_charge, efficiency, rectifier_max_a, has_ah_meter, anode_type, temp_min_c, temp_max_c, family_settings, made_up_at)
      select line_id, ${code}, name || ' (line ' || ${String(i + 2)} || ')', template_id, volume_l, element, ion_charge, efficiency, rectifier_max_a, has_ah_meter, anode_type, temp_min_c, temp_max_c, family_settings, made_up_at
      from tanks where id = ${from.id}`.execute(db);
    const t = await db.selectFrom('tanks').select('id').where('code', '=', code).executeTakeFirstOrThrow();
    await setupTankAnalytes(t.id, db);
  }
  log(`tanks: ${demoTanks.length + extra}`);

  // Analyses, by COPY: each active analyte analysed at an even pace over the years, about its
  // target with the spread a controlled bath shows (an eighth of its control band).
  const analytes = await db
    .selectFrom('tank_analytes as a')
    .innerJoin('tanks as t', 't.id', 'a.tank_id')
    .select(['a.id', 'a.tank_id', 'a.method_id', 'a.unit', 'a.target', 'a.lower_control', 'a.upper_control', 'a.lower_spec', 'a.upper_spec'])
    .where('a.is_active', '=', true)
    .where('t.is_active', '=', true)
    .orderBy('t.code')
    .orderBy('a.sort_order')
    .execute();
  const perAnalyte = Math.max(2, Math.floor(n.analyses / analytes.length));
  const rand = prng(seed);
  function* analysisRows(): Generator<string> {
    for (const [ai, a] of analytes.entries()) {
      const target = Number(a.target);
      const lo = a.lower_control === null ? null : Number(a.lower_control);
      const hi = a.upper_control === null ? null : Number(a.upper_control);
      const sigma = lo !== null && hi !== null ? (hi - lo) / 8 : Math.max(Math.abs(target) * 0.05, 0.01);
      const limits = {
        target,
        lowerControl: lo ?? undefined,
        upperControl: hi ?? undefined,
        lowerSpec: a.lower_spec === null ? undefined : Number(a.lower_spec),
        upperSpec: a.upper_spec === null ? undefined : Number(a.upper_spec),
      };
      const step = span / perAnalyte;
      for (let i = 0; i < perAnalyte; i++) {
        const value = Math.max(0, Number((target + gaussian(rand) * sigma).toPrecision(5)));
        let verdict = 'in_range';
        let severity = 0;
        try {
          const v = judgeValue(value, limits);
          verdict = v.status;
          severity = v.severity;
        } catch {
          // an analyte without limits is recorded as in range
        }
        const at = new Date(start + i * step + rand() * step * 0.5).toISOString();
        yield `${a.tank_id}\t${a.id}\t${a.method_id}\t${value}\t${a.unit}\t${verdict}\t${severity}\tseed\t${at}\tdemo-plater-plater\tyears-${seed}-${ai}-${i}\n`;
      }
    }
  }
  await copyRows(url, 'copy analyses (tank_id, analyte_id, method_id, value, unit, verdict, severity, source, taken_at, logged_by, idempotency_key) from stdin', analysisRows());
  log(`analyses: ${perAnalyte * analytes.length} over ${analytes.length} analytes`);

  // Customers and their parts (invented names from two word lists).
  await sql`insert into customers (code, name, billing_address, shipping_address, billing_email, payment_terms_days)
    select 'H' || lpad(g::text, 3, '0'),
           (array['Alder','Brookfield','Cobalt Ridge','Dunmore','Eastgate','Foxhollow','Granite Bay','Hartwell','Ironvale','Juniper'])[1 + (g % 10)] || ' ' ||
           (array['Fastener','Valve','Controls','Machining','Hydraulics','Instruments','Motion','Fittings'])[1 + ((g / 10) % 8)] || ' ' ||
           (array['Co.','Inc.','Ltd.','Works'])[1 + ((g / 80) % 4)] || ' ' || g,
           g || ' Industrial Way, Springfield', g || ' Industrial Way, Springfield', 'ap' || g || '@customer-h.test', (array[30, 45, 60])[1 + g % 3]
    from generate_series(1, ${n.customers}) g`.execute(db);
  await sql`insert into parts (customer_id, part_number, revision, description, substrate, area_dm2, weight_g, corrosivity_category, design_life_years)
    select c.id, c.code || '-P' || lpad(p::text, 4, '0'), 'A', 'Machined part ' || p, (array['carbon-steel','brass','aluminium','stainless-304'])[1 + p % 4],
           round((0.2 + 2.8 * ${h(seed, 'area', sql.raw('c.code || p'))})::numeric, 3), round((5 + 300 * ${h(seed, 'weight', sql.raw('c.code || p'))})::numeric, 1),
           (array['C2','C3','C4'])[1 + p % 3], 10
    from customers c cross join generate_series(1, ${n.partsPerCustomer}) p where c.code like 'H___'`.execute(db);
  log(`customers: ${n.customers}, parts: ${n.customers * n.partsPerCustomer}`);

  // Every 20th record goes to the demo's first customer, so its portal lists are long too.
  const demoCustomer = await db.selectFrom('customers').select('id').where('code', '=', 'NGF').executeTakeFirstOrThrow();
  await sql`create temporary table years_parts as
    select row_number() over (order by c.code, p.part_number) - 1 as i, p.id as part_id, p.customer_id, c.name as customer_name, c.payment_terms_days
    from parts p join customers c on c.id = p.customer_id
    where c.code like 'H___' or c.id = ${demoCustomer.id}`.execute(db);
  const partCount = Number((await sql<{ n: number }>`select count(*)::int as n from years_parts`.execute(db)).rows[0]!.n);
  const demoParts = await sql<{ i: number }>`select i from years_parts where customer_id = ${demoCustomer.id} order by i`.execute(db);
  const demoFirst = Number(demoParts.rows[0]?.i ?? 0);
  const demoCount = Math.max(1, demoParts.rows.length);
  // Part for row g: a demo-customer part for g % 20 = 0, else any generated one.
  const partFor = (g: string) =>
    sql.raw(`(case when ${g} % 20 = 0 then ${demoFirst} + (${g} / 20) % ${demoCount} else (${g} * 7919) % ${partCount} end)`);

  const template = await sql<{ finish_id: string; calculation: unknown; cost: unknown; rate_set_id: string }>`
    select l.finish_id, l.calculation, l.cost, q.rate_set_id from quote_lines l join quotes q on q.id = l.quote_id
    join finishes f on f.id = l.finish_id where f.family = 'electroplating' order by q.number, l.line_no limit 1`.execute(db);
  const tl = template.rows[0];
  if (!tl) throw new Error('the demo seed has no priced quote line to copy');

  // Quotes, dated evenly over the years; numbered per year from 1.
  await sql`insert into quotes (number, revision, customer_id, status, rate_set_id, valid_days, is_rush, total_cents, created_by, created_at, updated_at, sent_at, expires_at, decided_at, po_number)
    select 'Q' || extract(year from at)::int || '-' || ${pad('row_number() over (partition by extract(year from at) order by g)', 4)},
           'A', yp.customer_id, st, ${tl.rate_set_id}, 30, g % 17 = 0, 5000 + (${h(seed, 'qtotal', sql.ref('g'))} * 400000)::bigint,
           'demo-estimator-estimator', at, at,
           case when st = 'draft' then null else at + interval '1 hour' end,
           case when st = 'draft' then null else at + interval '30 days' end,
           case when st in ('accepted', 'declined') then at + interval '3 days' end,
           case when st = 'accepted' then 'PO-' || (100000 + g) end
    from (select g, to_timestamp((${start} + (g - 1) * (${span}::float8 / ${n.quotes})) / 1000.0) as at,
                 (array['accepted','accepted','accepted','expired','declined','accepted'])[1 + g % 6] as st
          from generate_series(1, ${n.quotes}) g) s
    join years_parts yp on yp.i = ${partFor('g')}`.execute(db);
  await sql`insert into quote_lines (quote_id, line_no, part_id, finish_id, quantity, pricing_basis, calculation, cost, computed_total_cents, total_cents, unit_price_cents)
    select q.id, 1, (select part_id from years_parts where customer_id = q.customer_id order by i limit 1), ${tl.finish_id}, 500, 'piece',
           ${JSON.stringify(tl.calculation)}::jsonb, ${JSON.stringify(tl.cost)}::jsonb, q.total_cents, q.total_cents, round(q.total_cents / 500.0, 4)
    from quotes q where q.number < ${`Q${thisYear}`} and q.created_by = 'demo-estimator-estimator' and q.number >= ${`Q${firstYear}`}`.execute(db);
  log(`quotes: ${n.quotes}`);

  // Work orders, each with one run on a tank of its finish's metal.
  const finishes = await db.selectFrom('finishes').select(['id']).where('family', '=', 'electroplating').orderBy('code').execute();
  const finishArray = `array[${finishes.map((f) => `'${f.id}'::uuid`).join(',')}]`;
  await sql`insert into work_orders (number, customer_id, part_id, finish_id, po_number, due_date, quantity_ordered, quantity_received, quantity_shipped, state, is_rush, unit_price_cents, pricing_basis, total_cents, created_at, updated_at)
    select 'W' || extract(year from at)::int || '-' || ${pad('row_number() over (partition by extract(year from at) order by g)', 5)},
           yp.customer_id, yp.part_id, (${sql.raw(finishArray)})[1 + g % ${finishes.length}], 'PO-' || (200000 + g), (at + interval '10 days')::date,
           qty, qty, qty, 'invoiced', g % 13 = 0, price, 'piece', qty * price, at, at
    from (select g, to_timestamp((${start} + (g - 1) * (${span}::float8 / ${n.workOrders})) / 1000.0) as at,
                 100 + (${h(seed, 'qty', sql.ref('g'))} * 4900)::int as qty, 10 + (${h(seed, 'price', sql.ref('g'))} * 90)::int as price
          from generate_series(1, ${n.workOrders}) g) s
    join years_parts yp on yp.i = ${partFor('g')}`.execute(db);
  const woFilter = sql`w.number >= ${`W${firstYear}`} and w.number < ${`W${thisYear}`}`;
  await sql`insert into plating_runs (work_order_id, tank_id, started_at, ended_at, current_a, amp_hours, loads, parts_per_load, predicted_thickness_um, is_below_minimum, logged_by, idempotency_key)
    select w.id, t.id, w.created_at + interval '2 days', w.created_at + interval '2 days 1 hour', 150, 150, 1, w.quantity_ordered, f.min_thickness_um * 1.3, false,
           'demo-plater-plater', 'years-run-' || w.number
    from work_orders w join finishes f on f.id = w.finish_id
    join lateral (select id from tanks t where t.element = f.element and t.ion_charge = f.ion_charge and t.is_active order by t.code limit 1) t on true
    where ${woFilter}`.execute(db);
  log(`work orders: ${n.workOrders}`);

  // Thickness readings, by COPY: five parts a lot, about 1.3 × the finish's minimum.
  const orders = await sql<{ id: string; min: number; max: number | null }>`
    select w.id, f.min_thickness_um::float8 as min, f.max_thickness_um::float8 as max from work_orders w join finishes f on f.id = w.finish_id where ${woFilter} order by w.number`.execute(db);
  const rr = prng(seed + 1);
  function* readingRows(): Generator<string> {
    for (const o of orders.rows) {
      for (let p = 1; p <= n.readingsPerOrder; p++) {
        let t = Number((o.min * (1.3 + gaussian(rr) * 0.08)).toFixed(2));
        if (t < o.min) t = Number((o.min * 1.01).toFixed(2));
        if (o.max !== null && t > o.max) t = Number((o.max * 0.99).toFixed(2));
        yield `${o.id}\t${p}\tsignificant surface\tB568\t${t}\t${o.min}\t${o.max ?? '\\N'}\tpass\tmanual\tdemo-plater-plater\n`;
      }
    }
  }
  await copyRows(url, 'copy thickness_readings (work_order_id, part_no, location, method, thickness_um, minimum_um, maximum_um, status, entry, recorded_by) from stdin', readingRows());
  log(`thickness readings: ${orders.rows.length * n.readingsPerOrder}`);

  // An invoice per order, paid by check or bank transfer on its terms; those of the history's last
  // weeks are still open (the aging report's overdue rows).
  const rule = (await db.selectFrom('invoices').select('rounding_rule').executeTakeFirst())?.rounding_rule ?? 'Each line is quantity × unit price, rounded half-up to the cent.';
  await sql`insert into invoices (number, customer_id, status, issued_on, due_on, payment_terms_days, tax_rate_bp, subtotal_cents, tax_cents, total_cents, paid_cents, bill_to_name, rounding_rule, issued_by, created_at, updated_at)
    select 'I' || extract(year from w.created_at)::int || '-' || ${pad('row_number() over (partition by extract(year from w.created_at) order by w.number)', 5)},
           w.customer_id, case when w.created_at >= ${new Date(end - OPEN_DAYS * 86_400_000)} then 'issued' else 'paid' end,
           (w.created_at + interval '5 days')::date, (w.created_at + interval '5 days')::date + c.payment_terms_days, c.payment_terms_days, 0,
           w.total_cents, 0, w.total_cents, case when w.created_at >= ${new Date(end - OPEN_DAYS * 86_400_000)} then 0 else w.total_cents end, c.name, ${rule}, 'demo-owner-owner', w.created_at + interval '5 days', w.created_at + interval '5 days'
    from work_orders w join customers c on c.id = w.customer_id where ${woFilter}`.execute(db);
  const invFilter = sql`i.number >= ${`I${firstYear}`} and i.number < ${`I${thisYear}`}`;
  await sql`create temporary table years_invoice_orders as
    select i.id as invoice_id, w.id as work_order_id, w.number, w.quantity_shipped, w.unit_price_cents, w.total_cents
    from (select id, row_number() over (order by number) as k from invoices i where ${invFilter}) i
    join (select id, number, quantity_shipped, unit_price_cents, total_cents, row_number() over (order by created_at, number) as k from work_orders w where ${woFilter}) w on w.k = i.k`.execute(db);
  await sql`insert into invoice_lines (invoice_id, line_no, kind, work_order_id, description, quantity, unit, unit_price_cents, amount_cents)
    select invoice_id, 1, 'work_order', work_order_id, number || ' · plating', quantity_shipped, 'pc', unit_price_cents, total_cents from years_invoice_orders`.execute(db);
  await sql`insert into payments (invoice_id, customer_id, kind, method, amount_cents, received_at, reference, recorded_by)
    select i.id, i.customer_id, 'payment', case when ${h(seed, 'method', sql.raw('i.number'))} < 0.5 then 'check' else 'bank_transfer' end, i.total_cents,
           (i.issued_on + (i.payment_terms_days * (0.5 + ${h(seed, 'late', sql.raw('i.number'))}))::int)::timestamptz, 'Ref ' || i.number, 'demo-owner-owner'
    from invoices i where ${invFilter} and i.status = 'paid'`.execute(db);
  log(`invoices and payments: ${orders.rows.length}`);

  // The counters of those years, so a document ever numbered there follows on.
  await sql`insert into number_counters (series, year, last_seq)
    select 'quote', extract(year from created_at)::int, count(*) from quotes where number >= ${`Q${firstYear}`} and number < ${`Q${thisYear}`} group by 2
    union all select 'work_order', extract(year from created_at)::int, count(*) from work_orders w where ${woFilter} group by 2
    union all select 'invoice', extract(year from created_at)::int, count(*) from invoices i where ${invFilter} group by 2
    on conflict (series, year) do update set last_seq = greatest(number_counters.last_seq, excluded.last_seq)`.execute(db);
  await sql`insert into audit_log (actor_id, action, entity, entity_id, detail) values (null, ${SHOP_YEARS_MARKER}, 'database', null, ${JSON.stringify({ seed, scale, years })}::jsonb)`.execute(db);
  await sql`analyze`.execute(db);

  const count = async (q: string) => Number((await sql<{ n: number }>`${sql.raw(q)}`.execute(db)).rows[0]!.n);
  return {
    tanks: await count(`select count(*)::int as n from tanks where is_active`),
    analytes: analytes.length,
    analyses: await count(`select count(*)::int as n from analyses`),
    customers: await count(`select count(*)::int as n from customers`),
    parts: await count(`select count(*)::int as n from parts`),
    quotes: await count(`select count(*)::int as n from quotes`),
    workOrders: await count(`select count(*)::int as n from work_orders`),
    readings: await count(`select count(*)::int as n from thickness_readings`),
    invoices: await count(`select count(*)::int as n from invoices`),
    payments: await count(`select count(*)::int as n from payments`),
  };
}
