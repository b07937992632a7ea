import { sql } from 'kysely';
import { describe, expect, it } from 'vitest';
import { csvCell, csvLine, contentDisposition } from '@/lib/grid/csv';
import { parseGridQuery } from '@/lib/grid/query';
import { choicesMatching, escapeLike, orderSql, whereSql, type GridColumns } from '@/lib/grid/sql';
import { compiler } from './compile';

const COLUMNS: GridColumns = {
  code: { expr: 'c.code', type: 'text', searchable: true },
  name: { expr: 'c.name', type: 'text', searchable: true },
  terms: { expr: 'c.payment_terms_days', type: 'number' },
  total: { expr: sql`c.a + c.b`, type: 'number' },
  createdAt: { expr: 'c.created_at', type: 'date' },
};
const INFO = Object.fromEntries(Object.entries(COLUMNS).map(([k, v]) => [k, { type: v.type }]));

function where(model: unknown, q = '') {
  const query = parseGridQuery(new URLSearchParams({ filter: JSON.stringify(model), q }), INFO);
  const cond = whereSql(COLUMNS, query);
  return cond ? cond.compile(compiler) : null;
}

describe('a column with a closed set of values', () => {
  const STATES = ['accepted', 'received', 'in_process', 'invoiced'];
  const cols: GridColumns = { state: { expr: 'w.state', type: 'text', searchable: true, choices: { values: STATES, match: (v) => sql`w.state = ${v}` } } };
  const info = { state: { type: 'text' as const } };
  const compiled = (model: unknown, q = '') => whereSql(cols, parseGridQuery(new URLSearchParams({ filter: JSON.stringify(model), q }), info))!.compile(compiler);

  it('keeps the values a text condition would keep, case-insensitively', () => {
    expect(choicesMatching(STATES, { kind: 'text', op: 'contains', value: 'CE' })).toEqual(['accepted', 'received', 'in_process', 'invoiced']);
    expect(choicesMatching(STATES, { kind: 'text', op: 'equals', value: 'Invoiced' })).toEqual(['invoiced']);
    expect(choicesMatching(STATES, { kind: 'text', op: 'notContains', value: 'SS' })).toEqual(['accepted', 'received', 'invoiced']);
    expect(choicesMatching(STATES, { kind: 'text', op: 'startsWith', value: 'in' })).toEqual(['in_process', 'invoiced']);
  });

  it('filters and searches by plain comparisons of the stored value, or by nothing when none matches', () => {
    const c = compiled({ state: { filterType: 'text', type: 'contains', filter: 'in' } });
    expect(c.sql).toBe('((w.state = $1 or w.state = $2))');
    expect(c.parameters).toEqual(['in_process', 'invoiced']);
    expect(compiled({ state: { filterType: 'text', type: 'equals', filter: 'shipped' } }).sql).toBe('(false)');
    const search = compiled({}, 'recei');
    expect(search.sql).toBe('(((w.state = $1)))');
    expect(search.parameters).toEqual(['received']);
  });
});

