import { describe, expect, it } from 'vitest';
import {
  PlatingInputError,
  SUBSTRATES,
  blockArea,
  cylinderArea,
  frustumArea,
  getSubstrate,
  measureShape,
  partMassG,
  plateWithHolesArea,
  sphereArea,
  tubeArea,
} from '@/lib/plating';
import { catchError } from './catch-error';

// Shapes against hand formulas (area in mm² ÷ 10⁴ = dm², volume in mm³ ÷ 10³ = cm³).
const PI = Math.PI;

describe('surface area of simple shapes', () => {
  it('block: the Groover plate 3.2 × 130 × 160 mm is 43 456 mm²', () => {
    // Source: Groover, Fundamentals of Modern Manufacturing, Ni-plating problem (reference §1.4 E3).
    const r = blockArea({ lengthMm: 160, widthMm: 130, heightMm: 3.2 });
    expect(r.areaDm2).toBeCloseTo(4.3456, 12);
    expect(r.volumeCm3).toBeCloseTo(66.56, 10);
  });

  it('plate with holes: openings off both faces, bore walls added', () => {
    // Hand formula: 2(lw − Nπd²/4) + 2t(l + w) + Nπdt; volume (lw − Nπd²/4)·t.
    const l = 100, w = 50, t = 3;
    const r = plateWithHolesArea({
      lengthMm: l, widthMm: w, thicknessMm: t,
      holes: [{ diameterMm: 6, count: 4 }, { diameterMm: 20, count: 1 }],
    });
    const openings = 4 * PI * 9 + PI * 100;
    const expected = 2 * (l * w - openings) + 2 * t * (l + w) + 4 * PI * 6 * t + PI * 20 * t;
    expect(r.areaDm2).toBeCloseTo(expected / 1e4, 12);
    expect(r.volumeCm3).toBeCloseTo(((l * w - openings) * t) / 1e3, 12);
    const plain = plateWithHolesArea({ lengthMm: l, widthMm: w, thicknessMm: t, holes: [] });
    expect(plain.areaDm2).toBeCloseTo(blockArea({ lengthMm: l, widthMm: w, heightMm: t }).areaDm2, 12);
  });

  it('cylinder with and without ends', () => {
    const withEnds = cylinderArea({ diameterMm: 20, lengthMm: 100 });
    const noEnds = cylinderArea({ diameterMm: 20, lengthMm: 100, includeEnds: false });
    expect(withEnds.areaDm2).toBeCloseTo((PI * 20 * 100 + 2 * PI * 100) / 1e4, 12);
    expect(noEnds.areaDm2).toBeCloseTo((PI * 20 * 100) / 1e4, 12);
    expect(withEnds.volumeCm3).toBeCloseTo((PI * 100 * 100) / 1e3, 12);
  });

  it('tube: outside, bore and annular ends each switchable', () => {
    const D = 50, d = 40, L = 200;
    const outside = PI * D * L, bore = PI * d * L, ends = 2 * (PI / 4) * (D * D - d * d);
    expect(tubeArea({ outerDiameterMm: D, innerDiameterMm: d, lengthMm: L }).areaDm2).toBeCloseTo((outside + bore + ends) / 1e4, 12);
    expect(tubeArea({ outerDiameterMm: D, innerDiameterMm: d, lengthMm: L, includeBore: false }).areaDm2).toBeCloseTo((outside + ends) / 1e4, 12);
    expect(
      tubeArea({ outerDiameterMm: D, innerDiameterMm: d, lengthMm: L, includeBore: false, includeEnds: false }).areaDm2,
    ).toBeCloseTo(outside / 1e4, 12);
    expect(tubeArea({ outerDiameterMm: D, innerDiameterMm: d, lengthMm: L }).volumeCm3).toBeCloseTo(((PI / 4) * (D * D - d * d) * L) / 1e3, 12);
  });

  it('sphere: πd² and πd³/6', () => {
    const r = sphereArea({ diameterMm: 30 });
    expect(r.areaDm2).toBeCloseTo((PI * 900) / 1e4, 12);
    expect(r.volumeCm3).toBeCloseTo((PI * 27000) / 6 / 1e3, 12);
  });

  it('cone frustum: lateral π(R + r)s plus optional ends; a full cone when the top is 0', () => {
    const R = 30, r = 10, h = 40, s = Math.hypot(R - r, h);
    const full = frustumArea({ baseDiameterMm: 2 * R, topDiameterMm: 2 * r, heightMm: h });
    expect(full.areaDm2).toBeCloseTo((PI * (R + r) * s + PI * R * R + PI * r * r) / 1e4, 12);
    expect(full.volumeCm3).toBeCloseTo((PI * h * (R * R + R * r + r * r)) / 3 / 1e3, 12);
    const lateral = frustumArea({ baseDiameterMm: 2 * R, topDiameterMm: 2 * r, heightMm: h, includeBase: false, includeTop: false });
    expect(lateral.areaDm2).toBeCloseTo((PI * (R + r) * s) / 1e4, 12);
    const cone = frustumArea({ baseDiameterMm: 60, topDiameterMm: 0, heightMm: 40 });
    expect(cone.volumeCm3).toBeCloseTo((PI * 900 * 40) / 3 / 1e3, 12);
    // A frustum with equal ends is a cylinder.
    expect(frustumArea({ baseDiameterMm: 20, topDiameterMm: 20, heightMm: 100 }).areaDm2).toBeCloseTo(
      cylinderArea({ diameterMm: 20, lengthMm: 100 }).areaDm2, 12,
    );
  });

  it('measureShape dispatches on kind', () => {
    expect(measureShape({ kind: 'sphere', diameterMm: 30 })).toEqual(sphereArea({ diameterMm: 30 }));
    expect(() => measureShape({ kind: 'torus' } as never)).toThrow(/Unknown shape/);
  });
});

