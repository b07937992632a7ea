import { describe, expect, it } from 'vitest';
import { formatMoney } from '@/components/money';
import { formatUnitValue, UNIT_SPACE, NO_VALUE } from '@/components/unit-value';
import { buildGridUrl, csvFileName, GRID_COUNT_CAP, lastRowOf, parseGridPage, sortParam, GridFetchError } from '@/components/data-grid/grid-query';
import { findCurrentHref } from '@/components/nav/app-nav';
import { checkLimits, classifyPoint, preparePoints, yScale } from '@/components/control-chart/chart-model';
import { formatTime, tickStyle } from '@/components/control-chart/chart-parts';

describe('formatMoney', () => {
  it('formats integer cents in the currency minor unit', () => {
    // Source: ISO 4217 list one (minor unit: USD 2, JPY 0, KWD 3).
    expect(formatMoney(123456)).toBe('$1,234.56');
    expect(formatMoney(5, 'USD')).toBe('$0.05');
    expect(formatMoney(-1999, 'USD')).toBe('-$19.99');
    expect(formatMoney(1500, 'JPY')).toBe('¥1,500');
    expect(formatMoney(1234, 'KWD')).toMatch(/1\.234/);
    expect(formatMoney(0)).toBe('$0.00');
  });
  it('shows negatives in brackets for accounting', () => {
    expect(formatMoney(-1999, 'USD', { accounting: true })).toBe('($19.99)');
  });
  it('refuses fractions, NaN and unknown currencies with a message', () => {
    expect(() => formatMoney(12.5)).toThrow(/whole number/);
    expect(() => formatMoney(Number.NaN)).toThrow(/whole number/);
    expect(() => formatMoney(Number.POSITIVE_INFINITY)).toThrow(/whole number/);
    expect(() => formatMoney(100, 'XYZZ')).toThrow(RangeError);
  });
});

describe('formatUnitValue', () => {
  it('puts a narrow no-break space before the unit', () => {
    // Source: NIST SP 811 §7.2 (space between number and unit; none before the plane-angle degree), from memory.
    expect(formatUnitValue(12.5, 'g/L')).toBe(`12.5${UNIT_SPACE}g/L`);
    expect(formatUnitValue(21, '°C')).toBe(`21${UNIT_SPACE}°C`);
    expect(formatUnitValue(45, '°')).toBe('45°');
    expect(formatUnitValue(1234.5678, 'A', { digits: 2 })).toBe(`1,234.57${UNIT_SPACE}A`);
    expect(formatUnitValue(3, 'µm', { digits: 1 })).toBe(`3.0${UNIT_SPACE}µm`);
  });
  it('never prints NaN or Infinity', () => {
    expect(formatUnitValue(Number.NaN, 'g/L')).toBe(NO_VALUE);
    expect(formatUnitValue(Number.POSITIVE_INFINITY, 'g/L')).toBe(NO_VALUE);
    expect(formatUnitValue(null, 'g/L')).toBe(NO_VALUE);
    expect(() => formatUnitValue(1, 'A', { digits: -1 })).toThrow(/digits/);
  });
});

describe('grid query', () => {
  const view = { sort: [{ colId: 'createdAt', sort: 'desc' as const }], filter: { status: { filterType: 'text', type: 'equals', filter: 'open' } }, q: ' nickel ' };
  it('builds the paging URL in a fixed order and keeps existing params', () => {
    const url = buildGridUrl('/api/analyses?tankId=4', view, { offset: 100, limit: 100 });
    const u = new URL(url, 'http://x');
    expect(u.pathname).toBe('/api/analyses');
    expect(u.searchParams.get('tankId')).toBe('4');
    expect(u.searchParams.get('offset')).toBe('100');
    expect(u.searchParams.get('limit')).toBe('100');
    expect(u.searchParams.get('sort')).toBe('createdAt:desc');
    expect(JSON.parse(u.searchParams.get('filter') ?? '')).toEqual(view.filter);
    expect(u.searchParams.get('q')).toBe('nickel');
    expect([...u.searchParams.keys()]).toEqual(['tankId', 'offset', 'limit', 'sort', 'filter', 'q']);
  });
  it('builds the CSV URL with the same view and no paging', () => {
    const u = new URL(buildGridUrl('/api/quotes', view, { format: 'csv' }), 'http://x');
    expect(u.searchParams.get('format')).toBe('csv');
    expect(u.searchParams.has('offset')).toBe(false);
    expect(u.searchParams.get('sort')).toBe('createdAt:desc');
  });
  it('omits empty sort, filter and search', () => {
    expect(buildGridUrl('/api/quotes', { sort: [], filter: {}, q: '  ' }, { offset: 0, limit: 50 })).toBe('/api/quotes?offset=0&limit=50');
    expect(sortParam(undefined)).toBeNull();
  });
  it('rejects bad paging', () => {
    expect(() => buildGridUrl('/a', {}, { offset: -1, limit: 10 })).toThrow(RangeError);
    expect(() => buildGridUrl('/a', {}, { offset: 0, limit: 0 })).toThrow(RangeError);
  });
  it('checks the page shape', () => {
    expect(parseGridPage({ rows: [{ id: 1 }], total: 1 })).toEqual({ rows: [{ id: 1 }], total: 1, next: null });
    expect(parseGridPage({ rows: [{ id: 1 }], total: 1, next: 'eyJ9' })).toEqual({ rows: [{ id: 1 }], total: 1, next: 'eyJ9' });
    // Anything but a cursor string means "no page after by key": the grid asks by offset.
    expect(parseGridPage({ rows: [], total: 0, next: 12 }).next).toBeNull();
    // Up to the server's cap the total is the last row; past it the grid scrolls on until a short block.
    expect(lastRowOf(420, 0, 100, 100)).toBe(420);
    expect(lastRowOf(GRID_COUNT_CAP + 1, 0, 100, 100)).toBeUndefined();
    expect(lastRowOf(GRID_COUNT_CAP + 1, 12_300, 40, 100)).toBe(12_340);
    expect(() => parseGridPage({ rows: 'x', total: 1 })).toThrow(GridFetchError);
    expect(() => parseGridPage({ rows: [], total: -1 })).toThrow(/total/);
    expect(() => parseGridPage(null)).toThrow(GridFetchError);
  });
  it('names the CSV file', () => {
    expect(csvFileName('attachment; filename="quotes-2025.csv"', '/api/quotes')).toBe('quotes-2025.csv');
    expect(csvFileName("attachment; filename=\"a.csv\"; filename*=UTF-8''b%20c.csv", '/api/quotes')).toBe('b c.csv');
    expect(csvFileName(null, '/api/work-orders?x=1')).toBe('work-orders.csv');
  });
});

