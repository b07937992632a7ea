import { describe, expect, it } from 'vitest';
import { bakeFor, coatingVerdict, contactVerdict, safetyNotes } from '@/lib/estimating/safety';

const kinds = (element: string, charge: number) => safetyNotes(element, charge, null).map((n) => n.kind);

describe('process cautions', () => {
  it('flags the cyanide baths: Cu⁺, Ag⁺ and Au⁺ complexes, and cadmium', () => {
    // Source: reference §2 (cyanide copper, cyanide silver, cyanide gold baths) and §12 (cadmium, usually cyanide).
    for (const [el, n] of [['Cu', 1], ['Ag', 1], ['Au', 1], ['Cd', 2]] as const) expect(kinds(el, n)).toEqual(['cyanide']);
    for (const [el, n] of [['Cu', 2], ['Ni', 2], ['Au', 3], ['Zn', 2]] as const) expect(kinds(el, n)).toEqual([]);
  });

  it('flags chromium plated from Cr(VI) (n = 6) and not from Cr(III)', () => {
    // Source: OSHA 29 CFR 1910.1026 covers hexavalent chromium only.
    expect(kinds('Cr', 6)).toEqual(['hexavalent-chromium']);
    expect(kinds('Cr', 3)).toEqual([]);
  });
});

describe('relief bake for high-strength steel', () => {
  it('starts at 31 HRC or 1000 MPa and gives the B850 hours', () => {
    // Source: ASTM B849 scope (1000 MPa) and ASTM B850 Table 1 (31–33 HRC: 8 h), reference §7.
    expect(bakeFor('carbon-steel', 31, null)).toMatchObject({ required: true, minHours: 8 });
    expect(bakeFor('carbon-steel', null, 1000)).toMatchObject({ required: true, minHours: 8 });
    expect(bakeFor('carbon-steel', 30, null)).toMatchObject({ required: false });
    expect(bakeFor('carbon-steel', null, null)).toBeNull();
    expect(bakeFor('brass', 40, null)).toBeNull();
    const notes = safetyNotes('Zn', 2, bakeFor('carbon-steel', 31, null));
    expect(notes.map((n) => n.kind)).toEqual(['high-strength-steel-bake']);
    expect(notes[0]!.detail).toMatch(/at least 8 h at 190–220 °C/);
  });

  it('adds the ASTM B633 limit above 46 HRC', () => {
    // Source: ASTM B633 scope: steel above 1700 MPa (about 46 HRC) is not electroplated unless specified (reference §7).
    const detail = safetyNotes('Zn', 2, bakeFor('carbon-steel', 47, null))[0]!.detail;
    expect(detail).toMatch(/ASTM B633: steel above 1700 MPa \(about 46 HRC\)/);
    expect(safetyNotes('Zn', 2, bakeFor('carbon-steel', 45, null))[0]!.detail).not.toMatch(/B633/);
  });

  it('refuses an impossible hardness with the field named', () => {
    expect(() => bakeFor('carbon-steel', 90, null)).toThrow(expect.objectContaining({ name: 'PlatingInputError', field: 'hardnessHrc' }));
  });
});

describe('galvanic checks', () => {
  it('zinc and cadmium protect steel sacrificially; nickel, tin and copper are barriers', () => {
    // Source: MIL-STD-889 anodic index (reference §9.1): zinc 1.25 V, cadmium 0.95 V, steel 0.85 V,
    // tin 0.60 V, copper 0.35 V, nickel 0.30 V; the higher index corrodes first.
    expect(coatingVerdict('Zn', 'carbon-steel')).toMatchObject({ protection: 'sacrificial', differenceV: 0.4 });
    expect(coatingVerdict('Cd', 'carbon-steel')).toMatchObject({ protection: 'sacrificial', differenceV: 0.1 });
    expect(coatingVerdict('Ni', 'carbon-steel')).toMatchObject({ protection: 'barrier', differenceV: -0.55 });
    expect(coatingVerdict('Sn', 'carbon-steel')?.protection).toBe('barrier');
    expect(coatingVerdict('Cu', 'carbon-steel')?.protection).toBe('barrier');
    expect(coatingVerdict('Co', 'carbon-steel')).toBeNull();
  });

  it('on aluminium, zinc is sacrificial and nickel a barrier', () => {
    // Source: MIL-STD-889 anodic index (reference §9.1): wrought aluminium 0.90 V.
    expect(coatingVerdict('Zn', 'aluminium')?.protection).toBe('sacrificial');
    expect(coatingVerdict('Ni', 'aluminium')?.protection).toBe('barrier');
  });

  it('warns when a nickel-plated part touches aluminium outdoors', () => {
    // Source: reference §9.1 contact limits: 0.15 V harsh, 0.25 V normal, 0.50 V controlled; |0.30 − 0.90| = 0.60 V.
    const c = contactVerdict('Ni', { material: 'aluminium', environment: 'harsh' })!;
    expect(c).toMatchObject({ exceedsLimit: true, differenceV: 0.6, limitV: 0.15, anodicMember: 'b' });
    expect(contactVerdict('Ni', { material: 'monel', environment: 'harsh' })!.exceedsLimit).toBe(false);
    expect(contactVerdict('Ni', null)).toBeNull();
  });
});
