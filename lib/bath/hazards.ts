// Hazard tags for bath templates and the caution shown beside each. The wording is ours; every
// line defers to the safety data sheet, local codes and licensed practice (reference §12).
import type { CautionKind } from '@/components/ui/caution';

export type Hazard =
  | 'cyanide'
  | 'hexavalent_chromium'
  | 'strong_acid'
  | 'caustic'
  | 'oxidiser'
  | 'nickel'
  | 'hydrogen'
  | 'heat'
  | 'electrical';

export const HAZARD_CAUTIONS: Record<Hazard, string> = {
  cyanide:
    'Cyanide: acid turns it into hydrogen cyanide gas. Keep cyanide solutions, rinses and drains apart from every acid, keep the bath alkaline, and have the emergency plan the safety data sheet calls for.',
  hexavalent_chromium:
    'Hexavalent chromium: a carcinogen with a strict workplace exposure limit. Control mist, monitor exposure and follow the safety data sheet and the applicable regulations.',
  strong_acid:
    'Strong acid: add acid to water, never water to acid. Face shield, gloves and apron; eyewash and shower within reach.',
  caustic:
    'Caustic: burns skin and eyes and gets hot when dissolved. Face shield, gloves and apron; eyewash and shower within reach.',
  oxidiser: 'Strong oxidiser: keep away from organic material, solvents and reducing agents.',
  nickel: 'Nickel: a skin and breathing sensitiser; some nickel compounds cause cancer. Wear gloves and control mist.',
  hydrogen:
    'Hydrogen gas forms at the work: ventilate, avoid sparks at the bus bars, and remember the same hydrogen can embrittle hardened steel.',
  heat: 'Heated tank: risk of scalds and splashes; keep heater low-level cut-offs working.',
  electrical:
    'Rectifier current is low voltage but very high: bus-bar shorts burn. The mains side can kill: lock out before work, and take off rings and watches.',
};

/**
 * A bath template's hazard tags as the app's standard cautions. Nickel and oxidiser have a standard
 * caution's words too ("nickel"); oxidiser has none and is said in the template's own words.
 */
const CAUTION_OF: Partial<Record<Hazard, CautionKind>> = {
  cyanide: 'cyanide',
  hexavalent_chromium: 'hexavalent-chromium',
  strong_acid: 'acid',
  caustic: 'caustic',
  hydrogen: 'hydrogen',
  heat: 'heat',
  electrical: 'electrical',
  nickel: 'nickel',
};

export function cautionKindsOf(hazards: readonly Hazard[]): CautionKind[] {
  return [...new Set(hazards.map((h) => CAUTION_OF[h]).filter((k): k is CautionKind => !!k))];
}

export const GENERAL_CAUTION =
  'Defer to the safety data sheet, the customer specification, local codes and licensed practice.';

export function cautionsFor(hazards: readonly Hazard[]): string[] {
  return [...hazards.map((h) => HAZARD_CAUTIONS[h]), GENERAL_CAUTION];
}
