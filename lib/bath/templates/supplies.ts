// What each template analyte is put back with when it runs low: a plating salt (the analysis is
// the metal), a liquid concentrate, the compound itself, or a proprietary additive dosed in
// mL/L. Copied onto a tank's analytes when the tank is set up; a supervisor may change it.
// Choices follow the bath make-ups in the reference sheet §3 and the salts in lib/chemistry/salts;
// which salt a shop prefers is common practice, and the supplier's data sheet governs.
import type { Supply } from '../additions';
import { getSalt } from '../../chemistry/salts';
import { EN_SUPPLIES } from '../../families/electroless-nickel/bath';

export type AnalyteSupply = Supply | { kind: 'additive'; name: string };

const salt = (saltId: string): Supply => ({ kind: 'salt', saltId });
const concentrate = (saltId: string): Supply => ({ kind: 'concentrate', saltId });
const itself = (name: string): Supply => ({ kind: 'as_measured', name });
const additive = (name: string): AnalyteSupply => ({ kind: 'additive', name });

// pH, temperature, specific gravity, chloride in mg/L and contaminants have no calculator here:
// they are adjusted per the supplier's data sheet.
export const TEMPLATE_SUPPLIES: Readonly<Record<string, Readonly<Record<string, AnalyteSupply>>>> = {
  'watts-nickel': {
    nickel: salt('nickel-sulfate-hexahydrate'),
    nickelSulfate: itself('Nickel sulfate hexahydrate'),
    nickelChloride: itself('Nickel chloride hexahydrate'),
    boricAcid: itself('Boric acid'),
    brightener: additive('Nickel brightener'),
  },
  'sulfamate-nickel': {
    nickel: concentrate('nickel-sulfamate-concentrate'),
    nickelChloride: itself('Nickel chloride hexahydrate'),
    boricAcid: itself('Boric acid'),
  },
  'acid-copper': {
    copperSulfate: itself('Copper sulfate pentahydrate'),
    sulfuricAcid: concentrate('sulfuric-acid-66-baume'),
    brightener: additive('Acid copper brightener'),
  },
  'cyanide-copper-strike': {
    copper: salt('copper-cyanide'),
    freeCyanide: itself('Sodium cyanide'),
  },
  'alkaline-zinc': {
    zinc: salt('zinc-oxide'),
    sodiumHydroxide: itself('Sodium hydroxide'),
    brightener: additive('Zinc brightener'),
  },
  'acid-chloride-zinc': {
    zinc: salt('zinc-chloride'),
    potassiumChloride: itself('Potassium chloride'),
    boricAcid: itself('Boric acid'),
    brightener: additive('Zinc brightener'),
  },
  'alkaline-zinc-nickel': {
    zinc: salt('zinc-oxide'),
    sodiumHydroxide: itself('Sodium hydroxide'),
    brightener: additive('Zinc–nickel brightener'),
  },
  'trivalent-passivate': {
    chromium: itself('Trivalent passivate concentrate'),
  },
  'acid-tin': {
    tin: salt('stannous-sulfate'),
    sulfuricAcid: concentrate('sulfuric-acid-66-baume'),
    additive: additive('Tin additive'),
  },
  'cyanide-silver': {
    silver: salt('potassium-silver-cyanide'),
    freeCyanide: itself('Potassium cyanide'),
  },
  'acid-gold': {
    gold: salt('potassium-gold-cyanide'),
  },
  'hexavalent-chromium': {
    chromicAcid: itself('Chromium trioxide (chromic acid)'),
  },
  'trivalent-chromium': {
    additive: additive('Trivalent chromium additive'),
  },
  'alkaline-electrocleaner': {
    alkalinity: itself('Sodium hydroxide'),
  },
  'hydrochloric-acid-dip': {
    hydrochloricAcid: concentrate('hydrochloric-acid-20-baume'),
  },
  // The other process families' baths bring their supplies along.
  ...EN_SUPPLIES,
};

export function supplyFor(templateId: string, analyteKey: string): AnalyteSupply | null {
  return TEMPLATE_SUPPLIES[templateId]?.[analyteKey] ?? null;
}

/** The material's name as the plater sees it ("Nickel sulfate hexahydrate"). */
export function supplyMaterial(supply: AnalyteSupply): string {
  if (supply.kind === 'salt' || supply.kind === 'concentrate') return getSalt(supply.saltId)?.name ?? supply.saltId;
  return supply.name;
}

/** Reads a stored supply (jsonb) back, refusing anything that is not one of the known shapes. */
export function readSupply(value: unknown): AnalyteSupply | null {
  if (!value || typeof value !== 'object') return null;
  const v = value as Record<string, unknown>;
  if ((v.kind === 'salt' || v.kind === 'concentrate') && typeof v.saltId === 'string' && getSalt(v.saltId)) {
    return { kind: v.kind, saltId: v.saltId };
  }
  if ((v.kind === 'as_measured' || v.kind === 'additive') && typeof v.name === 'string' && v.name.trim()) {
    return { kind: v.kind, name: v.name };
  }
  if (v.kind === 'salt_formula' && typeof v.name === 'string' && typeof v.formula === 'string' && typeof v.element === 'string') {
    return value as AnalyteSupply;
  }
  return null;
}