describe('geometry validation', () => {
  it('refuses impossible shapes with the offending field', () => {
    expect(catchError(() => tubeArea({ outerDiameterMm: 20, innerDiameterMm: 20, lengthMm: 5 }))).toMatchObject({
      field: 'innerDiameterMm',
    });
    expect(
      catchError(() => plateWithHolesArea({ lengthMm: 10, widthMm: 10, thicknessMm: 1, holes: [{ diameterMm: 12, count: 1 }] })),
    ).toMatchObject({ field: 'holes.0.diameterMm' });
    expect(
      catchError(() => plateWithHolesArea({ lengthMm: 10, widthMm: 10, thicknessMm: 1, holes: [{ diameterMm: 5, count: 9 }] })),
    ).toMatchObject({ field: 'holes' });
    expect(
      catchError(() => plateWithHolesArea({ lengthMm: 10, widthMm: 10, thicknessMm: 1, holes: [{ diameterMm: 2, count: 1.5 }] })),
    ).toMatchObject({ field: 'holes.0.count' });
    for (const bad of [0, -1, Number.NaN, Infinity]) {
      expect(catchError(() => blockArea({ lengthMm: bad, widthMm: 1, heightMm: 1 }))).toMatchObject({ field: 'lengthMm' });
      expect(() => sphereArea({ diameterMm: bad })).toThrow(PlatingInputError);
    }
    expect(() => frustumArea({ baseDiameterMm: 10, topDiameterMm: -1, heightMm: 5 })).toThrow(PlatingInputError);
  });
});

describe('substrates and part weight', () => {
  it('weighs a steel cube of 10 mm as 7.85 g', () => {
    const cube = blockArea({ lengthMm: 10, widthMm: 10, heightMm: 10 });
    expect(partMassG(cube.volumeCm3, getSubstrate('carbon-steel').densityGPerCm3)).toBeCloseTo(7.85, 12);
  });

  it('names a source for every density and refuses unknown substrates', () => {
    for (const s of Object.values(SUBSTRATES)) expect(s.source).toMatch(/CRC|from memory/);
    expect(SUBSTRATES.copper.densityGPerCm3).toBe(8.96); // Source: CRC (reference §1.2)
    expect(catchError(() => getSubstrate('unobtainium'))).toMatchObject({ field: 'substrate' });
  });
});
