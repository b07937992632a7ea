import { describe, expect, it } from 'vitest';
import { getSalt, requireSalt, saltMetalFraction, SALTS } from '@/lib/chemistry/salts';
import { molarMass } from '@/lib/chemistry/formula';
import { baumeToSpecificGravity } from '@/lib/bath/methods/titration';

describe('salt list', () => {
  it('has unique ids and formulas that parse', () => {
    expect(new Set(SALTS.map((s) => s.id)).size).toBe(SALTS.length);
    for (const s of SALTS) expect(molarMass(s.formula)).toBeGreaterThan(0);
  });

  it('metal fractions of solid salts match reference §5', () => {
    // Source: reference sheet §5 metal-content table.
    const salt = requireSalt('nickel-sulfate-hexahydrate');
    expect(salt.kind).toBe('solid');
    if (salt.kind === 'solid') expect(saltMetalFraction(salt) * 100).toBeCloseTo(22.33, 2);
    const gold = requireSalt('potassium-gold-cyanide');
    if (gold.kind === 'solid') expect(saltMetalFraction(gold) * 100).toBeCloseTo(68.37, 2);
  });

  it('liquid concentrates carry strength, density and a governing-source note', () => {
    for (const s of SALTS) {
      if (s.kind !== 'liquid') continue;
      expect(s.contentGramsPerLitre).toBeGreaterThan(0);
      expect(s.densityKgPerL).toBeGreaterThan(0);
      expect(s.source).toMatch(/Supplier data sheet governs/);
    }
  });

  it('acid densities agree with the Baumé relation', () => {
    // Source: Marks' Handbook via Engineers Edge (reference §4.3): 66 °Bé → 1.8354, 20 °Bé → 1.1600.
    const density = (id: string) => {
      const s = getSalt(id);
      if (s?.kind !== 'liquid') throw new Error(`${id} is not a liquid`);
      return s.densityKgPerL;
    };
    expect(density('sulfuric-acid-66-baume')).toBeCloseTo(baumeToSpecificGravity(66), 2);
    expect(density('hydrochloric-acid-20-baume')).toBeCloseTo(baumeToSpecificGravity(20), 2);
  });

  it('asks for a known id and refuses metal fractions of non-metal salts', () => {
    expect(getSalt('unobtainium')).toBeNull();
    expect(() => requireSalt('unobtainium')).toThrow(/Unknown salt/);
    const boric = requireSalt('boric-acid');
    if (boric.kind === 'solid') expect(() => saltMetalFraction(boric)).toThrow(/supplies no plating metal/);
  });
});
