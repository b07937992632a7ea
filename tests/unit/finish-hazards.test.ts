// Which cautions a finish shows: its family's, its metal's and its bath's (reference §12).
import { describe, expect, it } from 'vitest';
import { BATH_TEMPLATES } from '@/lib/bath/templates';
import { finishHazards, platingCautions } from '@/lib/finishes/hazards';
import { quoteHazards } from '@/lib/quotes/hazards';

const zincLine = {
  finishId: 'f-zinc',
  finishName: 'Zinc, clear trivalent passivate (barrel)',
  processRoute: [{ step: 'Alkaline soak clean' }, { step: 'Zinc plate' }],
  specText: 'ASTM B633 Fe/Zn 8 (SC2) Type III',
  calculation: { input: { finish: { element: 'Zn', ionCharge: 2 } } },
  cost: { bake: { applies: false } },
};

describe('finish cautions', () => {
  it('every electroplating bath: current and the hydrogen it makes; acid copper and chromic acid are acids', () => {
    expect(platingCautions('Zn', 2)).toEqual(['electrical', 'hydrogen']);
    expect(platingCautions('Cu', 2)).toContain('acid');
    expect(platingCautions('Cr', 6)).toEqual(expect.arrayContaining(['acid', 'heat']));
    expect(platingCautions('Ni', 2)).toContain('nickel');
  });

  it('an alkaline zinc line is caustic because its bath is, though the finish’s name does not say so', () => {
    const alkaline = BATH_TEMPLATES.find((t) => t.id === 'alkaline-zinc')!;
    expect(alkaline.hazards).toContain('caustic');
    expect(quoteHazards([zincLine], new Map([['f-zinc', alkaline.hazards]]))).toEqual(expect.arrayContaining(['electrical', 'hydrogen', 'caustic']));
    // Without knowing the bath, the words alone do not make it caustic.
    expect(quoteHazards([zincLine])).not.toContain('caustic');
  });

  it('adds the relief bake and the route’s cyanide', () => {
    const kinds = finishHazards({ element: 'Cu', ionCharge: 1, route: [{ step: 'Cyanide copper strike' }], bakeRequired: true });
    expect(kinds).toEqual(expect.arrayContaining(['cyanide', 'caustic', 'high-strength-steel-bake']));
  });
});
