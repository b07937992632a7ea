import { describe, expect, it } from 'vitest';
import { AppError } from '@/lib/errors';
import { encodeCursor, GRID_MAX_LIMIT, parseGridQuery, type GridColumnInfo } from '@/lib/grid/query';
import { buildGridUrl } from '@/components/data-grid/grid-query';

const COLUMNS: Record<string, GridColumnInfo> = {
  code: { type: 'text' },
  name: { type: 'text' },
  terms: { type: 'number' },
  createdAt: { type: 'date' },
  notes: { type: 'text', sortable: false },
};

function parse(qs: string) {
  return parseGridQuery(new URLSearchParams(qs), COLUMNS);
}

function refusal(qs: string): string {
  try {
    parse(qs);
    return 'accepted';
  } catch (e) {
    expect(e).toBeInstanceOf(AppError);
    expect((e as AppError).code).toBe('BAD_INPUT');
    return (e as AppError).message;
  }
}

describe('parseGridQuery', () => {
  it('defaults to the first 100 rows as JSON, unsorted, unfiltered', () => {
    expect(parse('')).toEqual({ offset: 0, after: null, limit: 100, sort: null, filters: [], words: [], format: 'json' });
  });

  it('reads back a page cursor it gave out, in the sort order it was made for', () => {
    const after = encodeCursor({ colId: 'name', dir: 'desc', value: 'Brightline Fasteners', key: 'c0ffee00-0000-4000-8000-000000000001' });
    const url = buildGridUrl('/api/customers', { sort: [{ colId: 'name', sort: 'desc' }] }, { offset: 200, limit: 100, after });
    expect(parse(url.split('?')[1]!).after).toEqual({ colId: 'name', dir: 'desc', value: 'Brightline Fasteners', key: 'c0ffee00-0000-4000-8000-000000000001' });
    // An empty sort value (sorted by a column that can be blank) survives as null.
    const blank = encodeCursor({ colId: null, dir: 'asc', value: null, key: '7' });
    expect(parse(`after=${blank}`).after).toEqual({ colId: null, dir: 'asc', value: null, key: '7' });
  });

  it('refuses a cursor that was not made by the list or belongs to another order', () => {
    const after = encodeCursor({ colId: 'name', dir: 'desc', value: 'x', key: 'k' });
    expect(refusal(`sort=name:asc&after=${after}`)).toBe('after belongs to another sort order; ask for the page by offset.');
    expect(refusal('after=not%20base64!')).toBe('after is not a page cursor this list gave out.');
    expect(refusal(`after=${Buffer.from('{"c":1}').toString('base64url')}`)).toBe('after is not a page cursor this list gave out.');
    expect(refusal(`after=${Buffer.from('[').toString('base64url')}`)).toBe('after is not a page cursor this list gave out.');
    expect(refusal(`after=${'A'.repeat(3000)}`)).toBe('after is not a page cursor this list gave out.');
  });

  it('reads what the grid client builds', () => {
    const url = buildGridUrl(
      '/api/customers',
      { sort: [{ colId: 'name', sort: 'desc' }], filter: { terms: { filterType: 'number', type: 'greaterThan', filter: 30 } }, q: '  acme  bolt ' },
      { offset: 200, limit: 100 },
    );
    const q = parse(url.split('?')[1]!);
    expect(q.offset).toBe(200);
    expect(q.sort).toEqual({ colId: 'name', dir: 'desc' });
    expect(q.filters).toEqual([{ colId: 'terms', join: 'AND', conditions: [{ kind: 'number', op: 'greaterThan', value: 30, to: null }] }]);
    expect(q.words).toEqual(['acme', 'bolt']);
  });

  it('caps the page size at the limit rather than refusing', () => {
    expect(parse('limit=5000').limit).toBe(GRID_MAX_LIMIT);
    expect(parse('limit=7').limit).toBe(7);
  });

  it('reads format=csv', () => {
    expect(parse('format=csv').format).toBe('csv');
    expect(refusal('format=xml')).toMatch(/format must be csv/);
  });

  it('refuses bad paging numbers', () => {
    expect(refusal('offset=-1')).toMatch(/offset must be a whole number/);
    expect(refusal('offset=1.5')).toMatch(/offset/);
    expect(refusal('limit=0')).toMatch(/limit must be at least 1/);
    expect(refusal('limit=abc')).toMatch(/limit must be a whole number/);
  });

  it('refuses unknown or unsortable sort columns and bad directions', () => {
    expect(refusal('sort=password:asc')).toBe('Unknown sort column "password".');
    expect(refusal('sort=name:up')).toMatch(/column:asc or column:desc/);
    expect(refusal('sort=notes:asc')).toMatch(/cannot be sorted by "notes"/);
    expect(refusal('sort=name;drop table x:asc')).toMatch(/column:asc/);
  });

  it('refuses bad filter JSON, unknown columns and type mismatches', () => {
    expect(refusal('filter={nope')).toBe('The filter is not valid JSON.');
    expect(refusal('filter=[1,2]')).toMatch(/JSON object keyed by column/);
    expect(refusal(`filter=${encodeURIComponent('{"secret":{"filterType":"text","type":"contains","filter":"a"}}')}`)).toBe(
      'Unknown filter column "secret".',
    );
    expect(refusal(`filter=${encodeURIComponent('{"terms":{"filterType":"text","type":"contains","filter":"a"}}')}`)).toMatch(
      /holds number values, not text/,
    );
    expect(refusal(`filter=${encodeURIComponent('{"name":{"filterType":"text","type":"regex","filter":"a"}}')}`)).toMatch(/not a valid text filter/);
    expect(refusal(`filter=${encodeURIComponent('{"name":{"filterType":"text","type":"contains"}}')}`)).toMatch(/text to compare with is missing/);
    expect(refusal(`filter=${encodeURIComponent('{"terms":{"filterType":"number","type":"inRange","filter":1}}')}`)).toMatch(/upper end/);
    expect(refusal(`filter=${encodeURIComponent('{"createdAt":{"filterType":"date","type":"equals","dateFrom":"2026-02-30 00:00:00"}}')}`)).toMatch(
      /not a real calendar date/,
    );
  });

  it('reads combined conditions and blank tests', () => {
    const model = {
      name: { filterType: 'text', operator: 'OR', conditions: [{ filterType: 'text', type: 'startsWith', filter: 'A' }, { filterType: 'text', type: 'blank' }] },
      createdAt: { filterType: 'date', type: 'inRange', dateFrom: '2026-01-01 00:00:00', dateTo: '2026-01-31' },
    };
    const q = parse(`filter=${encodeURIComponent(JSON.stringify(model))}`);
    expect(q.filters).toEqual([
      { colId: 'name', join: 'OR', conditions: [{ kind: 'text', op: 'startsWith', value: 'A' }, { kind: 'text', op: 'blank', value: '' }] },
      { colId: 'createdAt', join: 'AND', conditions: [{ kind: 'date', op: 'inRange', value: '2026-01-01', to: '2026-01-31' }] },
    ]);
  });

  it('treats a null filter model as no filter', () => {
    expect(parse('filter=null').filters).toEqual([]);
  });

  it('refuses search text over 200 characters', () => {
    expect(refusal(`q=${'x'.repeat(201)}`)).toMatch(/at most 200/);
  });
});
