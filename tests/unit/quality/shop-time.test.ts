import { describe, expect, it } from 'vitest';
import { formatShopTime, toLocalInputValue, zonedLocalToInstant, zoneOffsetMs } from '@/lib/quality/shop-time';

// Source: US daylight saving time begins the second Sunday of March and ends the first Sunday of
// November at 02:00 local time (Energy Policy Act of 2005, §110); EU summer time ends the last
// Sunday of October at 01:00 UTC (Directive 2000/84/EC). Offsets: EST UTC−5, EDT UTC−4.
describe('zonedLocalToInstant', () => {
  const NY = 'America/New_York';
  it.each([
    ['2026-01-15T09:00', '2026-01-15T14:00:00.000Z'],
    ['2026-07-15T09:00', '2026-07-15T13:00:00.000Z'],
    ['2026-03-08T01:59', '2026-03-08T06:59:00.000Z'],
    ['2026-03-08T03:00', '2026-03-08T07:00:00.000Z'],
    ['2026-11-01T00:30', '2026-11-01T04:30:00.000Z'],
    ['2026-11-01T04:00', '2026-11-01T09:00:00.000Z'],
    ['2026-12-31T23:30', '2027-01-01T04:30:00.000Z'],
  ])('%s in New York is %s', (local, utc) => {
    expect(zonedLocalToInstant(local, NY).toISOString()).toBe(utc);
  });

  it('a time that happens twice (01:30 on 1 Nov) resolves to the first, in EDT', () => {
    expect(zonedLocalToInstant('2026-11-01T01:30', NY).toISOString()).toBe('2026-11-01T05:30:00.000Z');
  });

  it('a time skipped by the clocks (02:30 on 8 Mar) is refused with a message', () => {
    expect(() => zonedLocalToInstant('2026-03-08T02:30', NY, 'bakeStarted', 'Bake start')).toThrow(
      'Bake start 2026-03-08T02:30 does not exist in America/New_York: the clocks went forward then. Enter the time as the clock showed it.',
    );
  });

  it('takes a string with an offset as it is, and refuses nonsense', () => {
    expect(zonedLocalToInstant('2026-11-01T01:30-05:00', NY).toISOString()).toBe('2026-11-01T06:30:00.000Z');
    expect(() => zonedLocalToInstant('2026-02-30T10:00', NY)).toThrow('Time is not a real date and time.');
    expect(() => zonedLocalToInstant('yesterday', NY)).toThrow('Time must look like 2026-03-08T14:30.');
    expect(() => zonedLocalToInstant('2026-01-01T10:00', 'Mars/Olympus')).toThrow('Unknown time zone "Mars/Olympus".');
    expect(() => zonedLocalToInstant('', NY)).toThrow('Time is required.');
  });

  it('London: summer time to winter time on 25 Oct 2026', () => {
    expect(zonedLocalToInstant('2026-10-24T23:00', 'Europe/London').toISOString()).toBe('2026-10-24T22:00:00.000Z');
    expect(zonedLocalToInstant('2026-10-25T02:30', 'Europe/London').toISOString()).toBe('2026-10-25T02:30:00.000Z');
  });
});

describe('display helpers', () => {
  it('offset, input value and text in the shop zone', () => {
    expect(zoneOffsetMs(Date.parse('2026-07-01T12:00:00Z'), 'America/New_York')).toBe(-4 * 3_600_000);
    expect(toLocalInputValue('2026-11-01T09:00:00Z', 'America/New_York')).toBe('2026-11-01T04:00');
    expect(formatShopTime('2026-11-01T09:00:00Z', 'America/New_York')).toBe('1 Nov 2026, 04:00 EST');
    expect(formatShopTime('2026-11-01T05:30:00Z', 'America/New_York')).toBe('1 Nov 2026, 01:30 EDT');
    expect(formatShopTime('not a date', 'America/New_York')).toBe('—');
  });
});