describe('findCurrentHref', () => {
  const items = [
    { href: '/home', label: 'Home' },
    { href: '/baths', label: 'Baths' },
    { href: '/baths/alerts', label: 'Alerts' },
    { href: '/portal', label: 'Overview', exact: true },
  ];
  it('picks the longest matching section', () => {
    expect(findCurrentHref(items, '/baths/4')).toBe('/baths');
    expect(findCurrentHref(items, '/baths/alerts/9')).toBe('/baths/alerts');
    expect(findCurrentHref(items, '/bathsx')).toBeNull();
    expect(findCurrentHref(items, '/portal/account')).toBeNull();
    expect(findCurrentHref(items, '/portal')).toBe('/portal');
  });
});

describe('control chart model', () => {
  const limits = { cl: 60, ucl: 66, lcl: 54, lsl: 50, usl: 70 };
  it('classifies points: spec limits over rules', () => {
    expect(classifyPoint({ t: '2025-01-01', value: 71, rules: [] }, limits)).toBe('spec');
    expect(classifyPoint({ t: '2025-01-01', value: 49, rules: ['x'] }, limits)).toBe('spec');
    expect(classifyPoint({ t: '2025-01-01', value: 67, rules: ['Beyond UCL'] }, limits)).toBe('rule');
    expect(classifyPoint({ t: '2025-01-01', value: 60, rules: [] }, limits)).toBe('normal');
  });
  it('drops non-finite readings and counts them', () => {
    const r = preparePoints([{ t: 'a', value: 1, rules: [] }, { t: 'b', value: Number.NaN, rules: [] }], limits);
    expect(r.points).toHaveLength(1);
    expect(r.dropped).toBe(1);
  });
  it('covers all limits in the y range with round ticks', () => {
    const { domain, ticks } = yScale([{ value: 61 }], limits);
    expect(domain[0]).toBeLessThanOrEqual(50);
    expect(domain[1]).toBeGreaterThanOrEqual(70);
    // 1-2-5 steps (common practice): range 48.8–71.2 over 5 intervals → step 5.
    expect(ticks).toEqual([45, 50, 55, 60, 65, 70, 75]);
    const small = yScale([{ value: 4.1 }], { cl: 4.2, ucl: 4.5, lcl: 3.9 });
    expect(small.ticks).toEqual([3.8, 4, 4.2, 4.4, 4.6]);
    expect(yScale([], { cl: 5, ucl: 5, lcl: 5 }).domain[0]).toBeLessThan(5);
  });
  it('reports limits out of order', () => {
    expect(checkLimits(limits)).toEqual([]);
    expect(checkLimits({ cl: 60, ucl: 50, lcl: 54 })).toHaveLength(1);
    expect(checkLimits({ cl: Number.NaN, ucl: 50, lcl: 54 })[0]).toMatch(/CL/);
  });
});

describe('control chart axis labels', () => {
  it('name the year once a range runs past a year, so five years do not read "3 Dec … 2 Dec"', () => {
    expect(tickStyle('2026-08-05T12:00:00Z', '2026-12-03T12:00:00Z')).toBe('tick');
    expect(tickStyle('2021-12-04T12:00:00Z', '2026-12-03T12:00:00Z')).toBe('tick-year');
    expect(tickStyle(undefined, undefined)).toBe('tick');
    expect(formatTime('2023-02-08T15:00:00Z', 'tick', 'America/New_York')).toBe('8 Feb');
    expect(formatTime('2023-02-08T15:00:00Z', 'tick-year', 'America/New_York')).toBe('Feb 2023');
    // Late on 31 December in New York is already the new year in UTC: the shop's zone decides.
    expect(formatTime('2024-01-01T03:00:00Z', 'tick-year', 'America/New_York')).toBe('Dec 2023');
  });
});
