import { describe, expect, it } from 'vitest';
import { parseMethod } from '@/lib/quality/methods';
import { parseThicknessCsv } from '@/lib/quality/thickness-csv';

describe('parseThicknessCsv', () => {
  it('reads µm, mil and µin columns and a unit column, converting to µm', () => {
    // Source: NIST SP 811 App. B.8: 1 in = 25.4 mm exactly, so 1 mil = 25.4 µm and 1 µin = 0.0254 µm.
    expect(parseThicknessCsv('part,location,method,thickness_um\n1,head,B568,9.5\n')).toEqual({
      ok: true, readings: [{ row: 2, partNo: 1, location: 'head', method: 'B568', thicknessUm: 9.5 }],
    });
    const mil = parseThicknessCsv('Part,Location,Method,Thickness (mil)\n1,head,ASTM B499,0.5\n');
    expect(mil.ok && mil.readings[0]!.thicknessUm).toBe(12.7);
    const uin = parseThicknessCsv('part,location,method,thickness_uin\n1,head,XRF,400\n');
    expect(uin.ok && uin.readings[0]).toMatchObject({ thicknessUm: 10.16, method: 'B568' });
    const unitCol = parseThicknessCsv('part,location,thickness,unit\n1,a,10,um\n2,a,0.4,mil\n', { defaultMethod: 'B499' });
    expect(unitCol.ok && unitCol.readings.map((r) => r.thicknessUm)).toEqual([10, 10.16]);
  });

  it('checks the header before any row', () => {
    const r = parseThicknessCsv('piece,thickness_um,thickness_mil\n1,2,3\n');
    expect(r).toEqual({
      ok: false,
      problems: [
        { row: 1, column: 'location', message: 'A "location" column (where on the part) is needed.' },
        { row: 1, column: 'method', message: 'A "method" column is needed, or choose the method for the whole file.' },
        { row: 1, column: 'thickness', message: 'Exactly one thickness column is needed, e.g. "thickness_um" or "thickness_mil".' },
      ],
    });
    expect(parseThicknessCsv('')).toEqual({ ok: false, problems: [{ row: 1, column: '', message: 'The file is empty.' }] });
  });

  it('lists every bad row by row and column and returns no readings', () => {
    const r = parseThicknessCsv('part,location,method,thickness_um\n0,a,B568,1\nx,a,B568,1\n3,a,B568,-2\n4,a,B568,6000\n5,a,B568,\n');
    expect(r.ok).toBe(false);
    expect(!r.ok && r.problems.map((p) => `${p.row}:${p.column}`)).toEqual(['2:part', '3:part', '4:thickness_um', '5:thickness_um', '6:thickness_um']);
  });
});

describe('parseMethod', () => {
  it.each([
    ['ASTM B568-98', 'B568'], ['b499', 'B499'], ['B 244', 'B244'], ['coulometric', 'B504'], ['Cross-section', 'B487'], ['beta', 'B567'], ['B633', null], ['', null],
  ])('%s → %s', (text, code) => {
    expect(parseMethod(text)).toBe(code);
  });
});
