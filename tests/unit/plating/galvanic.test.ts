import { describe, expect, it } from 'vitest';
import { GALVANIC_MATERIALS, STANDARD_POTENTIALS, contactCheck, galvanicCheck } from '@/lib/plating';
import { catchError } from './catch-error';

// Source: MIL-STD-889 anodic index as reproduced in reference §9.1 (S74/S75; rows from steel down
// are marked "from memory" there) and MIL-DTL-14072 §3.13.1 for the sacrificial/barrier rule.

describe('coating on substrate', () => {
  it.each(['zinc', 'cadmium'])('%s on steel is sacrificial', (coating) => {
    const r = galvanicCheck({ coating, substrate: 'steel' });
    expect(r.protection).toBe('sacrificial');
    expect(r.differenceV).toBeGreaterThan(0);
  });

  it.each(['nickel', 'tin', 'copper', 'chromium'])('%s on steel is a barrier', (coating) => {
    const r = galvanicCheck({ coating, substrate: 'steel' });
    expect(r.protection).toBe('barrier');
    expect(r.differenceV).toBeLessThan(0);
  });

  it('zinc on aluminium is sacrificial: 1.25 V > 0.90 V', () => {
    const r = galvanicCheck({ coating: 'zinc', substrate: 'aluminium' });
    expect([r.coatingIndexV, r.substrateIndexV]).toEqual([1.25, 0.9]);
    expect(r.differenceV).toBe(0.35);
    expect(r.protection).toBe('sacrificial');
  });

  it.each(['nickel', 'copper', 'tin'])('%s on aluminium is a barrier', (coating) => {
    expect(galvanicCheck({ coating, substrate: 'aluminium' }).protection).toBe('barrier');
  });

  it('zinc on steel: 1.25 − 0.85 = 0.40 V; E° explains it (Zn −0.76 V below Fe −0.45 V)', () => {
    // Source: E° from the CRC electrochemical series, from memory (reference §9.2).
    const r = galvanicCheck({ coating: 'zinc', substrate: 'steel' });
    expect(r.differenceV).toBe(0.4);
    expect(r.standardPotentialDifferenceV).toBeCloseTo(-0.7618 + 0.447, 9);
    expect(r.explanation).toMatch(/corrodes first/);
  });

  it('gold on nickel is a barrier (reference §9.1 example)', () => {
    expect(galvanicCheck({ coating: 'gold', substrate: 'nickel' }).protection).toBe('barrier');
  });

  it('same index is "equal"', () => {
    expect(galvanicCheck({ coating: 'tin', substrate: 'chromium' }).protection).toBe('equal');
  });

  it('refuses unknown materials, listing the known ones', () => {
    const err = catchError(() => galvanicCheck({ coating: 'unobtainium', substrate: 'steel' }));
    expect(err).toMatchObject({ field: 'material' });
    expect(err.message).toMatch(/zinc/);
  });

  it('marks the unverified rows as from memory and every couple exists', () => {
    expect(GALVANIC_MATERIALS.steel.source).toMatch(/from memory/);
    expect(GALVANIC_MATERIALS.nickel.source).toMatch(/checked/);
    for (const m of Object.values(GALVANIC_MATERIALS)) {
      if (m.couple) expect(STANDARD_POTENTIALS[m.couple]).toBeDefined();
    }
  });
});

describe('contact between two members', () => {
  it('limits: harsh 0.15, normal 0.25, controlled 0.50 V', () => {
    // Source: reference §9.1 allowable differences (S74, S75).
    // silver 0.15 / nickel 0.30 → 0.15 V: exactly at the harsh limit, so allowed.
    expect(contactCheck({ a: 'silver', b: 'nickel', environment: 'harsh' }).exceedsLimit).toBe(false);
    // nickel 0.30 / stainless 0.50 → 0.20 V
    expect(contactCheck({ a: 'nickel', b: 'stainless-steel', environment: 'harsh' }).exceedsLimit).toBe(true);
    expect(contactCheck({ a: 'nickel', b: 'stainless-steel', environment: 'normal' }).exceedsLimit).toBe(false);
    // copper 0.35 / aluminium 0.90 → 0.55 V
    const cuAl = contactCheck({ a: 'copper', b: 'aluminium', environment: 'controlled' });
    expect(cuAl).toMatchObject({ differenceV: 0.55, limitV: 0.5, exceedsLimit: true, anodicMember: 'b' });
    expect(cuAl.note).toMatch(/Aluminium/);
  });

  it('is symmetric in its members', () => {
    const ab = contactCheck({ a: 'zinc', b: 'steel', environment: 'normal' });
    const ba = contactCheck({ a: 'steel', b: 'zinc', environment: 'normal' });
    expect(ab.differenceV).toBe(ba.differenceV);
    expect([ab.anodicMember, ba.anodicMember]).toEqual(['a', 'b']);
  });

  it('refuses an unknown environment', () => {
    expect(catchError(() => contactCheck({ a: 'zinc', b: 'steel', environment: 'marine' as 'harsh' }))).toMatchObject({
      field: 'environment',
    });
  });
});
