import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { bakeDeadline, bakeRequirement, judgeBake, type BakeRequirement } from '@/lib/quality/bake';

// Source for hours and temperatures: ASTM B850-98 (R2015) Table 1 as reproduced in reference §7
// (1001–1100 MPa 8 h … 1701–1800 MPa 22 h; 190–220 °C); B849 scope for the 1000 MPa threshold.
describe('bakeRequirement', () => {
  it.each([
    [1000, 8],
    [1050, 8],
    [1100, 8],
    [1100.5, 10],
    [1250, 12],
    [1350, 14],
    [1450, 16],
    [1550, 18],
    [1650, 20],
    [1800, 22],
  ])('%f MPa → %i h', (mpa, hours) => {
    expect(bakeRequirement({ tensileMpa: mpa })).toMatchObject({ required: true, minHours: hours, minTempC: 190, maxTempC: 220, windowHours: 4 });
  });

  it('below 1000 MPa no bake is required', () => {
    expect(bakeRequirement({ tensileMpa: 999 })).toMatchObject({ required: false, minHours: null });
  });

  it('beyond the table the customer specification sets the bake', () => {
    const r = bakeRequirement({ tensileMpa: 1850 });
    expect(r).toMatchObject({ required: true, minHours: null });
    expect(r.notes.join(' ')).toMatch(/beyond the ASTM B850 table/);
    expect(r.notes.join(' ')).toMatch(/B633/);
  });

  it('hardness bands: a shared end point takes the longer bake', () => {
    expect(bakeRequirement({ hardnessHrc: 31 }).minHours).toBe(8);
    expect(bakeRequirement({ hardnessHrc: 33 }).minHours).toBe(10);
    expect(bakeRequirement({ hardnessHrc: 40 }).minHours).toBe(14);
    expect(bakeRequirement({ hardnessHrc: 30 }).required).toBe(false);
    expect(bakeRequirement({ hardnessHrc: 52 })).toMatchObject({ required: true, minHours: null });
    expect(bakeRequirement({ tensileMpa: 1050, hardnessHrc: 40 }).minHours).toBe(14);
  });

  it('a customer threshold governs whether a bake is required', () => {
    expect(bakeRequirement({ tensileMpa: 1150, specThresholdMpa: 1200 }).required).toBe(false);
    const low = bakeRequirement({ tensileMpa: 950, specThresholdMpa: 900 });
    expect(low).toMatchObject({ required: true, minHours: null });
    expect(low.notes.join(' ')).toMatch(/below the ASTM B850 table/);
  });

  it('needs a strength and carries the caution', () => {
    expect(() => bakeRequirement({})).toThrow(/tensile strength or the hardness/);
    expect(() => bakeRequirement({ tensileMpa: -5 })).toThrow(/Tensile/);
    expect(bakeRequirement({ tensileMpa: 1200 }).caution).toMatch(/customer's specification governs/);
  });
});

const chicago = (d: Date) =>
  new Intl.DateTimeFormat('en-US', { timeZone: 'America/Chicago', hour: '2-digit', minute: '2-digit', hourCycle: 'h23', timeZoneName: 'short' }).format(d);

describe('bake window across midnight and daylight-saving changes (America/Chicago)', () => {
  const req: BakeRequirement = bakeRequirement({ tensileMpa: 1250 }); // 12 h, 4 h window

  it('autumn: plating ends 23:30 CDT on 1 Nov 2025; the deadline is 02:30 CST, four real hours later', () => {
    const end = new Date('2025-11-02T04:30:00Z'); // 23:30 CDT, 1 Nov
    expect(chicago(end)).toBe('23:30 CDT');
    const deadline = bakeDeadline(end);
    expect(deadline.getTime() - end.getTime()).toBe(4 * 3_600_000);
    expect(chicago(deadline)).toBe('02:30 CST'); // a wall-clock sum would say 03:30

    // Started 02:45 CST: only 3 h 15 min by the wall clock, but 4 h 15 min really elapsed.
    const start = new Date('2025-11-02T08:45:00Z');
    expect(chicago(start)).toBe('02:45 CST');
    const j = judgeBake({ platingEnd: end, bakeStart: start, tempC: 200, durationH: 12, requirement: req });
    expect(j).toMatchObject({ ok: false, reasons: [{ code: 'late_start', minutesLate: 15 }] });
  });

  it('spring: plating ends 23:30 CST on 8 Mar 2025; the deadline is 04:30 CDT', () => {
    const end = new Date('2025-03-09T05:30:00Z'); // 23:30 CST, 8 Mar
    expect(chicago(end)).toBe('23:30 CST');
    expect(chicago(bakeDeadline(end))).toBe('04:30 CDT'); // a wall-clock sum would say 03:30
    // Started 04:15 CDT: 4 h 45 min by the wall clock, but 3 h 45 min really elapsed: on time.
    const start = new Date('2025-03-09T09:15:00Z');
    expect(chicago(start)).toBe('04:15 CDT');
    const j = judgeBake({ platingEnd: end.getTime(), bakeStart: start.getTime(), tempC: 205, durationH: 12.5, requirement: req });
    expect(j.ok).toBe(true);
  });
});

describe('judgeBake', () => {
  const req = bakeRequirement({ tensileMpa: 1450 }); // 16 h
  const end = Date.UTC(2025, 5, 10, 14, 0);
  const h = 3_600_000;

  it('passes a bake inside every limit', () => {
    expect(judgeBake({ platingEnd: end, bakeStart: end + h, tempC: { min: 195, max: 215 }, durationH: 16, requirement: req }).ok).toBe(true);
  });

  it('lists every reason a bake fails', () => {
    const j = judgeBake({ platingEnd: end, bakeStart: end + 5 * h, tempC: { min: 185, max: 225 }, durationH: 14.5, requirement: req });
    if (j.ok) throw new Error('expected a failing bake');
    expect(j.reasons.map((r) => r.code)).toEqual(['late_start', 'temperature_low', 'temperature_high', 'duration_short']);
    expect(j.reasons[0]).toMatchObject({ minutesLate: 60 });
    expect(j.reasons[1]).toMatchObject({ degreesC: 5 });
    expect(j.reasons[2]).toMatchObject({ degreesC: 5 });
    expect(j.reasons[3]).toMatchObject({ hoursShort: 1.5 });
    expect(j.reasons[3]!.message).toBe('Bake was 1.5 h short of 16 h.');
  });

  it('a start exactly at the deadline is on time; one minute after is late', () => {
    const base = { platingEnd: end, tempC: 200, durationH: 16, requirement: req };
    expect(judgeBake({ ...base, bakeStart: end + 4 * h }).ok).toBe(true);
    expect(judgeBake({ ...base, bakeStart: end + 4 * h + 60_000 })).toMatchObject({ ok: false, reasons: [{ code: 'late_start', minutesLate: 1 }] });
  });

  it('flags a start before plating ended, an unknown duration and honours a customer window', () => {
    expect(judgeBake({ platingEnd: end, bakeStart: end - h, tempC: 200, durationH: 16, requirement: req })).toMatchObject({
      ok: false,
      reasons: [{ code: 'not_after_plating' }],
    });
    const beyond = bakeRequirement({ tensileMpa: 1900 });
    expect(judgeBake({ platingEnd: end, bakeStart: end, tempC: 200, durationH: 30, requirement: beyond })).toMatchObject({
      ok: false,
      reasons: [{ code: 'duration_unknown' }],
    });
    const oneHour = bakeRequirement({ tensileMpa: 1450, windowHours: 1 });
    expect(judgeBake({ platingEnd: end, bakeStart: end + 2 * h, tempC: 200, durationH: 16, requirement: oneHour })).toMatchObject({
      ok: false,
      reasons: [{ code: 'late_start', minutesLate: 60 }],
    });
  });

  it('no bake needed → ok; bad times → clear error', () => {
    const none = bakeRequirement({ tensileMpa: 800 });
    expect(judgeBake({ platingEnd: end, bakeStart: end, tempC: 20, durationH: 0, requirement: none }).ok).toBe(true);
    expect(() => judgeBake({ platingEnd: new Date('nonsense'), bakeStart: end, tempC: 200, durationH: 16, requirement: req })).toThrow(/Plating end/);
    expect(() => judgeBake({ platingEnd: end, bakeStart: end, tempC: { min: 220, max: 200 }, durationH: 16, requirement: req })).toThrow(/lowest temperature/);
  });

  it('lateness equals real elapsed time past the window, whatever the start', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000_000_000_000 }), fc.integer({ min: 1, max: 48 * 60 }), (t0, minutes) => {
        const j = judgeBake({ platingEnd: t0, bakeStart: t0 + 4 * h + minutes * 60_000, tempC: 200, durationH: 16, requirement: req });
        expect(j).toMatchObject({ ok: false, reasons: [{ code: 'late_start', minutesLate: minutes }] });
      }),
    );
  });
});