describe('whereSql', () => {
  it('binds every user value as a parameter and escapes LIKE wildcards', () => {
    const c = where({ name: { filterType: 'text', type: 'contains', filter: "50%_off' --" } })!;
    expect(c.sql).toBe('("c"."name"::text ilike $1)');
    expect(c.parameters).toEqual(["%50\\%\\_off' --%"]);
  });

  it('compares numbers, with ranges in either order', () => {
    expect(where({ terms: { filterType: 'number', type: 'lessThanOrEqual', filter: 30 } })!.sql).toBe('("c"."payment_terms_days" <= $1)');
    const r = where({ terms: { filterType: 'number', type: 'inRange', filter: 60, filterTo: 10 } })!;
    expect(r.sql).toBe('("c"."payment_terms_days" between $1 and $2)');
    expect(r.parameters).toEqual([10, 60]);
  });

  it('keeps an expression column one operand', () => {
    expect(where({ total: { filterType: 'number', type: 'greaterThan', filter: 5 } })!.sql).toBe('((c.a + c.b) > $1)');
  });

  it('turns a date into a half-open day range an index can use', () => {
    const c = where({ createdAt: { filterType: 'date', type: 'equals', dateFrom: '2026-03-04 00:00:00' } })!;
    expect(c.sql).toBe('(("c"."created_at" >= $1::date and "c"."created_at" < ($2::date + 1)))');
    expect(c.parameters).toEqual(['2026-03-04', '2026-03-04']);
    expect(where({ createdAt: { filterType: 'date', type: 'greaterThan', dateFrom: '2026-03-04' } })!.sql).toBe(
      '("c"."created_at" >= ($1::date + 1))',
    );
  });

  it('joins combined conditions with OR and columns with AND', () => {
    const c = where({
      code: { filterType: 'text', operator: 'OR', conditions: [{ type: 'startsWith', filter: 'A' }, { type: 'endsWith', filter: 'Z' }] },
      terms: { filterType: 'number', type: 'notBlank' },
    })!;
    expect(c.sql).toBe('("c"."code"::text ilike $1 or "c"."code"::text ilike $2) and ("c"."payment_terms_days" is not null)');
    expect(c.parameters).toEqual(['A%', '%Z']);
  });

  it('needs every search word somewhere in the searchable columns', () => {
    const c = where({}, 'bolt  north')!;
    expect(c.sql).toBe('(("c"."code"::text ilike $1 or "c"."name"::text ilike $2) and ("c"."code"::text ilike $3 or "c"."name"::text ilike $4))');
    expect(c.parameters).toEqual(['%bolt%', '%bolt%', '%north%', '%north%']);
  });

  it('gives no condition when nothing is asked', () => {
    expect(where({})).toBeNull();
  });
});

describe('orderSql', () => {
  it('sorts by the chosen column then the key, in the same direction', () => {
    const q = compiler.selectFrom('customers as c').selectAll();
    const sorted = orderSql(COLUMNS, { colId: 'name', dir: 'desc' }, null, 'c.id').reduce((b, t) => b.orderBy(t), q);
    expect(sorted.compile().sql).toBe('select * from "customers" as "c" order by "c"."name" desc, "c"."id" desc');
    const fallback = orderSql(COLUMNS, null, { colId: 'code', dir: 'asc' }, 'c.id').reduce((b, t) => b.orderBy(t), q);
    expect(fallback.compile().sql).toBe('select * from "customers" as "c" order by "c"."code" asc, "c"."id" asc');
  });
});

describe('CSV cells', () => {
  it('quotes per RFC 4180', () => {
    // Source: RFC 4180 §2 rules 5–7 (quotes around fields with commas, quotes or line breaks; quotes doubled).
    expect(csvCell('plain')).toBe('plain');
    expect(csvCell('a,b')).toBe('"a,b"');
    expect(csvCell('say "hi"')).toBe('"say ""hi"""');
    expect(csvCell('two\nlines')).toBe('"two\nlines"');
    expect(csvLine(['x', null, 3])).toBe('x,,3\r\n');
  });

  it('defuses text that a spreadsheet would run as a formula', () => {
    // Source: OWASP "CSV Injection" (cells beginning = + - @ tab CR).
    expect(csvCell('=HYPERLINK("http://x")')).toBe(`"'=HYPERLINK(""http://x"")"`);
    expect(csvCell('+1+1')).toBe("'+1+1");
    expect(csvCell('-2')).toBe("'-2");
    expect(csvCell('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(csvCell(-2)).toBe('-2');
  });

  it('writes dates as ISO 8601 and drops non-finite numbers', () => {
    expect(csvCell(new Date('2026-01-02T03:04:05Z'))).toBe('2026-01-02T03:04:05.000Z');
    expect(csvCell(Number.NaN)).toBe('');
  });

  it('makes a header-safe file name', () => {
    expect(contentDisposition('attachment', 'a"b;\r\nc/ü.pdf')).toBe(`attachment; filename="a_b___c__.pdf"; filename*=UTF-8''a%22b%3B__c_%C3%BC.pdf`);
  });

  it('escapes the LIKE escape character itself', () => {
    expect(escapeLike('a\\b')).toBe('a\\\\b');
  });
});
