import { PlatingInputError } from './errors';

// Densities of common substrates, g/cm³, for weighing parts (barrel loads are sized by weight).
// Alloy densities vary with grade; these are typical values for estimating.
export const SUBSTRATES = {
  'carbon-steel': { name: 'Carbon steel', densityGPerCm3: 7.85, source: 'typical handbook value, from memory' },
  'stainless-304': { name: 'Stainless steel 304', densityGPerCm3: 8.0, source: 'typical data-sheet value, from memory' },
  brass: { name: 'Brass (cartridge, C260)', densityGPerCm3: 8.5, source: 'typical data-sheet value, from memory' },
  copper: { name: 'Copper', densityGPerCm3: 8.96, source: 'CRC Handbook (reference §1.2, S8/S9)' },
  aluminium: { name: 'Aluminium', densityGPerCm3: 2.7, source: 'CRC Handbook, from memory' },
  'zinc-die-cast': { name: 'Zinc die-casting alloy (Zamak 3)', densityGPerCm3: 6.6, source: 'typical data-sheet value, from memory' },
} as const;

export type SubstrateId = keyof typeof SUBSTRATES;

export function getSubstrate(id: string): (typeof SUBSTRATES)[SubstrateId] {
  if (!Object.prototype.hasOwnProperty.call(SUBSTRATES, id)) {
    throw new PlatingInputError(
      'substrate',
      `Unknown substrate "${id}". Known substrates: ${Object.keys(SUBSTRATES).join(', ')}.`,
    );
  }
  return SUBSTRATES[id as SubstrateId];
}
