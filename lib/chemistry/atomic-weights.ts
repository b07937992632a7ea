// Standard atomic weights, g/mol, for the elements that plating baths and their salts contain.
// Source: IUPAC/CIAAW standard atomic weights. Ni 58.6934 and Zn 65.38 per the 2007 report
// (Pure Appl. Chem. 81 (2009) 2131); Cd 112.414, Co 58.933194 and Au 196.966569 per the 2013 report
// (Pure Appl. Chem. 88 (2016) 265). Where IUPAC gives an interval (H, C, N, O, S, Cl, B) the
// conventional value from the same report is used. The remaining values are the current IUPAC
// values as recalled from memory (see ../shared/reference/plating-reference.md §1.2).
export const ATOMIC_WEIGHTS = {
  H: 1.008,
  B: 10.81,
  C: 12.011,
  N: 14.007,
  O: 15.999,
  F: 18.998403163,
  Na: 22.98976928,
  P: 30.973761998,
  S: 32.06,
  Cl: 35.45,
  K: 39.0983,
  Cr: 51.9961,
  Fe: 55.845,
  Co: 58.933194,
  Ni: 58.6934,
  Cu: 63.546,
  Zn: 65.38,
  Rh: 102.90549,
  Pd: 106.42,
  Ag: 107.8682,
  Cd: 112.414,
  In: 114.818,
  Sn: 118.71,
  I: 126.90447,
  Au: 196.966569,
  Pb: 207.2,
} as const;

export type ElementSymbol = keyof typeof ATOMIC_WEIGHTS;

export function isElementSymbol(s: string): s is ElementSymbol {
  return Object.prototype.hasOwnProperty.call(ATOMIC_WEIGHTS, s);
}
