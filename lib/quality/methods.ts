// Coating-thickness test methods by the ASTM numbers the trade uses. Pure; safe in the browser.
// Source: reference §8 (ASTM B568, B499, B244, B504, B487, B567 titles and use notes).
import type { ThicknessMethod } from '@/db/types/quality';

export type MethodInfo = { code: ThicknessMethod; name: string; destructive: boolean; note: string };

export const THICKNESS_METHODS: readonly MethodInfo[] = [
  { code: 'B568', name: 'X-ray fluorescence', destructive: false, note: 'Mass per area converted with the deposit density; the standard must match the coating.' },
  { code: 'B499', name: 'Magnetic', destructive: false, note: 'Non-magnetic coatings (zinc, copper, tin, chromium) on steel; not for nickel on steel.' },
  { code: 'B244', name: 'Eddy current', destructive: false, note: 'Non-conductive coatings on non-magnetic metals; generally not for metal on metal.' },
  { code: 'B504', name: 'Coulometric', destructive: true, note: 'Anodic stripping of a small spot; time is proportional to thickness.' },
  { code: 'B487', name: 'Cross section', destructive: true, note: 'Metallographic section under a microscope; the referee method.' },
  { code: 'B567', name: 'Beta backscatter', destructive: false, note: 'Mass per area; needs atomic-number contrast between coating and substrate.' },
];

export const METHOD_CODES = THICKNESS_METHODS.map((m) => m.code) as [ThicknessMethod, ...ThicknessMethod[]];

export function methodLabel(code: string): string {
  const m = THICKNESS_METHODS.find((x) => x.code === code);
  return m ? `ASTM ${m.code} (${m.name.toLowerCase()})` : code;
}

// Words instruments and people write for each method.
const ALIASES: Record<string, ThicknessMethod> = {
  xrf: 'B568',
  'x-ray': 'B568',
  'x-ray fluorescence': 'B568',
  magnetic: 'B499',
  'eddy current': 'B244',
  'eddy-current': 'B244',
  eddy: 'B244',
  coulometric: 'B504',
  'cross section': 'B487',
  'cross-section': 'B487',
  microscopic: 'B487',
  'beta backscatter': 'B567',
  beta: 'B567',
};

/** "ASTM B568-98", "b568", "XRF" → 'B568'; null when it names none of the methods. */
export function parseMethod(text: string): ThicknessMethod | null {
  const t = String(text ?? '').trim().toLowerCase();
  if (!t) return null;
  const code = /\bb\s?(\d{3})\b/.exec(t);
  if (code) {
    const c = `B${code[1]}` as ThicknessMethod;
    return METHOD_CODES.includes(c) ? c : null;
  }
  return ALIASES[t] ?? null;
}
