import { describe, expect, it } from 'vitest';
import { checkLabCsv, type LabContext } from '@/lib/bath/lab-csv';

const context: LabContext = {
  now: new Date('2026-12-01T12:00:00Z'),
  tanks: new Map([
    ['N-NI1', { id: 'tank-ni', analytes: new Map([['nickel', { id: 'an-ni', unit: 'g/L', name: 'Nickel metal' }], ['temperature', { id: 'an-t', unit: '°C', name: 'Temperature' }]]) }],
  ]),
};

describe('checkLabCsv', () => {
  it('accepts good rows, converting units and reading times as UTC, oldest first', () => {
    const csv = 'Tank code,Analyte key,Value,Unit,Taken at\nN-NI1,nickel,10,oz/gal,2026-11-30 08:15\nn-ni1,temperature,131,°F,2026-11-29T07:00:00Z\n';
    const r = checkLabCsv(csv, context);
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    expect(r.rows.map((x) => x.row)).toEqual([3, 2]);
    // Source: NIST Handbook 44 App. C — 1 oz/gal = 7.48915 g/L; NIST SP 811 — 131 °F = 55 °C.
    expect(r.rows[1]).toMatchObject({ tankId: 'tank-ni', analyteId: 'an-ni', takenAt: new Date('2026-11-30T08:15:00Z') });
    expect(r.rows[1]!.value).toBeCloseTo(74.8915, 3);
    expect(r.rows[0]!.value).toBeCloseTo(55, 9);
  });

  it('lists every problem by row and column and returns no rows', () => {
    const csv = [
      'tank_code,analyte_key,value,unit,taken_at',
      'N-NI1,nickel,75.1,g/L,2026-11-30 08:00',
      'X-99,nickel,75,g/L,2026-11-30 08:00',
      'N-NI1,boron,75,g/L,2026-11-30 08:00',
      'N-NI1,nickel,7,5,g/L,2026-11-30 08:00',
      'N-NI1,nickel,abc,mL/L,yesterday',
      'N-NI1,nickel,74,g/L,2027-01-01 00:00',
      'N-NI1,nickel,75.1,g/L,2026-11-30 08:00',
    ].join('\n');
    const r = checkLabCsv(csv, context);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const at = (row: number) => r.errors.filter((e) => e.row === row).map((e) => e.column);
    expect(at(2)).toEqual([]);
    expect(at(3)).toEqual(['tank_code']);
    expect(at(4)).toEqual(['analyte_key']);
    expect(at(5)).toContain('file');
    expect(at(6).sort()).toEqual(['taken_at', 'unit', 'value']);
    expect(at(7)).toEqual(['taken_at']);
    expect(r.errors.find((e) => e.row === 8)?.message).toMatch(/already on row 2/);
  });

  it('refuses a file without the columns, or without rows', () => {
    expect(checkLabCsv('tank,value\nN-NI1,3', context)).toMatchObject({ ok: false, errors: [{ row: 1, column: 'file' }] });
    expect(checkLabCsv('tank_code,analyte_key,value,unit,taken_at\n', context)).toMatchObject({ ok: false, errors: [{ message: /no results/ }] });
  });
});
